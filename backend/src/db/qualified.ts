import { getTableName, sql, type SQL } from 'drizzle-orm';
import type { SQLiteColumn } from 'drizzle-orm/sqlite-core';

/**
 * A column written as "table"."column". Drizzle leaves columns unqualified inside `sql`
 * fragments of a select list, where a correlated subquery would then bind `"id"` to its own
 * table instead of the outer one; every correlated subquery uses this.
 */
export function qualified(column: SQLiteColumn): SQL {
  return sql.raw(`"${getTableName(column.table)}"."${column.name}"`);
}
