/**
 * Latest-wins scheduling of solves on the worker.
 *
 * - Requests are coalesced to one per animation frame (a drag fires many
 *   pointer events per frame; only the last one matters). With `leading`, a
 *   request that finds the scheduler idle, and no solve started within the
 *   last frame, starts at once instead of waiting up to a frame.
 * - At most one solve runs at a time. A request made while one is in flight
 *   waits as the single pending request; an even newer one replaces it.
 * - A result is delivered only if no newer request exists by the time it
 *   arrives; stale results are dropped, never drawn.
 * - A solve that outlives `cancelAfterMs` while a newer request waits is
 *   cancelled through `cancel` (the bridge terminates the worker) so a slow
 *   study cannot hold the screen behind an outdated answer. The solve started
 *   in its place is never cancelled, so a continuous drag on a slow study
 *   still shows an answer after at most two solves instead of starving.
 * - `onBusy(true)` fires only when a solve has taken longer than `busyAfterMs`
 *   (about a frame), so quick solves never flash an indicator.
 * - Each request carries an accuracy: 'preview' for a quick look while a
 *   handle is dragged, 'full' otherwise. `endPreview()` (the drag ended) asks
 *   for a full solve of the latest params when the latest request was a
 *   preview. Latest wins across both: a preview still running or waiting when
 *   the full one is asked for is never delivered, so a preview of older
 *   params can never replace the full answer.
 */

import type { SolveAccuracy } from '../workers/solver-api';

export type { SolveAccuracy };

export type SolveSchedulerOptions<P, R> = {
  solve: (params: P, accuracy: SolveAccuracy) => Promise<R>;
  onResult: (result: R, params: P, tag: number, accuracy: SolveAccuracy) => void;
  onError?: (error: unknown, params: P) => void;
  onBusy?: (busy: boolean) => void;
  /** Terminates the running solve; the next `solve` call must work afterwards. */
  cancel?: () => void;
  busyAfterMs?: number;
  cancelAfterMs?: number;
  /** start at once when idle (still at most one start per `frameMs`) */
  leading?: boolean;
  frameMs?: number;
  requestFrame?: (callback: () => void) => unknown;
  now?: () => number;
  setTimer?: (callback: () => void, ms: number) => unknown;
  clearTimer?: (handle: unknown) => void;
};

export type SolveScheduler<P> = {
  /** Ask for a solve of `params`; `tag` travels with it to `onResult` (e.g. an input sequence number). */
  request: (params: P, tag?: number, accuracy?: SolveAccuracy) => void;
  /** The quick look is over: if the latest request was a preview, solve its params again at full accuracy. */
  endPreview: () => void;
  /** Forget pending work and drop whatever is in flight. */
  dispose: () => void;
  readonly inFlight: boolean;
};

type Job<P> = { id: number; params: P; tag: number; accuracy: SolveAccuracy };

export function createSolveScheduler<P, R>(options: SolveSchedulerOptions<P, R>): SolveScheduler<P> {
  const busyAfterMs = options.busyAfterMs ?? 16;
  const cancelAfterMs = options.cancelAfterMs ?? 1000;
  const requestFrame = options.requestFrame ?? ((cb: () => void) => requestAnimationFrame(() => cb()));
  const now = options.now ?? (() => performance.now());
  const setTimer = options.setTimer ?? ((cb: () => void, ms: number) => setTimeout(cb, ms));
  const clearTimer = options.clearTimer ?? ((h: unknown) => clearTimeout(h as ReturnType<typeof setTimeout>));

  let latestId = 0;
  let latest: Job<P> | null = null;
  let frameQueued = false;
  let queued: Job<P> | null = null; // waiting for the next frame
  let pending: Job<P> | null = null; // waiting for the running solve to end
  let running: { job: Job<P>; startedAt: number; replacedCancelled: boolean } | null = null;
  let lastStartAt = -Infinity;
  let busy = false;
  let busyTimer: unknown = null;
  let disposed = false;

  function setBusy(next: boolean) {
    if (busy === next) return;
    busy = next;
    options.onBusy?.(next);
  }

  function armBusyTimer() {
    if (busyTimer !== null) return;
    busyTimer = setTimer(() => {
      busyTimer = null;
      if (running) setBusy(true);
    }, busyAfterMs);
  }

  function settleIdle() {
    if (busyTimer !== null) {
      clearTimer(busyTimer);
      busyTimer = null;
    }
    setBusy(false);
  }

  function start(job: Job<P>, replacedCancelled = false) {
    lastStartAt = now();
    running = { job, startedAt: lastStartAt, replacedCancelled };
    armBusyTimer();
    let promise: Promise<R>;
    try {
      promise = options.solve(job.params, job.accuracy);
    } catch (error) {
      promise = Promise.reject(error);
    }
    promise.then(
      (result) => finish(job, () => options.onResult(result, job.params, job.tag, job.accuracy)),
      (error) => finish(job, () => options.onError?.(error, job.params)),
    );
  }

  function finish(job: Job<P>, deliver: () => void) {
    // A cancelled job may still settle (with an error); it no longer owns the slot.
    if (disposed || running?.job !== job) return;
    running = null;
    if (job.id === latestId) deliver();
    if (pending) {
      const next = pending;
      pending = null;
      start(next);
    } else {
      settleIdle();
    }
  }

  function onFrame() {
    frameQueued = false;
    if (disposed || !queued) return;
    const job = queued;
    queued = null;
    if (!running) {
      start(job);
      return;
    }
    pending = job;
    if (options.cancel && !running.replacedCancelled && now() - running.startedAt > cancelAfterMs) {
      options.cancel();
      running = null;
      pending = null;
      start(job, true);
    }
  }

  function request(params: P, tag = 0, accuracy: SolveAccuracy = 'full') {
    if (disposed) return;
    latestId += 1;
    const job = { id: latestId, params, tag, accuracy };
    latest = job;
    // Anything waiting is superseded now, even before the frame fires.
    pending = null;
    if (options.leading && !running && !frameQueued && now() - lastStartAt >= (options.frameMs ?? 16)) {
      queued = null;
      start(job);
      return;
    }
    queued = job;
    if (!frameQueued) {
      frameQueued = true;
      requestFrame(onFrame);
    }
  }

  return {
    request,
    endPreview() {
      if (latest?.accuracy === 'preview') request(latest.params, latest.tag, 'full');
    },
    dispose() {
      disposed = true;
      queued = null;
      pending = null;
      running = null;
      settleIdle();
    },
    get inFlight() {
      return running !== null;
    },
  };
}
