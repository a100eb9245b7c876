import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { area, line } from 'd3-shape';
import { bandPath, bandPieces, drawIndices, seriesPath, seriesPieces } from './series-path';

// Reference: d3-shape's line and area (a general-purpose library from npm) at one decimal, over the same points.
const series = fc
  .array(fc.tuple(fc.double({ min: -1e4, max: 1e4, noNaN: true }), fc.double({ min: -1e4, max: 1e4, noNaN: true })), { minLength: 1, maxLength: 400 })
  .map((pts) => ({ xs: Float64Array.from(pts, (p) => p[0]), ys: Float64Array.from(pts, (p) => p[1]) }));
const toX = (v: number) => v * 0.37 + 12;
const toY = (v: number) => 200 - v * 0.013;

describe('series paths', () => {
  it('draws the same line as d3-shape at a tenth of a pixel, thinned or not', () => {
    fc.assert(
      fc.property(series, fc.integer({ min: 1, max: 300 }), ({ xs, ys }, columns) => {
        const indices = drawIndices(ys, columns);
        const reference = line<number>()
          .digits(1)
          .x((i) => toX(xs[i]))
          .y((i) => toY(ys[i]))(indices);
        // d3 closes a lone point ("Z"); one point draws nothing either way.
        fc.pre(indices.length > 1);
        expect(seriesPath(xs, ys, toX, toY, columns)).toBe(reference);
      }),
    );
  });

  it('draws the same band as d3-shape’s area: along the upper edge and back along the lower one', () => {
    fc.assert(
      fc.property(series, fc.integer({ min: 2, max: 300 }), ({ xs, ys }, columns) => {
        const upper = ys.map((v) => v + 50);
        const n = xs.length;
        const stride = Math.max(1, Math.floor(n / Math.max(2, columns)));
        const indices: number[] = [];
        for (let i = 0; i < n; i += stride) indices.push(i);
        if (indices[indices.length - 1] !== n - 1) indices.push(n - 1);
        fc.pre(indices.length > 1);
        const reference = area<number>()
          .digits(1)
          .x((i) => toX(xs[i]))
          .y0((i) => toY(ys[i]))
          .y1((i) => toY(upper[i]))(indices);
        expect(bandPath(xs, ys, upper, toX, toY, columns)).toBe(reference);
      }),
    );
  });

  // Pieced paths (PIECE_PX): what a drag repaints. Checked against the whole path above, so against d3-shape.
  /** Increasing times with values: the shape of a result's history. */
  const history = (maxLength: number) =>
    fc
      .array(fc.tuple(fc.double({ min: 0.01, max: 50, noNaN: true }), fc.double({ min: -1e4, max: 1e4, noNaN: true })), { minLength: 2, maxLength })
      .map((pts) => {
        let t = 0;
        return { xs: Float64Array.from(pts, (p) => (t += p[0])), ys: Float64Array.from(pts, (p) => p[1]) };
      });
  /** The points of a path's text, in order ("M1,2L3,4" → ["1,2", "3,4"]). */
  const points = (d: string) => d.replace(/Z$/, '').split(/[ML]/).filter(Boolean);
  /** No piece is thinned: each holds (with the point it starts from) fewer than two points per pixel column. */
  const unthinned = (xs: Float64Array, piecePx: number) => {
    const perPiece = new Map<number, number>();
    for (const x of xs) perPiece.set(Math.floor(toX(x) / piecePx), (perPiece.get(Math.floor(toX(x) / piecePx)) ?? 0) + 1);
    return [...perPiece.values()].every((n) => n + 1 < 2 * piecePx);
  };

  it('pieces join into the whole line: each starts where the one before ends', () => {
    fc.assert(
      fc.property(history(200), fc.integer({ min: 4, max: 200 }), ({ xs, ys }, piecePx) => {
        const pieces = seriesPieces(xs, ys, toX, toY, piecePx);
        const joined = pieces.flatMap((p, k) => (k === 0 ? points(p.d) : points(p.d).slice(1)));
        for (let k = 1; k < pieces.length; k++) expect(points(pieces[k].d)[0]).toBe(points(pieces[k - 1].d).at(-1));
        // Unthinned, the pieces hold every point once.
        fc.pre(unthinned(xs, piecePx));
        expect(joined).toEqual(points(seriesPath(xs, ys, toX, toY, 1e6)));
      }),
    );
  });

  it('a change from one sample on leaves every piece before it as it was', () => {
    fc.assert(
      fc.property(history(300), fc.nat(), fc.double({ min: -50, max: 50, noNaN: true }), ({ xs, ys }, at, shift) => {
        const k = 1 + (at % (xs.length - 1));
        // A later dwell end: values and times from sample k on move, and the run grows by a sample.
        const xs2 = Float64Array.from([...xs, xs[xs.length - 1] + 5], (x, i) => (i >= k ? x + 3 : x));
        const ys2 = Float64Array.from([...ys, 0], (y, i) => (i >= k ? y + shift : y));
        const before = seriesPieces(xs, ys, toX, toY, 16);
        const after = new Map(seriesPieces(xs2, ys2, toX, toY, 16).map((p) => [p.key, p.d]));
        const editedPiece = Math.floor(toX(xs[k]) / 16);
        for (const p of before.filter((p) => p.key < editedPiece)) expect(after.get(p.key)).toBe(p.d);
        const bandBefore = bandPieces(xs, ys, ys.map((v) => v + 10), toX, toY, 16);
        const bandAfter = new Map(bandPieces(xs2, ys2, ys2.map((v) => v + 10), toX, toY, 16).map((p) => [p.key, p.d]));
        for (const p of bandBefore.filter((p) => p.key < editedPiece)) expect(bandAfter.get(p.key)).toBe(p.d);
      }),
    );
  });

  it('thinned pieces keep the highest and lowest point of the series', () => {
    fc.assert(
      fc.property(history(3000), fc.integer({ min: 1, max: 8 }), ({ xs, ys }, piecePx) => {
        const drawn = new Set(seriesPieces(xs, ys, toX, toY, piecePx).flatMap((p) => points(p.d)));
        const at = (i: number) => points(seriesPath(xs.subarray(i, i + 1), ys.subarray(i, i + 1), toX, toY, 1))[0];
        const hi = ys.indexOf(Math.max(...ys));
        const lo = ys.indexOf(Math.min(...ys));
        expect(drawn.has(at(hi))).toBe(true);
        expect(drawn.has(at(lo))).toBe(true);
      }),
    );
  });

  it('band pieces are closed and, unthinned, run along the same upper edge as the whole band', () => {
    fc.assert(
      fc.property(history(200), fc.integer({ min: 4, max: 200 }), ({ xs, ys }, piecePx) => {
        const upper = ys.map((v) => v + 50);
        const pieces = bandPieces(xs, ys, upper, toX, toY, piecePx);
        for (const p of pieces) expect(p.d.endsWith('Z')).toBe(true);
        // Upper edge: the first half of each piece's points (it goes along the upper edge, then back along the lower).
        const upperOf = (d: string) => points(d).slice(0, points(d).length / 2);
        const joined = pieces.flatMap((p, k) => (k === 0 ? upperOf(p.d) : upperOf(p.d).slice(1)));
        fc.pre(unthinned(xs, piecePx));
        expect(joined).toEqual(upperOf(bandPath(xs, ys, upper, toX, toY, 1e6)));
      }),
    );
  });
});
