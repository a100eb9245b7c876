import { describe, expect, it } from 'vitest';
import { createSolveScheduler, type SolveAccuracy } from './solve-scheduler';

/** A hand-driven frame clock and solver: each solve returns a promise the test settles. */
function harness(extra: { cancelAfterMs?: number; withCancel?: boolean; leading?: boolean } = {}) {
  const frames: (() => void)[] = [];
  const calls: { params: number; accuracy: SolveAccuracy; resolve: (r: string) => void; reject: (e: unknown) => void }[] = [];
  const delivered: { result: string; params: number; tag: number; accuracy: SolveAccuracy }[] = [];
  const busyLog: boolean[] = [];
  const timers: (() => void)[] = [];
  let clock = 0;
  let cancels = 0;
  const scheduler = createSolveScheduler<number, string>({
    solve: (params, accuracy) =>
      new Promise<string>((resolve, reject) => {
        calls.push({ params, accuracy, resolve, reject });
      }),
    onResult: (result, params, tag, accuracy) => delivered.push({ result, params, tag, accuracy }),
    onBusy: (busy) => busyLog.push(busy),
    cancel: extra.withCancel ? () => (cancels += 1) : undefined,
    cancelAfterMs: extra.cancelAfterMs,
    leading: extra.leading,
    requestFrame: (cb) => frames.push(cb),
    now: () => clock,
    setTimer: (cb) => timers.push(cb),
    clearTimer: () => undefined,
  });
  return {
    scheduler,
    calls,
    delivered,
    busyLog,
    advance: (ms: number) => (clock += ms),
    cancels: () => cancels,
    flushFrame: () => frames.splice(0).forEach((cb) => cb()),
    fireTimers: () => timers.splice(0).forEach((cb) => cb()),
    settle: () => new Promise((r) => setTimeout(r, 0)),
  };
}

describe('solve scheduler', () => {
  it('coalesces requests made within one frame into one solve of the last params', () => {
    const h = harness();
    h.scheduler.request(1);
    h.scheduler.request(2);
    h.scheduler.request(3);
    expect(h.calls).toHaveLength(0);
    h.flushFrame();
    expect(h.calls.map((c) => c.params)).toEqual([3]);
  });

  it('drops the result of a request superseded while it was in flight and solves the newest next', async () => {
    const h = harness();
    h.scheduler.request(1, 101);
    h.flushFrame();
    h.scheduler.request(2, 102);
    h.flushFrame();
    h.scheduler.request(3, 103);
    h.flushFrame();
    // Only the first is running; 2 was replaced by 3 while waiting.
    expect(h.calls.map((c) => c.params)).toEqual([1]);
    h.calls[0].resolve('result-1');
    await h.settle();
    expect(h.delivered).toEqual([]);
    expect(h.calls.map((c) => c.params)).toEqual([1, 3]);
    h.calls[1].resolve('result-3');
    await h.settle();
    expect(h.delivered).toEqual([{ result: 'result-3', params: 3, tag: 103, accuracy: 'full' }]);
  });

  it('drops a result that arrives after a newer request was made but before its frame', async () => {
    const h = harness();
    h.scheduler.request(1);
    h.flushFrame();
    h.scheduler.request(2);
    h.calls[0].resolve('stale');
    await h.settle();
    expect(h.delivered).toEqual([]);
    h.flushFrame();
    h.calls[1].resolve('fresh');
    await h.settle();
    expect(h.delivered.map((d) => d.result)).toEqual(['fresh']);
  });

  it('reports busy only once a solve outlives the busy delay, and idle when done', async () => {
    const h = harness();
    h.scheduler.request(1);
    h.flushFrame();
    expect(h.busyLog).toEqual([]);
    h.fireTimers();
    expect(h.busyLog).toEqual([true]);
    h.calls[0].resolve('done');
    await h.settle();
    expect(h.busyLog).toEqual([true, false]);
  });

  it('cancels a long-running stale solve instead of waiting for it', () => {
    const h = harness({ withCancel: true, cancelAfterMs: 100 });
    h.scheduler.request(1);
    h.flushFrame();
    h.advance(150);
    h.scheduler.request(2);
    h.flushFrame();
    expect(h.cancels()).toBe(1);
    expect(h.calls.map((c) => c.params)).toEqual([1, 2]);
  });

  it('ignores the late settlement of a cancelled solve', async () => {
    const h = harness({ withCancel: true, cancelAfterMs: 100 });
    h.scheduler.request(1);
    h.flushFrame();
    h.advance(150);
    h.scheduler.request(2);
    h.flushFrame();
    h.calls[0].resolve('from-cancelled');
    await h.settle();
    expect(h.delivered).toEqual([]);
    h.calls[1].resolve('fresh');
    await h.settle();
    expect(h.delivered.map((d) => d.result)).toEqual(['fresh']);
  });

  it('never cancels the solve that replaced a cancelled one, so a long drag still gets answers', () => {
    const h = harness({ withCancel: true, cancelAfterMs: 100 });
    h.scheduler.request(1);
    h.flushFrame();
    h.advance(150);
    h.scheduler.request(2);
    h.flushFrame();
    h.advance(150);
    h.scheduler.request(3);
    h.flushFrame();
    expect(h.cancels()).toBe(1);
    expect(h.calls.map((c) => c.params)).toEqual([1, 2]);
  });

  it('with leading starts an idle request at once, then coalesces the rest of the burst into the next frame', async () => {
    const h = harness({ leading: true });
    h.scheduler.request(1);
    expect(h.calls.map((c) => c.params)).toEqual([1]);
    h.scheduler.request(2);
    h.scheduler.request(3);
    expect(h.calls.map((c) => c.params)).toEqual([1]);
    h.flushFrame();
    h.calls[0].resolve('stale');
    await h.settle();
    expect(h.delivered).toEqual([]);
    expect(h.calls.map((c) => c.params)).toEqual([1, 3]);
  });

  it('with leading still waits for a frame when a solve started less than a frame ago', async () => {
    const h = harness({ leading: true });
    h.scheduler.request(1);
    h.calls[0].resolve('one');
    await h.settle();
    h.advance(5);
    h.scheduler.request(2);
    expect(h.calls).toHaveLength(1);
    h.flushFrame();
    expect(h.calls.map((c) => c.params)).toEqual([1, 2]);
  });
});

describe('solve scheduler, quick look while dragging', () => {
  const solved = (h: ReturnType<typeof harness>) => h.calls.map((c) => `${c.params}:${c.accuracy}`);
  const shown = (h: ReturnType<typeof harness>) => h.delivered.map((d) => `${d.result}:${d.accuracy}`);

  it('solves drag steps as previews and, once the drag ends, the last params again at full accuracy with the same tag', async () => {
    const h = harness({ leading: true });
    h.scheduler.request(1, 11, 'preview');
    h.calls[0].resolve('p1');
    await h.settle();
    h.advance(20);
    h.scheduler.request(2, 12, 'preview');
    h.calls[1].resolve('p2');
    await h.settle();
    h.advance(20);
    h.scheduler.endPreview();
    expect(solved(h)).toEqual(['1:preview', '2:preview', '2:full']);
    h.calls[2].resolve('f2');
    await h.settle();
    expect(shown(h)).toEqual(['p1:preview', 'p2:preview', 'f2:full']);
    expect(h.delivered[2]).toMatchObject({ params: 2, tag: 12 });
  });

  it('never delivers a preview still running when the drag ends: the full answer is the last word', async () => {
    const h = harness({ leading: true });
    h.scheduler.request(1, 11, 'preview');
    h.advance(20);
    h.scheduler.endPreview();
    h.flushFrame();
    // The preview finishes after the full one was asked for: dropped, and the full solve starts.
    h.calls[0].resolve('late-preview');
    await h.settle();
    expect(solved(h)).toEqual(['1:preview', '1:full']);
    h.calls[1].resolve('full');
    await h.settle();
    expect(shown(h)).toEqual(['full:full']);
  });

  it('a cancelled preview of older params that settles after the full answer is ignored', async () => {
    const h = harness({ withCancel: true, cancelAfterMs: 100 });
    h.scheduler.request(1, 11, 'preview');
    h.flushFrame();
    h.scheduler.request(2, 12, 'preview');
    h.scheduler.endPreview();
    h.advance(150);
    h.flushFrame();
    expect(h.cancels()).toBe(1);
    expect(solved(h)).toEqual(['1:preview', '2:full']);
    h.calls[1].resolve('full-2');
    await h.settle();
    h.calls[0].resolve('preview-1');
    await h.settle();
    expect(shown(h)).toEqual(['full-2:full']);
  });

  it('a preview waiting for its frame when the drag ends is never solved; only the full one is', async () => {
    const h = harness();
    h.scheduler.request(1, 11, 'preview');
    h.scheduler.endPreview();
    h.flushFrame();
    expect(solved(h)).toEqual(['1:full']);
  });

  it('ending a drag that changed nothing, or ending it twice, solves nothing more', async () => {
    const h = harness({ leading: true });
    h.scheduler.request(1, 11);
    h.calls[0].resolve('f1');
    await h.settle();
    h.advance(20);
    h.scheduler.endPreview();
    expect(solved(h)).toEqual(['1:full']);
    h.scheduler.request(2, 12, 'preview');
    h.calls[1].resolve('p2');
    await h.settle();
    h.advance(20);
    h.scheduler.endPreview();
    h.scheduler.endPreview();
    expect(solved(h)).toEqual(['1:full', '2:preview', '2:full']);
  });

  it('latest wins across accuracies: a new drag step after the full request replaces it', async () => {
    const h = harness();
    h.scheduler.request(1, 11, 'preview');
    h.flushFrame();
    h.scheduler.endPreview();
    h.scheduler.request(2, 12, 'preview');
    h.flushFrame();
    h.calls[0].resolve('p1');
    await h.settle();
    expect(solved(h)).toEqual(['1:preview', '2:preview']);
    h.calls[1].resolve('p2');
    await h.settle();
    expect(shown(h)).toEqual(['p2:preview']);
  });
});
