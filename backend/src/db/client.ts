import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import * as schema from './schema';

export type Db = BetterSQLite3Database<typeof schema> & { $client: Database.Database };

const migrationsFolder = fileURLToPath(new URL('../../../drizzle', import.meta.url));

/**
 * Opens (creating if needed) the SQLite file, sets WAL and foreign keys, and applies every
 * committed migration. One handle per process; tests open one per temporary data folder.
 */
export function openDatabase(file: string): Db {
  if (file !== ':memory:') mkdirSync(path.dirname(file), { recursive: true });
  const sqlite = new Database(file);
  sqlite.pragma('journal_mode = WAL');
  // Readers and the job runner share the file; wait instead of failing on a brief lock.
  sqlite.pragma('busy_timeout = 5000');
  const db = drizzle(sqlite, { schema, casing: 'snake_case' }) as Db;
  // A migration that changes a column's type rebuilds its table (copy, drop, rename). Foreign
  // keys must be off for that, and the pragma is ignored inside the migrator's transaction, so it
  // is set around it; the references are then checked before anything else runs (SQLite's own
  // procedure for schema changes, sqlite.org/lang_altertable.html §7).
  sqlite.pragma('foreign_keys = OFF');
  migrate(db, { migrationsFolder });
  const broken = sqlite.pragma('foreign_key_check') as unknown[];
  if (broken.length > 0) throw new Error(`The database has ${broken.length} broken references after its migrations: ${JSON.stringify(broken.slice(0, 3))}.`);
  sqlite.pragma('foreign_keys = ON');
  return db;
}
