/**
 * A small in-process cache whose entries expire within `ttlMs` (at a random point of its second
 * half, so that entries filled together do not all expire together and come back as one burst of
 * queries); the oldest entry goes first when it is full. For lookups that a busy ingest repeats many
 * times a second and that may lag a change by a few seconds.
 */
export function createTtlCache<K, V>(ttlMs: number, maxEntries = 10_000) {
  const entries = new Map<K, { value: V; expires: number }>();
  return {
    get(key: K): V | undefined {
      const entry = entries.get(key);
      if (!entry) return undefined;
      if (entry.expires > Date.now()) return entry.value;
      entries.delete(key);
      return undefined;
    },
    set(key: K, value: V): void {
      if (entries.size >= maxEntries && !entries.has(key)) entries.delete(entries.keys().next().value as K);
      entries.set(key, { value, expires: Date.now() + ttlMs * (1 - Math.random() / 2) });
    },
    delete: (key: K) => entries.delete(key),
    clear: () => entries.clear(),
  };
}

export type TtlCache<K, V> = ReturnType<typeof createTtlCache<K, V>>;
