import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { area, line } from 'd3-shape';
import { bandPath, drawIndices, seriesPath } from './series-path';

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
});
