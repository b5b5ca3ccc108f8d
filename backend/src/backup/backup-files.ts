import { createHash } from 'node:crypto';
import { createReadStream, createWriteStream, mkdirSync, renameSync, rmSync } from 'node:fs';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import Database from 'better-sqlite3';
import { z } from 'zod';

/**
 * A backup is a folder:
 *
 *   manifest.json          what is in it, with the sha-256 and size of every file
 *   redward.sqlite         an online copy of the database (SQLite's backup API)
 *   uploads/<aa>/<sha256>  every stored upload the copied database refers to
 *
 * A folder (rather than one archive) can be checked, listed and copied off-site with rsync or any
 * file tool; the uploads in it are content-addressed and never change, so copying a new backup
 * next to an older one with rsync moves only the new files.
 */
export const MANIFEST_FILE = 'manifest.json';
export const DATABASE_FILE = 'redward.sqlite';

export const manifestSchema = z.object({
  format: z.literal('redward-backup'),
  formatVersion: z.literal(1),
  createdAt: z.string(),
  redwardVersion: z.string(),
  database: z.object({
    file: z.literal(DATABASE_FILE),
    sha256: z.string().regex(/^[0-9a-f]{64}$/),
    sizeBytes: z.number().int().nonnegative(),
    /** Rows per table at the moment of the copy; a restore must find the same. */
    tables: z.record(z.string(), z.number().int().nonnegative()),
  }),
  blobs: z.array(z.object({ sha256: z.string().regex(/^[0-9a-f]{64}$/), sizeBytes: z.number().int().nonnegative() })),
});
export type BackupManifest = z.infer<typeof manifestSchema>;

/** Where a blob lives below a root (the store's layout, DATA_DIR/uploads/<aa>/<sha256>). */
export const blobPath = (root: string, sha256: string) => path.join(root, sha256.slice(0, 2), sha256);

/**
 * Copies a file while hashing the bytes that were read, into `<to>.part` and then into place, so
 * a copy that stopped half-way never looks complete. Returns what was copied.
 */
export async function copyHashed(from: string, to: string): Promise<{ sha256: string; sizeBytes: number }> {
  mkdirSync(path.dirname(to), { recursive: true });
  const partial = `${to}.part`;
  const hash = createHash('sha256');
  let sizeBytes = 0;
  try {
    await pipeline(
      createReadStream(from),
      async function* (source: AsyncIterable<Buffer>) {
        for await (const chunk of source) {
          hash.update(chunk);
          sizeBytes += chunk.length;
          yield chunk;
        }
      },
      createWriteStream(partial, { flags: 'wx' }),
    );
  } catch (err) {
    rmSync(partial, { force: true });
    throw err;
  }
  renameSync(partial, to);
  return { sha256: hash.digest('hex'), sizeBytes };
}

/** Digest and size of a file, read as a stream. */
export async function hashFile(file: string): Promise<{ sha256: string; sizeBytes: number }> {
  const hash = createHash('sha256');
  let sizeBytes = 0;
  for await (const chunk of createReadStream(file) as AsyncIterable<Buffer>) {
    hash.update(chunk);
    sizeBytes += chunk.length;
  }
  return { sha256: hash.digest('hex'), sizeBytes };
}

/** Problems `PRAGMA integrity_check` finds (empty when the file is sound). */
export function integrityProblems(db: Database.Database): string[] {
  return (db.pragma('integrity_check') as { integrity_check: string }[]).map((r) => r.integrity_check).filter((p) => p !== 'ok');
}

/** Rows in every table of the database (SQLite's own tables left out). */
export function tableCounts(db: Database.Database): Record<string, number> {
  const names = db.prepare("select name from sqlite_master where type = 'table' and name not like 'sqlite_%' order by name").pluck().all() as string[];
  return Object.fromEntries(names.map((n) => [n, db.prepare(`select count(*) from "${n.replace(/"/g, '""')}"`).pluck().get() as number]));
}

/** The stored uploads a database refers to. */
export function storedBlobs(db: Database.Database): { sha256: string; sizeBytes: number }[] {
  return db.prepare('select sha256, size_bytes as sizeBytes from stored_files order by sha256').all() as { sha256: string; sizeBytes: number }[];
}

/** A list of problems as one readable sentence block (at most `max` named). */
export function listProblems(problems: string[], max = 10): string {
  const shown = problems.slice(0, max).map((p) => `  - ${p}`);
  if (problems.length > max) shown.push(`  … and ${problems.length - max} more`);
  return shown.join('\n');
}
