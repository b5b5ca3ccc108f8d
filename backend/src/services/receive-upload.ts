import { rmSync } from 'node:fs';
import { eq } from 'drizzle-orm';
import { campaigns, jobItems, jobs, storedFiles } from '../db/schema';
import { AppError, badRequest } from '../http/errors';
import { ArchiveRefusedError } from '../ingest/expand-archive';
import { safeFileName } from '../ingest/safe-file-name';
import { isZipFileName } from '../jobs/accepted-files';
import type { BlobStore } from '../storage/blob-store';
import { commitOffThread, expandArchiveOffThread, hashFileOffThread } from '../storage/store-thread';
import type { Actor, ServiceContext } from './context';
import { recordAudit } from './record-audit';

export interface ReceivedFile {
  /** The name the person gave the file. */
  originalName: string;
  /** Where the upload landed, inside the store's temporary folder. */
  tempFile: string;
}

// Refused here, not in the job: an empty file sent on its own is a failed transfer or a wrong
// pick, and its sender should know while they are still at the upload form.
const emptyFile = (name: string) =>
  badRequest(`${name} is empty (0 bytes); it may not have finished copying. Send it again. Nothing from this upload was stored.`, 'file_empty');

export interface UploadReceipt {
  jobId: number;
  files: number;
  entries: number;
  bytes: number;
}

interface Entry {
  fileName: string;
  sha256: string;
  sizeBytes: number;
}

/**
 * Keeps every uploaded file (archives expanded) in the content-addressed store and queues one
 * ingest job with an item per file; parsing, linking and scanning happen in the job. An
 * archive that breaks a limit refuses the whole upload and nothing of it is kept.
 */
export async function receiveUpload(
  ctx: ServiceContext,
  store: BlobStore,
  actor: Actor,
  campaignId: number,
  files: ReceivedFile[],
  options: { assign?: { first?: number; second?: number } } = {},
): Promise<UploadReceipt> {
  if (files.length === 0) {
    throw badRequest('No files arrived. Send spectra (or zip archives of them) in the multipart field "files".', 'no_files');
  }
  const staged: { tempFile: string; entry: Entry }[] = [];
  try {
    for (const file of files) {
      const name = safeFileName(file.originalName);
      if (isZipFileName(name)) {
        // Inflating and hashing run on the store's thread, not the web thread (issue 13).
        const expanded = await expandArchiveOffThread(file.tempFile, name, store, ctx.config.uploads.archive);
        rmSync(file.tempFile, { force: true });
        if (expanded.length === 0) throw badRequest(`${name} contains no files.`, 'archive_empty');
        for (const e of expanded) {
          const fileName = `${name}/${safeFileName(e.name)}`;
          // An empty entry fails in the job like any other unreadable entry: refusing a night's
          // archive for one placeholder file would cost far more than it saves.
          staged.push({ tempFile: e.tempFile, entry: { fileName, sha256: e.sha256, sizeBytes: e.sizeBytes } });
        }
      } else {
        const { sha256, sizeBytes } = await hashFileOffThread(store, file.tempFile);
        staged.push({ tempFile: file.tempFile, entry: { fileName: name, sha256, sizeBytes } });
        if (sizeBytes === 0) throw emptyFile(name);
      }
    }
  } catch (err) {
    for (const f of files) rmSync(f.tempFile, { force: true });
    for (const s of staged) rmSync(s.tempFile, { force: true });
    if (err instanceof ArchiveRefusedError) {
      const status = err.code === 'archive_corrupt' ? 400 : 413;
      throw new AppError(status, err.code, `${err.message} Nothing from this upload was stored.`);
    }
    throw err;
  }
  // Only now, with every file accepted, does anything enter the store.
  await commitOffThread(
    store,
    staged.map((s) => ({ tempFile: s.tempFile, sha256: s.entry.sha256, sizeBytes: s.entry.sizeBytes })),
  );

  const entries = staged.map((s) => s.entry);
  const campaign = ctx.db.select({ zMin: campaigns.zMin, zMax: campaigns.zMax, gridStep: campaigns.gridStep }).from(campaigns).where(eq(campaigns.id, campaignId)).get()!;
  // Rows are inserted 500 to a statement: one statement per file held the web thread ≈ 0.15 s for
  // a 2,000-file archive (issue 13's load benchmark: every reader's request waited behind it).
  const CHUNK = 500;
  const jobId = ctx.db.transaction((tx) => {
    for (let i = 0; i < entries.length; i += CHUNK) {
      tx.insert(storedFiles)
        .values(entries.slice(i, i + CHUNK).map((e) => ({ sha256: e.sha256, sizeBytes: e.sizeBytes })))
        .onConflictDoNothing()
        .run();
    }
    const job = tx
      .insert(jobs)
      .values({ kind: 'ingest', campaignId, createdBy: actor.id, total: entries.length, settings: { zMin: campaign.zMin, zMax: campaign.zMax, gridStep: campaign.gridStep, ...(options.assign ? { assign: options.assign } : {}) } })
      .returning({ id: jobs.id })
      .get();
    for (let i = 0; i < entries.length; i += CHUNK) {
      tx.insert(jobItems)
        .values(entries.slice(i, i + CHUNK).map((e) => ({ jobId: job.id, fileName: e.fileName, sha256: e.sha256 })))
        .run();
    }
    recordAudit(tx, {
      actorId: actor.id,
      action: 'upload.received',
      subjectType: 'job',
      subjectId: job.id,
      campaignId,
      after: { files: files.map((f) => f.originalName), entries: entries.length },
    });
    return job.id;
  });
  return { jobId, files: files.length, entries: entries.length, bytes: entries.reduce((s, e) => s + e.sizeBytes, 0) };
}
