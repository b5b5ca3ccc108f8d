import type { Db } from './client';

/**
 * Queries whose SQL depends on a few choices (which filters are set, the sort), each prepared once
 * per database handle and shape and reused; the values are bound as placeholders. At most
 * `limit` shapes are kept per handle, the least recently used dropped first, so a caller trying
 * every combination cannot grow the cache. The same saving as `preparedQuery` (≈ 0.3 ms of
 * building and compiling per statement) for queries that are dynamic.
 */
export function preparedByShape<S, P>(limit: number, keyOf: (shape: S) => string, build: (db: Db, shape: S) => P): (db: Db, shape: S) => P {
  const byDb = new WeakMap<Db, Map<string, P>>();
  return (db, shape) => {
    let cache = byDb.get(db);
    if (cache === undefined) {
      cache = new Map();
      byDb.set(db, cache);
    }
    const key = keyOf(shape);
    let query = cache.get(key);
    if (query === undefined) {
      query = build(db, shape);
      if (cache.size >= limit) cache.delete(cache.keys().next().value!);
    } else {
      // Map keeps insertion order: re-inserting marks it as the most recently used.
      cache.delete(key);
    }
    cache.set(key, query);
    return query;
  };
}
