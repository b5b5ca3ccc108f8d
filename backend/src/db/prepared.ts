import type { Db } from './client';

/**
 * A query prepared once per database handle and reused. Drizzle builds a query's SQL from its
 * builder and has SQLite compile it on every call (≈ 320 µs on a loaded two-core host); a
 * prepared one only binds its placeholders (≈ 15 µs). Worth it on paths every request takes —
 * the session, the access check — and on the inspection screen's reads (issue 13's load
 * benchmark); elsewhere the builder's clarity wins.
 */
export function preparedQuery<P>(build: (db: Db) => P): (db: Db) => P {
  const byDb = new WeakMap<Db, P>();
  return (db) => {
    let query = byDb.get(db);
    if (query === undefined) {
      query = build(db);
      byDb.set(db, query);
    }
    return query;
  };
}
