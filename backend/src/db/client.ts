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
 * Opens (creating if needed) the SQLite file, checks it (`PRAGMA integrity_check`), sets WAL and
 * foreign keys, and applies every committed migration. One handle per process; tests open one per temporary data folder.
 */
export function openDatabase(file: string): Db {
  if (file !== ':memory:') mkdirSync(path.dirname(file), { recursive: true });
  const sqlite = openChecked(file);
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

/** The database file is damaged; nothing was changed in it. */
export class DatabaseIntegrityError extends Error {
  constructor(file: string, problems: string[]) {
    const shown = problems.slice(0, 5).map((p) => `  ${p}`);
    if (problems.length > 5) shown.push(`  … and ${problems.length - 5} more`);
    super(
      [
        `The database ${file} failed its integrity check (PRAGMA integrity_check):`,
        ...shown,
        'Redward will not start on a damaged database, so that nothing is written on top of the damage.',
        'Keep this file for inspection, then restore the latest backup into an empty DATA_DIR with `npm run restore -- <backup>` (README, "Backups").',
      ].join('\n'),
    );
    this.name = 'DatabaseIntegrityError';
  }
}

/**
 * Opens the file and runs the full integrity check before anything (a migration, a job) writes to
 * it. The check reads every page (and cross-checks every index), so it costs one full read of the
 * file at start.
 */
function openChecked(file: string): Database.Database {
  let sqlite: Database.Database | undefined;
  try {
    sqlite = new Database(file);
    const rows = sqlite.pragma('integrity_check') as { integrity_check: string }[];
    const problems = rows.map((r) => r.integrity_check).filter((p) => p !== 'ok');
    if (problems.length > 0) throw new DatabaseIntegrityError(file, problems);
    return sqlite;
  } catch (err) {
    sqlite?.close();
    if (err instanceof DatabaseIntegrityError) throw err;
    // A file that is not a database at all, or too damaged to read its header.
    const code = (err as { code?: string }).code;
    if (code === 'SQLITE_CORRUPT' || code === 'SQLITE_NOTADB') throw new DatabaseIntegrityError(file, [(err as Error).message]);
    throw err;
  }
}
