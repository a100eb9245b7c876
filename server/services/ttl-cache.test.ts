import { describe, expect, it } from 'vitest';
import { ttlCache } from './ttl-cache';

/** A load the test finishes by hand, so a change can land while it runs. */
function pendingLoad<V>() {
  let finish!: (value: V) => void;
  let calls = 0;
  const promise = new Promise<V>((resolve) => (finish = resolve));
  return {
    load: () => {
      calls++;
      return promise;
    },
    finish: (value: V) => finish(value),
    calls: () => calls,
  };
}

describe('ttlCache', () => {
  it('runs one load for callers that miss at the same time', async () => {
    const cache = ttlCache<string, number>(60_000);
    const slow = pendingLoad<number>();
    const waiting = Array.from({ length: 5 }, () => cache.getOrLoad('k', slow.load));
    slow.finish(7);
    expect(await Promise.all(waiting)).toEqual([7, 7, 7, 7, 7]);
    expect(slow.calls()).toBe(1);
    expect(await cache.getOrLoad('k', () => Promise.resolve(8))).toBe(7);
  });

  it('does not store what a load read before a delete that landed while it ran', async () => {
    const cache = ttlCache<string, string>(60_000);
    const slow = pendingLoad<string>();
    const early = cache.getOrLoad('k', slow.load);
    cache.delete('k'); // the write this load may have missed
    const late = cache.getOrLoad('k', () => Promise.resolve('new'));
    slow.finish('old');
    expect(await early).toBe('old'); // its caller asked before the change
    expect(await late).toBe('new'); // a caller after the change does not join the old load
    expect(cache.get('k')).toBe('new');
  });

  it('keeps a value set while an older load runs', async () => {
    const cache = ttlCache<string, string>(60_000);
    const slow = pendingLoad<string>();
    const early = cache.getOrLoad('k', slow.load);
    cache.set('k', 'written');
    slow.finish('old');
    await early;
    expect(cache.get('k')).toBe('written');
  });

  it('does not keep a failed load, and the next caller loads again', async () => {
    const cache = ttlCache<string, number>(60_000);
    await expect(cache.getOrLoad('k', () => Promise.reject(new Error('db down')))).rejects.toThrow('db down');
    expect(await cache.getOrLoad('k', () => Promise.resolve(3))).toBe(3);
  });

  it('forgets an entry after its time to live', async () => {
    const cache = ttlCache<string, number>(20);
    cache.set('k', 1);
    await new Promise((r) => setTimeout(r, 40));
    expect(cache.get('k')).toBeUndefined();
  });
});
