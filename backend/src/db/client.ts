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
  sqlite.pragma('foreign_keys = ON');
  // Readers and the job runner share the file; wait instead of failing on a brief lock.
  sqlite.pragma('busy_timeout = 5000');
  const db = drizzle(sqlite, { schema, casing: 'snake_case' }) as Db;
  migrate(db, { migrationsFolder });
  return db;
}
