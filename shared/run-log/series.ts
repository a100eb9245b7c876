// Small numeric helpers over run-log series (time in s, values in SI; NaN marks a missing reading).

/** Middle value of a sample (NaN ignored); NaN for an empty sample. Sorts a copy. */
export function median(values: ArrayLike<number>): number {
  const finite: number[] = [];
  for (let i = 0; i < values.length; i++) if (Number.isFinite(values[i])) finite.push(values[i]);
  if (finite.length === 0) return NaN;
  const sorted = Float64Array.from(finite).sort();
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

/** Evenly strided sample of at most `max` indices from [0, n): keeps the statistics of huge logs cheap. */
export function strideOf(n: number, max: number): number {
  return Math.max(1, Math.ceil(n / max));
}

/**
 * Rate of change in units per minute over a forward window of `windowS` seconds: rate[i] is the slope from
 * sample i to the first sample at least `windowS` later (NaN where either reading is missing or the log
 * ends first). A window, not sample-to-sample differences, so logger jitter does not read as a rate.
 */
export function windowRatePerMin(timeS: Float64Array, values: Float64Array, windowS: number): Float64Array {
  const n = timeS.length;
  const rate = new Float64Array(n).fill(NaN);
  let j = 0;
  for (let i = 0; i < n; i++) {
    if (j <= i) j = i + 1;
    while (j < n && timeS[j] - timeS[i] < windowS) j++;
    if (j >= n) break;
    const dv = values[j] - values[i];
    if (Number.isFinite(dv)) rate[i] = (dv / (timeS[j] - timeS[i])) * 60;
  }
  return rate;
}

/** Per-row maximum and minimum over several channels (NaN where all are missing). */
export function envelope(channels: Float64Array[], n: number): { max: Float64Array; min: Float64Array } {
  const max = new Float64Array(n).fill(NaN);
  const min = new Float64Array(n).fill(NaN);
  for (const values of channels) {
    for (let i = 0; i < n; i++) {
      const v = values[i];
      if (!(v === v)) continue;
      if (!(max[i] >= v)) max[i] = v;
      if (!(min[i] <= v)) min[i] = v;
    }
  }
  return { max, min };
}

/** Linear interpolation of (xs, ys) at x, xs increasing; ends are held; NaN ys are skipped over. */
export function interpolate(xs: ArrayLike<number>, ys: ArrayLike<number>, x: number): number {
  const n = xs.length;
  if (n === 0) return NaN;
  let lo = 0;
  let hi = n - 1;
  if (x <= xs[0]) return firstFinite(ys, 0, 1);
  if (x >= xs[hi]) return firstFinite(ys, hi, -1);
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (xs[mid] <= x) lo = mid;
    else hi = mid;
  }
  // step outwards past missing readings
  while (lo > 0 && !Number.isFinite(ys[lo])) lo--;
  while (hi < n - 1 && !Number.isFinite(ys[hi])) hi++;
  const y0 = ys[lo];
  const y1 = ys[hi];
  if (!Number.isFinite(y0)) return y1;
  if (!Number.isFinite(y1)) return y0;
  return y0 + ((y1 - y0) * (x - xs[lo])) / (xs[hi] - xs[lo]);
}

function firstFinite(ys: ArrayLike<number>, from: number, step: 1 | -1): number {
  for (let i = from; i >= 0 && i < ys.length; i += step) if (Number.isFinite(ys[i])) return ys[i];
  return NaN;
}

/** A run of consecutive rows where a condition holds, with the row where it was worst. */
export interface Episode {
  start: number;
  end: number;
  worst: number;
}

/**
 * Runs of rows in [from, to) where `outside(i)` holds; `badness(i)` picks the worst row of each run.
 * Rows where the value is missing neither start nor end a run.
 */
export function episodes(from: number, to: number, outside: (i: number) => boolean, badness: (i: number) => number): Episode[] {
  const out: Episode[] = [];
  let current: Episode | null = null;
  for (let i = from; i < to; i++) {
    if (outside(i)) {
      if (!current) current = { start: i, end: i, worst: i };
      current.end = i;
      if (badness(i) > badness(current.worst)) current.worst = i;
    } else if (current) {
      out.push(current);
      current = null;
    }
  }
  if (current) out.push(current);
  return out;
}

/** Round for messages and stored findings: 4 significant figures is plenty for a trace. */
export const round = (v: number, digits = 4): number => Number(v.toPrecision(digits));
