/**
 * Input-to-paint timing. Every edit marks an input; when the charts have
 * committed the result that includes it and the next frame has been drawn,
 * one `dwellform:input-to-paint` measure per input is recorded, its detail
 * saying whether that paint showed a preview or a full solve. The bench
 * (bench/ui.ts) reads these measures from the page.
 */

import type { SolveAccuracy } from '../../../lib/solve-scheduler';

export const INPUT_TO_PAINT = 'dwellform:input-to-paint';
/** Round trip of one solve through the worker, from the page's side; detail: { accuracy, workerMs }. */
export const SOLVE_MEASURE = 'dwellform:solve';
/** From a result's arrival to the charts' commit (React render of every chart). */
export const RENDER_MEASURE = 'dwellform:render';

let resultArrivedAt: number | null = null;

/** Call as a result is handed to the store. */
export function markResultArrived(): void {
  if (hasPerformance()) resultArrivedAt = performance.now();
}

/** Call in the layout effect that follows the charts' commit. */
export function measureRendered(): void {
  if (!hasPerformance() || resultArrivedAt === null) return;
  performance.measure(RENDER_MEASURE, { start: resultArrivedAt, end: performance.now() });
  resultArrivedAt = null;
}

type OpenInput = { seq: number; t: number };

let seq = 0;
let open: OpenInput[] = [];
const MAX_OPEN = 500;

const hasPerformance = () => typeof performance !== 'undefined' && typeof performance.measure === 'function';

/**
 * Call when an input is taken in; returns its sequence number. `at` is when the input happened (an event's
 * timeStamp: the measure then includes the time the event waited and its handling); default now. A time on
 * another clock (jsdom stamps events with the wall clock) is not used.
 */
export function markInput(at?: number): number {
  seq += 1;
  if (hasPerformance()) {
    const now = performance.now();
    open.push({ seq, t: at !== undefined && at <= now ? at : now });
    if (open.length > MAX_OPEN) open = open.slice(-MAX_OPEN);
  }
  return seq;
}

/** Inputs up to `tag` will never be painted (invalid study, solve error): forget them. */
export function discardInputs(tag: number): void {
  open = open.filter((o) => o.seq > tag);
}

/** Call after the charts committed a result for inputs up to `tag`; measures once the next frame is drawn. */
export function measurePainted(tag: number, accuracy: SolveAccuracy): void {
  if (!hasPerformance() || open.length === 0 || typeof requestAnimationFrame !== 'function') return;
  requestAnimationFrame(() => {
    const end = performance.now();
    const done = open.filter((o) => o.seq <= tag);
    open = open.filter((o) => o.seq > tag);
    for (const o of done) performance.measure(INPUT_TO_PAINT, { start: o.t, end, detail: { accuracy } });
  });
}
