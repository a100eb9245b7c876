type Numeric = ArrayLike<number>;

/**
 * Indices to draw for a series of `n` points on about `columns` pixels: every
 * point when it fits, else the first, the lowest and highest of each bucket
 * (in time order) and the last, so peaks such as an exotherm survive.
 * With `start` and `end`, the same for the points start…end (inclusive) only.
 */
export function drawIndices(ys: Numeric, columns: number, start = 0, end = ys.length - 1): number[] {
  const n = end - start + 1;
  const budget = Math.max(2, Math.floor(columns) * 2);
  if (n <= budget) return Array.from({ length: Math.max(0, n) }, (_, i) => start + i);
  const buckets = Math.floor(budget / 2);
  const size = n / buckets;
  const out: number[] = [start];
  for (let b = 0; b < buckets; b++) {
    const from = start + Math.floor(b * size);
    const to = start + Math.min(n, Math.floor((b + 1) * size));
    let lo = from;
    let hi = from;
    for (let i = from + 1; i < to; i++) {
      if (ys[i] < ys[lo]) lo = i;
      if (ys[i] > ys[hi]) hi = i;
    }
    if (lo <= hi) out.push(lo, hi);
    else out.push(hi, lo);
  }
  out.push(end);
  return out.filter((v, i, a) => i === 0 || v > a[i - 1]);
}

/**
 * A pixel coordinate as path text, to a tenth of a pixel (finer than a screen draws; short text parses fast).
 * Written from whole tenths: the same text as String(Math.round(v * 10) / 10), about twice as fast, since
 * turning a fraction into text is the slow part of building a path.
 */
function px(v: number): string {
  const r = Math.round(v * 10);
  if (!Number.isFinite(r)) return String(v);
  const a = r < 0 ? -r : r;
  const tenth = a % 10;
  return `${r < 0 ? '-' : ''}${(a - tenth) / 10}${tenth === 0 ? '' : `.${tenth}`}`;
}

/** The points at `indices` as path commands: `first` (M to start a path, L to go on) then L to each next. */
function polyline(
  indices: number[],
  xs: Numeric,
  ys: Numeric,
  toX: (v: number) => number,
  toY: (v: number) => number,
  first: 'M' | 'L',
): string {
  let d = '';
  for (let k = 0; k < indices.length; k++) {
    const i = indices[k];
    d += `${k === 0 ? first : 'L'}${px(toX(xs[i]))},${px(toY(ys[i]))}`;
  }
  return d;
}

/**
 * SVG path of ys against xs through pixel mappings ("M x,y L x,y …"). Written out directly rather than
 * through d3-shape's line: this runs for every series on every solve while a handle is dragged.
 */
export function seriesPath(
  xs: Numeric,
  ys: Numeric,
  toX: (v: number) => number,
  toY: (v: number) => number,
  columns: number,
): string {
  return polyline(drawIndices(ys, columns), xs, ys, toX, toY, 'M');
}

/**
 * SVG path of the band between two series: along the upper edge, back along the lower one, closed; every
 * stride-th point on about `columns` pixels. With `start` and `end`, over the points start…end (inclusive) only.
 */
export function bandPath(
  xs: Numeric,
  lower: Numeric,
  upper: Numeric,
  toX: (v: number) => number,
  toY: (v: number) => number,
  columns: number,
  start = 0,
  end = xs.length - 1,
): string {
  const n = end - start + 1;
  if (n <= 0) return '';
  const stride = Math.max(1, Math.floor(n / Math.max(2, columns)));
  const indices: number[] = [];
  for (let i = start; i <= end; i += stride) indices.push(i);
  if (indices[indices.length - 1] !== end) indices.push(end);
  const back = [...indices].reverse();
  return `${polyline(indices, xs, upper, toX, toY, 'M')}${polyline(back, xs, lower, toX, toY, 'L')}Z`;
}

/**
 * Width of one piece of a pieced path, px. A drag changes a result from the edited moment on; drawn in pieces
 * of this width, the curves before that moment keep their text, and the browser repaints only the pieces that
 * changed instead of every chart's whole width.
 */
export const PIECE_PX = 128;

/** One piece of a pieced path: `key` is the piece's place along the axis (stable from one result to the next). */
export type PathPiece = { key: number; d: string };

/**
 * The points cut into pieces by pixel column, each drawn by `draw(start, end)` (indices, inclusive): piece k
 * holds the points whose x falls in [k·piecePx, (k+1)·piecePx) and, to join it to the piece before, that
 * piece's last point. The text of a piece depends on its own points only.
 */
function pieces(xs: Numeric, toX: (v: number) => number, piecePx: number, draw: (start: number, end: number) => string): PathPiece[] {
  const ranges: { key: number; start: number; end: number }[] = [];
  for (let i = 0; i < xs.length; i++) {
    const key = Math.floor(toX(xs[i]) / piecePx);
    const last = ranges[ranges.length - 1];
    if (last && last.key === key) last.end = i;
    else ranges.push({ key, start: Math.max(0, i - 1), end: i });
  }
  return ranges.filter((r) => r.end > r.start).map(({ key, start, end }) => ({ key, d: draw(start, end) }));
}

/**
 * `seriesPath` in pieces of `piecePx` (see PIECE_PX); each piece thinned on its own columns. Drawn with round
 * caps, the pieces meet as one line. For solid lines: a dash pattern would start again in every piece.
 */
export function seriesPieces(
  xs: Numeric,
  ys: Numeric,
  toX: (v: number) => number,
  toY: (v: number) => number,
  piecePx = PIECE_PX,
): PathPiece[] {
  return pieces(xs, toX, piecePx, (start, end) => polyline(drawIndices(ys, piecePx, start, end), xs, ys, toX, toY, 'M'));
}

/** `bandPath` in pieces of `piecePx`, each closed on its own; neighbours share their edge. */
export function bandPieces(
  xs: Numeric,
  lower: Numeric,
  upper: Numeric,
  toX: (v: number) => number,
  toY: (v: number) => number,
  piecePx = PIECE_PX,
): PathPiece[] {
  return pieces(xs, toX, piecePx, (start, end) => bandPath(xs, lower, upper, toX, toY, piecePx, start, end));
}

/** Index of the last sample at or before `t` in an increasing array (0 before the start). */
export function indexAtOrBefore(times: Numeric, t: number): number {
  let lo = 0;
  let hi = times.length - 1;
  if (hi < 0 || t <= times[0]) return 0;
  if (t >= times[hi]) return hi;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (times[mid] <= t) lo = mid;
    else hi = mid;
  }
  return lo;
}
