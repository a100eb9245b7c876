/**
 * A small in-process cache with a time-to-live and a size bound (oldest
 * entries go first). Used for the hot read path; every write path that can
 * change a cached value deletes it explicitly (model hooks), and the TTL only
 * bounds what another server process could still see.
 *
 * `getOrLoad` runs one load per key at a time: callers that miss while a load
 * is running wait for it, so an expired entry under load costs one query, not
 * one per waiting request. A load that overlaps a `set`, `delete` or `clear`
 * may have read the value from before that change; its result is returned to
 * its callers but never stored.
 */
export function ttlCache<K, V>(ttlMs: number, maxEntries = 10_000) {
  const entries = new Map<K, { value: V; until: number }>();
  const loading = new Map<K, Promise<V>>();
  let epoch = 0; // bumped by every change from outside a load
  const changed = () => {
    epoch++;
    loading.clear();
  };
  const put = (key: K, value: V) => {
    if (entries.size >= maxEntries) entries.delete(entries.keys().next().value as K);
    entries.set(key, { value, until: Date.now() + ttlMs });
  };
  const get = (key: K): V | undefined => {
    const hit = entries.get(key);
    if (!hit) return undefined;
    if (hit.until < Date.now()) {
      entries.delete(key);
      return undefined;
    }
    return hit.value;
  };
  return {
    get,
    set(key: K, value: V) {
      changed();
      put(key, value);
    },
    delete(key: K) {
      changed();
      return entries.delete(key);
    },
    clear() {
      changed();
      entries.clear();
    },
    getOrLoad(key: K, load: () => Promise<V>): Promise<V> {
      const hit = get(key);
      if (hit !== undefined) return Promise.resolve(hit);
      const running = loading.get(key);
      if (running) return running;
      const startedAt = epoch;
      const promise = load()
        .then((value) => {
          if (epoch === startedAt) put(key, value);
          return value;
        })
        .finally(() => {
          if (loading.get(key) === promise) loading.delete(key);
        });
      loading.set(key, promise);
      return promise;
    },
  };
}
