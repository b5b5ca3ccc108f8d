import { and, count, eq, gt, inArray, lt, max, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { jobItems, jobs, targetPhotometry } from '../db/schema';
import type { ServiceContext } from '../services/context';
import { photoZFitInput, photoZFitRows, storePhotoZFits, type NewFitRow } from '../services/photo-z-fits';
import type { JobItemRow, JobRow } from './job-store';

/**
 * Targets fitted per item: ≈ 0.2 s of fitting at ≈ 1,100 sources/s on a scan-pool thread, so a
 * crash redoes at most this many fits and the web thread only reads and writes each item.
 */
export const PHOTOZ_JOB_CHUNK = 200;

/** What a photo-z job carries: the targets to fit, in catalogue order, fixed when it is queued. */
export interface PhotoZJobSettings {
  targetIds: number[];
  chunk: number;
  /**
   * The largest photometry row id when the job was queued (ids only grow): a target with a newer
   * row had its fluxes replaced by a later import, which fits it (in its request or its own job).
   */
  photometryUpTo: number;
}

type Tx = Pick<Db, 'insert' | 'select' | 'update' | 'delete'>;

/**
 * Queues the photo-z fit of these targets (their photometry already stored) as a job of
 * `ceil(n / chunk)` items, in the caller's transaction. Returns the job id; the caller wakes the
 * runner after its transaction commits.
 */
export function queuePhotoZJob(tx: Tx, campaignId: number, createdBy: number, targetIds: readonly number[]): number {
  const chunk = PHOTOZ_JOB_CHUNK;
  const n = Math.ceil(targetIds.length / chunk);
  const photometryUpTo = tx.select({ id: max(targetPhotometry.id) }).from(targetPhotometry).get()?.id ?? 0;
  const settings: PhotoZJobSettings = { targetIds: [...targetIds], chunk, photometryUpTo };
  const job = tx
    .insert(jobs)
    .values({ kind: 'photoz', campaignId, createdBy, total: n, settings: settings as unknown as Record<string, unknown> })
    .returning({ id: jobs.id })
    .get();
  const items = Array.from({ length: n }, (_, i) => ({
    jobId: job.id,
    fileName: `photo-z of catalogue targets ${i * chunk + 1}–${Math.min((i + 1) * chunk, targetIds.length)} of ${targetIds.length}`,
  }));
  for (let i = 0; i < items.length; i += 500) tx.insert(jobItems).values(items.slice(i, i + 500)).run();
  return job.id;
}

/** The targets of one item: its place among the job's items (inserted in order) picks its slice. */
function targetsOfItem(db: Pick<Db, 'select'>, job: JobRow, item: JobItemRow): number[] {
  const settings = job.settings as unknown as PhotoZJobSettings;
  const index = db.select({ n: count() }).from(jobItems).where(and(eq(jobItems.jobId, job.id), lt(jobItems.id, item.id))).get()!.n;
  return settings.targetIds.slice(index * settings.chunk, (index + 1) * settings.chunk);
}

/**
 * Fits one item's targets on a scan-pool thread and stores their fits together with the item's
 * end, in one transaction: a crash leaves the item pending (refitted on resume, replacing nothing
 * twice) or finished with every fit stored. The fit runs before the write transaction, so other
 * writers wait only for the inserts, and off the web thread, so requests are answered meanwhile.
 */
export async function processPhotoZItem(ctx: ServiceContext, job: JobRow, item: JobItemRow): Promise<void> {
  const { db } = ctx;
  const settings = job.settings as unknown as PhotoZJobSettings;
  const ids = targetsOfItem(db, job, item);
  let rows: NewFitRow[] = [];
  try {
    const input = photoZFitInput(db, job.campaignId, ids);
    if (input) {
      const result = await ctx.scanPool.photoZ({ curves: input.curves, flux: input.flux, err: input.err });
      if (!result.ok) throw new Error(result.message);
      rows = photoZFitRows(input, result.fits, ctx.now().toISOString());
    }
  } catch (err) {
    ctx.logger.error({ err, jobId: job.id, itemId: item.id }, 'photo-z fit failed');
    finishPhotoZItem(db, item, 'failed', 'photoz_failed', `The photo-z fit of these targets stopped on an error: ${(err as Error).message}`);
    return;
  }
  db.transaction((tx) => {
    if (tx.select({ state: jobItems.state }).from(jobItems).where(eq(jobItems.id, item.id)).get()?.state !== 'pending') return;
    // A target whose fluxes a later import replaced is that import's to fit (in its request, or
    // by its own job, which runs after this one): its fit is left as it is.
    const replaced = new Set(
      ids.length === 0
        ? []
        : tx
            .selectDistinct({ id: targetPhotometry.targetId })
            .from(targetPhotometry)
            .where(and(inArray(targetPhotometry.targetId, ids), gt(targetPhotometry.id, settings.photometryUpTo)))
            .all()
            .map((t) => t.id),
    );
    storePhotoZFits(
      tx,
      ids.filter((id) => !replaced.has(id)),
      rows.filter((r) => !replaced.has(r.targetId)),
    );
    finishPhotoZItem(tx, item, 'done');
  });
}

function finishPhotoZItem(db: Pick<Db, 'update'>, item: JobItemRow, state: 'done' | 'failed', errorCode?: string, errorMessage?: string): void {
  const changed = db
    .update(jobItems)
    .set({ state, errorCode: errorCode ?? null, errorMessage: errorMessage ?? null })
    .where(and(eq(jobItems.id, item.id), eq(jobItems.state, 'pending')))
    .run().changes;
  if (changed > 0) db.update(jobs).set({ done: sql`${jobs.done} + 1` }).where(eq(jobs.id, item.jobId)).run();
}

/**
 * Runs a photo-z job's pending items on this process while `keepGoing()` holds (the Redis queue
 * fits photo-z on the server itself: remote workers only scan spectra). The caller ends the job.
 */
export async function runPhotoZItems(ctx: ServiceContext, job: JobRow, keepGoing: () => boolean): Promise<void> {
  const pending = ctx.db.select().from(jobItems).where(and(eq(jobItems.jobId, job.id), eq(jobItems.state, 'pending'))).orderBy(jobItems.id).all();
  for (const item of pending) {
    if (!keepGoing()) return;
    await processPhotoZItem(ctx, job, item);
  }
}
