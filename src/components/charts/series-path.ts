type Numeric = ArrayLike<number>;

/**
 * Indices to draw for a series of `n` points on about `columns` pixels: every
 * point when it fits, else the first, the lowest and highest of each bucket
 * (in time order) and the last, so peaks such as an exotherm survive.
 */
export function drawIndices(ys: Numeric, columns: number): number[] {
  const n = ys.length;
  const budget = Math.max(2, Math.floor(columns) * 2);
  if (n <= budget) return Array.from({ length: n }, (_, i) => i);
  const buckets = Math.floor(budget / 2);
  const size = n / buckets;
  const out: number[] = [0];
  for (let b = 0; b < buckets; b++) {
    const from = Math.floor(b * size);
    const to = Math.min(n, Math.floor((b + 1) * size));
    let lo = from;
    let hi = from;
    for (let i = from + 1; i < to; i++) {
      if (ys[i] < ys[lo]) lo = i;
      if (ys[i] > ys[hi]) hi = i;
    }
    if (lo <= hi) out.push(lo, hi);
    else out.push(hi, lo);
  }
  out.push(n - 1);
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

/** SVG path of the band between two series: along the upper edge, back along the lower one, closed. */
export function bandPath(
  xs: Numeric,
  lower: Numeric,
  upper: Numeric,
  toX: (v: number) => number,
  toY: (v: number) => number,
  columns: number,
): string {
  const n = xs.length;
  if (n === 0) return '';
  const stride = Math.max(1, Math.floor(n / Math.max(2, columns)));
  const indices: number[] = [];
  for (let i = 0; i < n; i += stride) indices.push(i);
  if (indices[indices.length - 1] !== n - 1) indices.push(n - 1);
  const back = [...indices].reverse();
  return `${polyline(indices, xs, upper, toX, toY, 'M')}${polyline(back, xs, lower, toX, toY, 'L')}Z`;
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
