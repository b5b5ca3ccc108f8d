import { existsSync, mkdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import Database from 'better-sqlite3';
import {
  blobPath,
  copyHashed,
  DATABASE_FILE,
  hashFile,
  integrityProblems,
  listProblems,
  MANIFEST_FILE,
  storedBlobs,
  tableCounts,
  type BackupManifest,
} from './backup-files';

export interface BackupSource {
  /** The live database file (DATA_DIR/redward.sqlite). */
  databasePath: string;
  /** The upload store (DATA_DIR/uploads). */
  uploadsDir: string;
  redwardVersion: string;
}

export interface BackupSummary {
  target: string;
  blobs: number;
  blobBytes: number;
  databaseBytes: number;
  tables: Record<string, number>;
}

export class BackupError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'BackupError';
  }
}

/**
 * Backs up a Redward that may be running: the database through SQLite's online backup API (a
 * consistent copy while the server keeps writing), then every upload that copy refers to, each
 * hashed as it is copied. Writes into `<target>.partial` and renames it at the end, so a folder
 * named `target` is always a complete backup. Uploads that arrive during the backup belong to
 * rows the copy does not have, so they are rightly left for the next one.
 */
export async function takeBackup(source: BackupSource, target: string, now: () => Date = () => new Date()): Promise<BackupSummary> {
  const dest = path.resolve(target);
  if (existsSync(dest)) throw new BackupError(`${dest} already exists. Name a new folder for each backup (for example with the date in it).`);
  if (!existsSync(source.databasePath)) throw new BackupError(`There is no database at ${source.databasePath}. Is DATA_DIR right?`);
  const partial = `${dest}.partial`;
  if (existsSync(partial)) throw new BackupError(`${partial} is left from a backup that did not finish. Delete it, then run the backup again.`);
  mkdirSync(partial, { recursive: true });
  try {
    const live = new Database(source.databasePath, { fileMustExist: true });
    try {
      live.pragma('busy_timeout = 5000');
      await live.backup(path.join(partial, DATABASE_FILE));
    } finally {
      live.close();
    }

    const copy = new Database(path.join(partial, DATABASE_FILE), { readonly: true });
    let tables: Record<string, number>;
    let blobs: { sha256: string; sizeBytes: number }[];
    try {
      const damage = integrityProblems(copy);
      if (damage.length > 0) throw new BackupError(`The database copy failed its integrity check; the live database may be damaged:\n${listProblems(damage)}`);
      tables = tableCounts(copy);
      blobs = storedBlobs(copy);
    } finally {
      copy.close();
    }

    const problems: string[] = [];
    for (const blob of blobs) {
      const from = blobPath(source.uploadsDir, blob.sha256);
      if (!existsSync(from)) {
        problems.push(`${from} is missing`);
        continue;
      }
      const copied = await copyHashed(from, blobPath(path.join(partial, 'uploads'), blob.sha256));
      if (copied.sha256 !== blob.sha256 || copied.sizeBytes !== blob.sizeBytes) {
        problems.push(`${from} no longer holds what was uploaded (sha-256 ${copied.sha256}, ${copied.sizeBytes} bytes; expected ${blob.sizeBytes} bytes)`);
      }
    }
    if (problems.length > 0) {
      throw new BackupError(`${problems.length} stored upload(s) could not be backed up as they were received:\n${listProblems(problems)}\nThe backup was not kept. Restore these files from an earlier backup, or find out what changed them.`);
    }

    const database = await hashFile(path.join(partial, DATABASE_FILE));
    const manifest: BackupManifest = {
      format: 'redward-backup',
      formatVersion: 1,
      createdAt: now().toISOString(),
      redwardVersion: source.redwardVersion,
      database: { file: DATABASE_FILE, sha256: database.sha256, sizeBytes: database.sizeBytes, tables },
      blobs,
    };
    writeFileSync(path.join(partial, MANIFEST_FILE), JSON.stringify(manifest, null, 2) + '\n');
    renameSync(partial, dest);
    return { target: dest, blobs: blobs.length, blobBytes: blobs.reduce((s, b) => s + b.sizeBytes, 0), databaseBytes: database.sizeBytes, tables };
  } catch (err) {
    rmSync(partial, { recursive: true, force: true });
    throw err;
  }
}
