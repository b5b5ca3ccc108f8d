import { createHash } from 'node:crypto';
import { closeSync, createReadStream, openSync, readSync, rmSync, statSync, writeSync } from 'node:fs';
import { Unzip, UnzipInflate, type UnzipFile } from 'fflate';
import type { BlobStore } from '../storage/blob-store';

export interface ArchiveLimits {
  /** Most entries (files) an archive may hold. */
  maxEntries: number;
  /** Most bytes all entries may expand to. */
  maxExpandedBytes: number;
  /** Most bytes one entry may expand to. */
  maxEntryBytes: number;
  /** Largest expanded ÷ compressed size accepted for the whole archive. */
  maxRatio: number;
}

export interface ExpandedEntry {
  /** Path inside the archive. */
  name: string;
  tempFile: string;
  sha256: string;
  sizeBytes: number;
}

/** Why an archive was refused as a whole; nothing from it is kept. */
export class ArchiveRefusedError extends Error {
  constructor(
    readonly code: 'archive_too_many_entries' | 'archive_too_large' | 'archive_ratio' | 'archive_entry_too_large' | 'archive_corrupt',
    message: string,
  ) {
    super(message);
    this.name = 'ArchiveRefusedError';
  }
}

/**
 * Compressed bytes handed to the unzipper at a time. fflate inflates a pushed slice whole and
 * emits it as one chunk, so this bounds the memory of one step: deflate cannot expand data more
 * than 1032:1 (RFC 1951: a 258-byte match costs at least 2 bits; from memory), 16 MB at most. It
 * also bounds the unzipper's recursion, one level per entry inside a slice: a 256 kB push of
 * 18-byte entries (≈ 3,000 of them) overflowed the stack.
 */
const PUSH_BYTES = 16 * 1024;
/** Inflated bytes allowed beyond maxRatio × the compressed bytes read so far (a very compressible first file). */
const RATIO_SLACK_BYTES = 16 * 1024 * 1024;

const mb = (bytes: number) =>
  bytes < 1024 * 1024 ? `${Math.max(1, Math.round(bytes / 1024))} kB` : `${(bytes / 1024 / 1024).toFixed(bytes < 10 * 1024 * 1024 ? 1 : 0)} MB`;

/**
 * Expands a zip archive entry by entry into temporary files of the store, streaming: neither
 * the archive nor an entry is ever held in memory whole, only one pushed slice (PUSH_BYTES) and
 * what it inflates to. Limits are checked on the bytes actually inflated, not on what the headers
 * claim, as they arrive: the running total may not pass maxRatio × the compressed bytes read so
 * far (plus RATIO_SLACK_BYTES), the whole archive's ratio, the expanded-size limit or the entry
 * limit, so a zip bomb is stopped within a few slices and every temporary file is removed. Directories and operating-system
 * clutter (`__MACOSX/`, `._*`, `.DS_Store`) are not entries.
 */
export async function expandArchive(zipPath: string, archiveName: string, store: BlobStore, limits: ArchiveLimits): Promise<ExpandedEntry[]> {
  const compressedBytes = Math.max(1, statSync(zipPath).size);
  const allowedExpanded = Math.min(limits.maxExpandedBytes, compressedBytes * limits.maxRatio);
  const entries: ExpandedEntry[] = [];
  const open: { fd: number; tempFile: string }[] = [];
  let expanded = 0;
  let refusal: ArchiveRefusedError | null = null;

  const refuse = (e: ArchiveRefusedError) => {
    refusal ??= e;
  };

  let seen = 0;
  const unzip = new Unzip((file: UnzipFile) => {
    seen += 1;
    if (refusal || isClutter(file.name)) return;
    if (entries.length + open.length >= limits.maxEntries) {
      refuse(new ArchiveRefusedError('archive_too_many_entries', `${archiveName} holds more than ${limits.maxEntries} files; split it into smaller archives.`));
      return;
    }
    const tempFile = store.tempPath();
    const fd = openSync(tempFile, 'wx');
    const handle = { fd, tempFile };
    open.push(handle);
    const hash = createHash('sha256');
    let size = 0;
    file.ondata = (err, chunk, final) => {
      if (refusal) return;
      if (err) {
        refuse(new ArchiveRefusedError('archive_corrupt', `${archiveName} is damaged at ${file.name}: ${err.message}.`));
        return;
      }
      size += chunk.length;
      expanded += chunk.length;
      // The running total against what has been read so far: a bomb is caught after its first
      // slices, not after the whole-archive allowance (hundreds of MB) has been inflated and written.
      if (expanded > limits.maxRatio * consumed + RATIO_SLACK_BYTES && expanded <= allowedExpanded) {
        refuse(new ArchiveRefusedError('archive_ratio', `${archiveName} expands more than ${limits.maxRatio} times its size (${mb(expanded)} from the first ${mb(consumed)}); it looks like a zip bomb and was refused.`));
        return;
      }
      if (size > limits.maxEntryBytes) {
        refuse(new ArchiveRefusedError('archive_entry_too_large', `${archiveName}: ${file.name} expands beyond the ${mb(limits.maxEntryBytes)} limit for one file.`));
        return;
      }
      if (expanded > allowedExpanded) {
        const byRatio = allowedExpanded < limits.maxExpandedBytes;
        refuse(
          byRatio
            ? new ArchiveRefusedError('archive_ratio', `${archiveName} expands more than ${limits.maxRatio} times its size (${mb(compressedBytes)} compressed); it looks like a zip bomb and was refused.`)
            : new ArchiveRefusedError('archive_too_large', `${archiveName} expands beyond ${mb(limits.maxExpandedBytes)}; split it into smaller archives.`),
        );
        return;
      }
      hash.update(chunk);
      writeSync(fd, chunk);
      if (final) {
        closeSync(fd);
        open.splice(open.indexOf(handle), 1);
        entries.push({ name: file.name, tempFile, sha256: hash.digest('hex'), sizeBytes: size });
      }
    };
    try {
      file.start();
    } catch (err) {
      refuse(new ArchiveRefusedError('archive_corrupt', `${archiveName}: ${file.name} uses a compression method Redward cannot read (${(err as Error).message}). Re-create the archive with standard (deflate) compression.`));
    }
  });
  unzip.register(UnzipInflate);

  let consumed = 0;
  try {
    read: for await (const chunk of createReadStream(zipPath, { highWaterMark: 256 * 1024 })) {
      const bytes = chunk as Uint8Array;
      for (let at = 0; at < bytes.length; at += PUSH_BYTES) {
        const slice = bytes.subarray(at, at + PUSH_BYTES);
        consumed += slice.length;
        unzip.push(slice);
        if (refusal) break read;
      }
    }
    if (!refusal) unzip.push(new Uint8Array(0), true);
  } catch (err) {
    refuse(new ArchiveRefusedError('archive_corrupt', `${archiveName} is not a readable zip archive (${(err as Error).message}).`));
  }
  if (!refusal) {
    const declared = centralDirectoryCount(zipPath);
    if (declared === null || (declared !== 'zip64' && declared !== seen)) {
      refuse(new ArchiveRefusedError('archive_corrupt', `${archiveName} is truncated or not a zip archive (its table of contents is missing or does not match its contents).`));
    }
  }
  if (!refusal && open.length > 0) {
    refuse(new ArchiveRefusedError('archive_corrupt', `${archiveName} ends in the middle of ${open.length === 1 ? 'a file' : `${open.length} files`}; the archive is truncated.`));
  }
  if (refusal) {
    for (const h of open) closeQuietly(h.fd);
    for (const f of [...open.map((h) => h.tempFile), ...entries.map((e) => e.tempFile)]) rmSync(f, { force: true });
    throw refusal;
  }
  return entries;
}

/**
 * Number of entries the archive's end-of-central-directory record declares (ZIP File Format
 * Specification, PKWARE APPNOTE 4.3.16; from memory), 'zip64' when it defers to the zip64
 * record, or null when there is no such record: the archive was cut short or is not a zip.
 */
function centralDirectoryCount(zipPath: string): number | 'zip64' | null {
  const size = statSync(zipPath).size;
  const tailLength = Math.min(size, 22 + 0xffff);
  const tail = Buffer.alloc(tailLength);
  const fd = openSync(zipPath, 'r');
  try {
    readSync(fd, tail, 0, tailLength, size - tailLength);
  } finally {
    closeSync(fd);
  }
  for (let i = tailLength - 22; i >= 0; i--) {
    if (tail.readUInt32LE(i) === 0x06054b50) {
      const total = tail.readUInt16LE(i + 10);
      return total === 0xffff ? 'zip64' : total;
    }
  }
  return null;
}

function isClutter(name: string): boolean {
  const base = name.split('/').pop() ?? '';
  return name.endsWith('/') || name.startsWith('__MACOSX/') || base.startsWith('._') || base === '.DS_Store' || base === 'Thumbs.db';
}

function closeQuietly(fd: number) {
  try {
    closeSync(fd);
  } catch {
    // already closed
  }
}
