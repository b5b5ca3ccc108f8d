import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import Database from 'better-sqlite3';
import { blobPath, copyHashed, DATABASE_FILE, integrityProblems, listProblems, MANIFEST_FILE, manifestSchema, storedBlobs, tableCounts, type BackupManifest } from './backup-files';

export class RestoreError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'RestoreError';
  }
}

export interface RestoreSummary {
  dataDir: string;
  blobs: number;
  tables: Record<string, number>;
  backupCreatedAt: string;
}

/**
 * Restores a backup folder into an empty DATA_DIR: the database and every upload are copied and
 * hashed on the way, each hash checked against the manifest (and each upload against its own
 * name), then the restored database must pass `integrity_check`, hold the same rows per table as
 * when it was copied, and find every upload it refers to. On any problem everything restored is
 * removed again, so DATA_DIR is as empty as it was, and the error lists what is wrong.
 */
export async function restoreBackup(backupDir: string, dataDir: string): Promise<RestoreSummary> {
  const from = path.resolve(backupDir);
  const into = path.resolve(dataDir);
  const manifest = readManifest(from);

  const existed = existsSync(into);
  if (existed) {
    const present = readdirSync(into);
    if (present.length > 0) {
      throw new RestoreError(`${into} is not empty (it holds ${present.slice(0, 5).join(', ')}${present.length > 5 ? ', …' : ''}). Restore into an empty DATA_DIR; move the old one aside first.`);
    }
  }
  mkdirSync(into, { recursive: true });
  try {
    const problems: string[] = [];
    const dbCopy = await copyHashed(path.join(from, DATABASE_FILE), path.join(into, DATABASE_FILE));
    if (dbCopy.sha256 !== manifest.database.sha256 || dbCopy.sizeBytes !== manifest.database.sizeBytes) {
      problems.push(`${DATABASE_FILE} differs from the manifest (sha-256 ${dbCopy.sha256}, ${dbCopy.sizeBytes} bytes; expected ${manifest.database.sha256}, ${manifest.database.sizeBytes} bytes)`);
    }
    for (const blob of manifest.blobs) {
      const source = blobPath(path.join(from, 'uploads'), blob.sha256);
      if (!existsSync(source)) {
        problems.push(`uploads/${blob.sha256.slice(0, 2)}/${blob.sha256} is missing from the backup`);
        continue;
      }
      const copied = await copyHashed(source, blobPath(path.join(into, 'uploads'), blob.sha256));
      if (copied.sha256 !== blob.sha256 || copied.sizeBytes !== blob.sizeBytes) {
        problems.push(`uploads/${blob.sha256.slice(0, 2)}/${blob.sha256} has been changed (its bytes hash to ${copied.sha256}, ${copied.sizeBytes} bytes)`);
      }
    }
    if (problems.length === 0) problems.push(...checkDatabase(path.join(into, DATABASE_FILE), manifest));
    if (problems.length > 0) {
      throw new RestoreError(`The backup in ${from} failed its checks; nothing was restored:\n${listProblems(problems)}`);
    }
    return { dataDir: into, blobs: manifest.blobs.length, tables: manifest.database.tables, backupCreatedAt: manifest.createdAt };
  } catch (err) {
    // Leave DATA_DIR as it was found: empty (or absent).
    if (existed) for (const entry of readdirSync(into)) rmSync(path.join(into, entry), { recursive: true, force: true });
    else rmSync(into, { recursive: true, force: true });
    throw err;
  }
}

function readManifest(from: string): BackupManifest {
  const file = path.join(from, MANIFEST_FILE);
  if (!existsSync(file)) throw new RestoreError(`${from} is not a Redward backup: it has no ${MANIFEST_FILE}.`);
  let raw: unknown;
  try {
    raw = JSON.parse(readFileSync(file, 'utf8'));
  } catch (err) {
    throw new RestoreError(`${file} is not valid JSON (${(err as Error).message}).`);
  }
  const parsed = manifestSchema.safeParse(raw);
  if (!parsed.success) throw new RestoreError(`${file} is not a Redward backup manifest: ${parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}.`);
  return parsed.data;
}

/** The restored database: sound, with the rows it had when copied, and every upload it names present. */
function checkDatabase(file: string, manifest: BackupManifest): string[] {
  const db = new Database(file, { readonly: true });
  try {
    const damage = integrityProblems(db);
    if (damage.length > 0) return damage.map((d) => `integrity_check: ${d}`);
    const problems: string[] = [];
    const counts = tableCounts(db);
    for (const [table, expected] of Object.entries(manifest.database.tables)) {
      if (counts[table] !== expected) problems.push(`table ${table} has ${counts[table] ?? 'no'} rows; the backup recorded ${expected}`);
    }
    const listed = new Set(manifest.blobs.map((b) => b.sha256));
    const unlisted = storedBlobs(db).filter((b) => !listed.has(b.sha256));
    for (const b of unlisted) problems.push(`stored file ${b.sha256} is in the database but not in the backup`);
    return problems;
  } finally {
    db.close();
  }
}
