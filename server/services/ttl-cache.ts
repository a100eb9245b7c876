/**
 * A small in-process cache with a time-to-live and a size bound (oldest
 * entries go first). Used for the hot read path; every write path that can
 * change a cached value deletes it explicitly (model hooks), and the TTL only
 * bounds what another server process could still see.
 */
export function ttlCache<K, V>(ttlMs: number, maxEntries = 10_000) {
  const entries = new Map<K, { value: V; until: number }>();
  return {
    get(key: K): V | undefined {
      const hit = entries.get(key);
      if (!hit) return undefined;
      if (hit.until < Date.now()) {
        entries.delete(key);
        return undefined;
      }
      return hit.value;
    },
    set(key: K, value: V) {
      if (entries.size >= maxEntries) entries.delete(entries.keys().next().value as K);
      entries.set(key, { value, until: Date.now() + ttlMs });
    },
    delete: (key: K) => entries.delete(key),
    clear: () => entries.clear(),
    async getOrLoad(key: K, load: () => Promise<V>): Promise<V> {
      const hit = this.get(key);
      if (hit !== undefined) return hit;
      const value = await load();
      this.set(key, value);
      return value;
    },
  };
}
