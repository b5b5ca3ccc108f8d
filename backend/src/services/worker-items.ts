import { and, eq, isNotNull } from 'drizzle-orm';
import type { WorkerItem, WorkerItemState } from '../contracts/workers';
import { jobItems, jobs, scanResults, targets } from '../db/schema';
import { conflict, notFound } from '../http/errors';
import type { LinkableTarget } from '../ingest/link-target';
import { allItemsFinished, finishJob, type JobItemRow, type JobRow } from '../jobs/job-store';
import { recordItemResult, scanSettingsOf, type JobSettings } from '../jobs/process-item';
import type { ScanTaskResult } from '../jobs/scan-worker';
import { ENGINE_VERSION } from '../spectra/version';
import type { ServiceContext } from './context';

/*
 * What the server does for remote scan workers (JOB_QUEUE=redis://…): hand out an item's file and
 * record the result it posts. The database stays the server's alone; workers only speak HTTP.
 */

/** Jobs whose items a worker may still work on: queued again after a server restart, or dispatched. */
const OPEN_STATES: readonly JobRow['state'][] = ['queued', 'running'];

function loadItem(ctx: ServiceContext, itemId: number): { item: JobItemRow; job: JobRow } {
  const item = Number.isSafeInteger(itemId) ? ctx.db.select().from(jobItems).where(eq(jobItems.id, itemId)).get() : undefined;
  if (!item) throw notFound('No such job item.', 'item_not_found');
  const job = ctx.db.select().from(jobs).where(eq(jobs.id, item.jobId)).get()!;
  return { item, job };
}

/**
 * The item a worker is about to scan, with its settings; 409 when there is nothing left to do
 * (already finished, or its job was cancelled or ended), so the worker moves on.
 */
export function takeWorkerItem(ctx: ServiceContext, itemId: number): { item: WorkerItem; filePath: string } {
  const { item, job } = loadItem(ctx, itemId);
  if (item.state !== 'pending') throw conflict(`Item ${itemId} is already ${item.state}; there is nothing to scan.`, 'item_finished');
  if (job.cancelRequested || !OPEN_STATES.includes(job.state)) throw conflict(`Job ${job.id} is ${job.cancelRequested ? 'cancelled' : job.state}; its items are not scanned any more.`, 'job_closed');
  if (!item.sha256 || !ctx.store.has(item.sha256)) throw notFound(`The stored file of item ${itemId} is missing.`, 'file_missing');
  return { item: workerItemOf(item, job), filePath: ctx.store.pathOf(item.sha256) };
}

export function workerItemOf(item: JobItemRow, job: JobRow): WorkerItem {
  return { itemId: item.id, jobId: job.id, fileName: item.fileName, sha256: item.sha256!, ...scanSettingsOf(job.settings as unknown as JobSettings) };
}

/**
 * Records a worker's result for an item, once: a second post of the same item (a worker that
 * lost its answer and retried, or two workers after a lock expired) changes nothing and answers
 * the item as it stands. The job is finished when its last item is.
 */
export function postWorkerResult(ctx: ServiceContext, itemId: number, result: ScanTaskResult): WorkerItemState {
  const { item, job } = loadItem(ctx, itemId);
  // One campaign, one engine: a scan from a worker running other engine code would sit beside the
  // server's as if comparable. Refused before anything is recorded; the worker stops and the item
  // goes to an up-to-date worker.
  if (result.ok && result.scanned.ok && result.scanned.scan.engineVersion !== ENGINE_VERSION) {
    throw conflict(`This worker scans with engine ${result.scanned.scan.engineVersion}, the server with ${ENGINE_VERSION}: update the worker's Redward to the server's version.`, 'engine_version_mismatch');
  }
  let applied = false;
  if (item.state === 'pending') {
    if (!OPEN_STATES.includes(job.state)) throw conflict(`Job ${job.id} is ${job.state}; results for it are no longer recorded.`, 'job_closed');
    applied = recordItemResult({ ctx, job, settings: job.settings as unknown as JobSettings, targets: () => jobTargets(ctx, job) }, item, result);
    if (job.state === 'running' && allItemsFinished(ctx.db, job.id)) finishJob(ctx.db, job.id, job.cancelRequested ? 'cancelled' : 'done', ctx.now());
  }
  return itemState(ctx, itemId, applied);
}

export function itemState(ctx: ServiceContext, itemId: number, applied: boolean): WorkerItemState {
  const row = ctx.db.select().from(jobItems).where(eq(jobItems.id, itemId)).get()!;
  const scan = row.spectrumId
    ? ctx.db.select({ id: scanResults.id }).from(scanResults).where(and(eq(scanResults.spectrumId, row.spectrumId), eq(scanResults.isCurrent, true))).get()
    : undefined;
  return { itemId, state: row.state, outcome: row.outcome, spectrumId: row.spectrumId, scanId: scan?.id ?? null, applied };
}

// Results of one job arrive by the thousand; its campaign's targets are read once per job and
// kept a little while (a catalogue imported meanwhile is seen within TARGETS_FOR_MS, as the embedded
// runner sees it at its next job).
const TARGETS_FOR_MS = 30_000;
const targetCache = new WeakMap<ServiceContext, Map<number, { at: number; targets: LinkableTarget[] }>>();

function jobTargets(ctx: ServiceContext, job: JobRow): LinkableTarget[] {
  const perJob = targetCache.get(ctx) ?? new Map<number, { at: number; targets: LinkableTarget[] }>();
  targetCache.set(ctx, perJob);
  const cached = perJob.get(job.id);
  const now = Date.now();
  if (cached && now - cached.at < TARGETS_FOR_MS) return cached.targets;
  for (const [id, entry] of perJob) if (now - entry.at >= TARGETS_FOR_MS) perJob.delete(id);
  const list = ctx.db
    .select({ id: targets.id, catalogueId: targets.catalogueId, ra: targets.ra, dec: targets.dec })
    .from(targets)
    .where(and(eq(targets.campaignId, job.campaignId), isNotNull(targets.catalogueId)))
    .all();
  perJob.set(job.id, { at: now, targets: list });
  return list;
}
