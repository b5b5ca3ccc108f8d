import { and, asc, eq, inArray, lt, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { jobItems, jobs } from '../db/schema';

export type JobRow = typeof jobs.$inferSelect;
export type JobItemRow = typeof jobItems.$inferSelect;

const iso = (d: Date) => d.toISOString();

/**
 * Puts back in the queue every running job whose runner stopped renewing its lease (a crash,
 * a kill -9, a power cut). Its finished items stay finished.
 */
export function requeueExpiredJobs(db: Db, now: Date): number {
  return db
    .update(jobs)
    .set({ state: 'queued', leaseExpiresAt: null })
    .where(and(eq(jobs.state, 'running'), lt(jobs.leaseExpiresAt, iso(now))))
    .run().changes;
}

/** Claims the oldest queued job for this runner, atomically; null when there is none. */
export function claimNextJob(db: Db, now: Date, leaseMs: number): JobRow | null {
  return db.transaction((tx) => {
    const next = tx.select({ id: jobs.id }).from(jobs).where(eq(jobs.state, 'queued')).orderBy(asc(jobs.id)).limit(1).get();
    if (!next) return null;
    return (
      tx
        .update(jobs)
        .set({
          state: 'running',
          attempts: sql`${jobs.attempts} + 1`,
          leaseExpiresAt: iso(new Date(now.getTime() + leaseMs)),
          startedAt: sql`coalesce(${jobs.startedAt}, ${iso(now)})`,
        })
        .where(and(eq(jobs.id, next.id), eq(jobs.state, 'queued')))
        .returning()
        .get() ?? null
    );
  });
}

export function renewLease(db: Db, jobId: number, now: Date, leaseMs: number): void {
  db.update(jobs)
    .set({ leaseExpiresAt: iso(new Date(now.getTime() + leaseMs)) })
    .where(and(eq(jobs.id, jobId), eq(jobs.state, 'running')))
    .run();
}

export function pendingItems(db: Db, jobId: number): JobItemRow[] {
  return db.select().from(jobItems).where(and(eq(jobItems.jobId, jobId), eq(jobItems.state, 'pending'))).orderBy(asc(jobItems.id)).all();
}

export function isCancelRequested(db: Db, jobId: number): boolean {
  return db.select({ c: jobs.cancelRequested }).from(jobs).where(eq(jobs.id, jobId)).get()?.c ?? false;
}

/** Counts finished items into the job's progress (done = items no longer pending). */
export function refreshProgress(db: Pick<Db, 'update' | 'select'>, jobId: number): void {
  db.update(jobs)
    .set({
      done: sql`(select count(*) from ${jobItems} where ${jobItems.jobId} = ${jobId} and ${jobItems.state} != 'pending')`,
    })
    .where(eq(jobs.id, jobId))
    .run();
}

export function finishJob(db: Db, jobId: number, state: 'done' | 'failed' | 'cancelled', now: Date, failure?: string): void {
  db.transaction((tx) => {
    refreshProgress(tx, jobId);
    tx.update(jobs)
      .set({ state, leaseExpiresAt: null, finishedAt: iso(now), failure: failure ?? null })
      .where(and(eq(jobs.id, jobId), inArray(jobs.state, ['running', 'queued'])))
      .run();
  });
}

/** True when no item of the job is pending any more. */
export function allItemsFinished(db: Pick<Db, 'select'>, jobId: number): boolean {
  return !db.select({ id: jobItems.id }).from(jobItems).where(and(eq(jobItems.jobId, jobId), eq(jobItems.state, 'pending'))).limit(1).get();
}
