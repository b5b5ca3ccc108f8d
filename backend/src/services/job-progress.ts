import { and, count, desc, eq, isNotNull, sql } from 'drizzle-orm';
import type { JobFiles, JobProgress } from '../contracts/ingest';
import { qualified } from '../db/qualified';
import { assignments, jobItems, jobs, scanResults, spectra, targets } from '../db/schema';
import { badRequest, notFound } from '../http/errors';
import type { Actor, ServiceContext } from './context';
import { recordAudit } from './record-audit';

const MAX_ERRORS_LISTED = 1000;
const MAX_FILES_LISTED = 20_000;

export function jobCampaignId(ctx: ServiceContext, jobId: number): number {
  const row = Number.isSafeInteger(jobId) ? ctx.db.select({ campaignId: jobs.campaignId }).from(jobs).where(eq(jobs.id, jobId)).get() : undefined;
  if (!row) throw notFound('No such job.', 'job_not_found');
  return row.campaignId;
}

/** A job's state, counts and per-file errors, as the progress bar and the summary show them. */
export function getJobProgress(ctx: ServiceContext, jobId: number): JobProgress {
  const job = ctx.db.select().from(jobs).where(eq(jobs.id, jobId)).get();
  if (!job) throw notFound('No such job.', 'job_not_found');
  const outcomes = ctx.db
    .select({ state: jobItems.state, outcome: jobItems.outcome, n: count() })
    .from(jobItems)
    .where(eq(jobItems.jobId, jobId))
    .groupBy(jobItems.state, jobItems.outcome)
    .all();
  const countOf = (pred: (o: (typeof outcomes)[number]) => boolean) => outcomes.filter(pred).reduce((s, o) => s + o.n, 0);
  const linkCounts = ctx.db
    .select({ linked: sql<number>`sum(case when ${qualified(spectra.targetId)} is not null then 1 else 0 end)`, all: count() })
    .from(jobItems)
    .innerJoin(spectra, eq(spectra.id, jobItems.spectrumId))
    .where(and(eq(jobItems.jobId, jobId), eq(jobItems.outcome, 'stored')))
    .get()!;
  const errors = ctx.db
    .select({ file: jobItems.fileName, code: jobItems.errorCode, message: jobItems.errorMessage })
    .from(jobItems)
    .where(and(eq(jobItems.jobId, jobId), eq(jobItems.state, 'failed'), isNotNull(jobItems.errorCode)))
    .limit(MAX_ERRORS_LISTED)
    .all();
  return {
    id: job.id,
    kind: job.kind,
    campaignId: job.campaignId,
    state: job.state,
    done: job.done,
    total: job.total,
    errors: errors.map((e) => ({ file: e.file, code: e.code!, message: e.message ?? '' })),
    summary: {
      stored: countOf((o) => o.outcome === 'stored'),
      duplicates: countOf((o) => o.outcome === 'duplicate'),
      rescanned: countOf((o) => o.outcome === 'rescanned'),
      failed: countOf((o) => o.state === 'failed'),
      linked: linkCounts.linked ?? 0,
      unlinked: linkCounts.all - (linkCounts.linked ?? 0),
    },
    failure: job.failure,
    createdAt: job.createdAt,
    finishedAt: job.finishedAt,
  };
}

/**
 * Every file of a job in upload order with what became of it: stored, duplicate or failed (and
 * why); the target it was linked to (or none); its top solution once scanned; how many readers it
 * has. A duplicate points at the spectrum already in the campaign.
 */
export function listJobFiles(ctx: ServiceContext, jobId: number): JobFiles {
  const total = ctx.db.select({ n: count() }).from(jobItems).where(eq(jobItems.jobId, jobId)).get()!.n;
  const rows = ctx.db
    .select({
      file: jobItems.fileName,
      state: jobItems.state,
      outcome: jobItems.outcome,
      errorCode: jobItems.errorCode,
      errorMessage: jobItems.errorMessage,
      spectrumId: jobItems.spectrumId,
      targetId: targets.id,
      catalogueId: targets.catalogueId,
      linkMethod: spectra.linkMethod,
      objectName: spectra.objectName,
      instrument: spectra.instrument,
      scanId: scanResults.id,
      zBest: scanResults.zBest,
      spectrumClass: scanResults.spectrumClass,
      readersAssigned: sql<number>`(select count(*) from ${assignments} where ${qualified(assignments.spectrumId)} = ${qualified(jobItems.spectrumId)})`,
    })
    .from(jobItems)
    .leftJoin(spectra, eq(spectra.id, jobItems.spectrumId))
    .leftJoin(targets, eq(targets.id, spectra.targetId))
    .leftJoin(scanResults, and(eq(scanResults.spectrumId, jobItems.spectrumId), eq(scanResults.isCurrent, true)))
    .where(eq(jobItems.jobId, jobId))
    .orderBy(jobItems.id)
    .limit(MAX_FILES_LISTED)
    .all();
  return {
    jobId,
    total,
    truncated: total > rows.length,
    files: rows.map((r) => ({
      file: r.file,
      state: r.state,
      outcome: r.outcome,
      error: r.errorCode === null ? null : { code: r.errorCode, message: r.errorMessage ?? '' },
      spectrumId: r.spectrumId,
      target: r.targetId === null || r.catalogueId === null ? null : { id: r.targetId, catalogueId: r.catalogueId, linkMethod: r.linkMethod },
      objectName: r.objectName,
      instrument: r.instrument,
      scan: r.scanId === null || r.spectrumClass === null ? null : { zBest: r.zBest, spectrumClass: r.spectrumClass },
      readersAssigned: r.readersAssigned ?? 0,
    })),
  };
}

/** A campaign's jobs, newest first, with their counts (errors are listed per job). */
export function listCampaignJobs(ctx: ServiceContext, campaignId: number, limit = 50): Omit<JobProgress, 'errors'>[] {
  return ctx.db
    .select({ id: jobs.id })
    .from(jobs)
    .where(eq(jobs.campaignId, campaignId))
    .orderBy(desc(jobs.id))
    .limit(limit)
    .all()
    .map(({ id }) => {
      const { errors: _errors, ...rest } = getJobProgress(ctx, id);
      return rest;
    });
}

/** Asks the runner to stop a job after the items in flight; a queued job stops at once. */
export function cancelJob(ctx: ServiceContext, actor: Actor, jobId: number): JobProgress {
  ctx.db.transaction((tx) => {
    const job = tx.select().from(jobs).where(eq(jobs.id, jobId)).get()!;
    if (job.state !== 'queued' && job.state !== 'running') {
      throw badRequest(`The job has already ended (${job.state}).`, 'job_finished');
    }
    tx.update(jobs)
      .set(job.state === 'queued' ? { cancelRequested: true, state: 'cancelled', finishedAt: ctx.now().toISOString() } : { cancelRequested: true })
      .where(eq(jobs.id, jobId))
      .run();
    recordAudit(tx, { actorId: actor.id, action: 'job.cancelled', subjectType: 'job', subjectId: jobId, campaignId: job.campaignId });
  });
  return getJobProgress(ctx, jobId);
}
