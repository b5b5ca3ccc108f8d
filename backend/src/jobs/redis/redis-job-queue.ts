import { Queue, QueueEvents } from 'bullmq';
import { and, asc, eq, gt } from 'drizzle-orm';
import { jobItems, jobs } from '../../db/schema';
import type { ServiceContext } from '../../services/context';
import { workerItemOf } from '../../services/worker-items';
import type { JobQueue } from '../job-queue';
import { allItemsFinished, claimNextJob, finishJob, isCancelRequested, renewLease, requeueExpiredJobs, type JobRow } from '../job-store';
import { runPhotoZItems } from '../photoz-job';
import { finishWithoutScan, recordItemResult, type JobSettings, type ResultContext } from '../process-item';
import { bullConnection } from './bullmq-connection';
import { bullJobIdOf, itemIdOfBullJob, SCAN_QUEUE } from './queue-names';

export interface RedisJobQueueOptions {
  leaseMs: number;
  idlePollMs?: number;
}

/** Items handed to BullMQ per round trip. */
const DISPATCH_BATCH = 1000;
/** Attempts of one item on workers (an error reaching the server, a worker crash) before it is marked failed. */
export const ITEM_ATTEMPTS = 5;

/**
 * The server's half of the Redis queue. It claims queued jobs from SQLite with a lease (as the
 * embedded runner does), finishes the items that need no scan (duplicates, unsupported files),
 * and adds every other pending item to BullMQ under the item's own id. Workers record results
 * through the HTTP API; this class finishes a job when no item is pending, honours cancellation,
 * and marks an item failed when BullMQ gives up on it.
 *
 * Restart-safe: a job stays `running` under this server's lease. After a crash the lease expires,
 * the job is queued again and re-dispatched; items still in Redis keep their id, so adding them
 * again changes nothing, and finished items are no longer pending, so none is scanned twice.
 */
export class RedisJobQueue implements JobQueue {
  readonly kind = 'redis';
  private readonly queue: Queue;
  private readonly events: QueueEvents;
  private readonly held = new Set<number>();
  private running = false;
  private loopDone: Promise<void> = Promise.resolve();
  private wakeUp: (() => void) | null = null;
  private leaseTimer: NodeJS.Timeout | null = null;

  constructor(
    private readonly ctx: ServiceContext,
    url: string,
    private readonly options: RedisJobQueueOptions,
  ) {
    const connection = bullConnection(url);
    this.queue = new Queue(SCAN_QUEUE, {
      connection,
      defaultJobOptions: { attempts: ITEM_ATTEMPTS, backoff: { type: 'exponential', delay: 1000 }, removeOnComplete: true, removeOnFail: true },
    });
    this.events = new QueueEvents(SCAN_QUEUE, { connection });
    // Redis going away is logged, not fatal: BullMQ reconnects and the loop retries.
    this.queue.on('error', (err) => ctx.logger.warn({ err }, 'redis queue error'));
    this.events.on('error', (err) => ctx.logger.warn({ err }, 'redis queue events error'));
    this.events.on('failed', ({ jobId, failedReason }) => this.onItemGaveUp(jobId, failedReason));
  }

  start(): void {
    if (this.running) return;
    this.running = true;
    this.leaseTimer = setInterval(() => {
      for (const id of this.held) renewLease(this.ctx.db, id, this.ctx.now(), this.options.leaseMs);
    }, Math.max(100, this.options.leaseMs / 3));
    this.loopDone = this.loop();
  }

  wake(): void {
    this.wakeUp?.();
  }

  async stop(): Promise<void> {
    this.running = false;
    this.wake();
    await this.loopDone;
    if (this.leaseTimer) clearInterval(this.leaseTimer);
    // Jobs in hand go back to the queue at once (their items stay in Redis and keep being scanned);
    // the next server start takes them up without waiting for the lease to run out.
    for (const id of this.held) this.ctx.db.update(jobs).set({ state: 'queued', leaseExpiresAt: null }).where(and(eq(jobs.id, id), eq(jobs.state, 'running'))).run();
    this.held.clear();
    await this.events.close();
    await this.queue.close();
  }

  private async loop(): Promise<void> {
    while (this.running) {
      try {
        requeueExpiredJobs(this.ctx.db, this.ctx.now());
        for (let job = this.claim(); job && this.running; job = this.claim()) {
          this.held.add(job.id);
          await this.dispatch(job);
        }
        this.checkHeld();
        await this.redispatchIfLost();
      } catch (err) {
        // Redis down or a database error: keep the jobs (their leases lapse if this persists) and retry.
        this.ctx.logger.error({ err }, 'dispatching scan items to Redis failed; retrying');
      }
      await new Promise<void>((resolve) => {
        const timer = setTimeout(resolve, this.options.idlePollMs ?? 1000);
        this.wakeUp = () => {
          clearTimeout(timer);
          resolve();
        };
      });
      this.wakeUp = null;
    }
  }

  private claim(): JobRow | null {
    return claimNextJob(this.ctx.db, this.ctx.now(), this.options.leaseMs);
  }

  private resultContext(job: JobRow): ResultContext {
    return { ctx: this.ctx, job, settings: job.settings as unknown as JobSettings, targets: () => [] };
  }

  /** Adds every pending item of the job to BullMQ, in batches, finishing the ones that need no scan. */
  private async dispatch(job: JobRow): Promise<void> {
    // Photo-z fits run here (remote workers only scan); checkHeld ends the job.
    if (job.kind === 'photoz') return runPhotoZItems(this.ctx, job, () => this.running && !isCancelRequested(this.ctx.db, job.id));
    const rc = this.resultContext(job);
    let after = 0;
    for (;;) {
      const page = this.ctx.db
        .select()
        .from(jobItems)
        .where(and(eq(jobItems.jobId, job.id), eq(jobItems.state, 'pending'), gt(jobItems.id, after)))
        .orderBy(asc(jobItems.id))
        .limit(DISPATCH_BATCH)
        .all();
      if (page.length === 0) break;
      after = page[page.length - 1]!.id;
      const toScan = page.filter((item) => !finishWithoutScan(rc, item));
      if (toScan.length > 0) {
        await this.queue.addBulk(toScan.map((item) => ({ name: 'scan', data: workerItemOf(item, job), opts: { jobId: bullJobIdOf(item.id) } })));
      }
    }
    this.ctx.logger.info({ jobId: job.id }, 'scan items queued in Redis');
  }

  /**
   * Jobs in hand with pending items while Redis holds no item at all: the work list was lost (Redis
   * restarted without persistence, or an item's final failure event was missed). Dispatching again
   * is safe: items still in Redis keep their id, finished ones are no longer pending.
   */
  private async redispatchIfLost(): Promise<void> {
    if (this.held.size === 0) return;
    const counts = await this.queue.getJobCounts('waiting', 'active', 'delayed', 'prioritized');
    if (Object.values(counts).some((n) => n > 0)) return;
    for (const id of this.held) {
      const job = this.ctx.db.select().from(jobs).where(eq(jobs.id, id)).get();
      if (job?.state === 'running' && !job.cancelRequested && !allItemsFinished(this.ctx.db, id)) {
        this.ctx.logger.warn({ jobId: id }, 'Redis holds none of the pending items of a running job; queueing them again');
        await this.dispatch(job);
      }
    }
  }

  /** Ends the jobs in hand whose items are all finished, and the cancelled ones. */
  private checkHeld(): void {
    for (const id of this.held) {
      const job = this.ctx.db.select().from(jobs).where(eq(jobs.id, id)).get();
      if (!job || job.state !== 'running') {
        this.held.delete(id);
        continue;
      }
      if (job.cancelRequested) {
        finishJob(this.ctx.db, id, 'cancelled', this.ctx.now());
        // Waiting entries would only be refused by the server (job_closed); drop what is easy to drop.
        void this.dropWaiting(id);
        this.held.delete(id);
      } else if (allItemsFinished(this.ctx.db, id)) {
        finishJob(this.ctx.db, id, 'done', this.ctx.now());
        this.held.delete(id);
      }
    }
  }

  private async dropWaiting(jobId: number): Promise<void> {
    const pending = this.ctx.db.select({ id: jobItems.id }).from(jobItems).where(and(eq(jobItems.jobId, jobId), eq(jobItems.state, 'pending'))).all();
    for (const { id } of pending) await this.queue.remove(bullJobIdOf(id)).catch(() => 0);
  }

  /** BullMQ gave up on an item (every attempt failed, or it stalled too often): the item fails with the reason. */
  private onItemGaveUp(bullJobId: string, reason: string): void {
    const itemId = itemIdOfBullJob(bullJobId);
    if (itemId === null) return;
    try {
      const item = this.ctx.db.select().from(jobItems).where(eq(jobItems.id, itemId)).get();
      if (!item || item.state !== 'pending') return;
      const job = this.ctx.db.select().from(jobs).where(eq(jobs.id, item.jobId)).get()!;
      recordItemResult(this.resultContext(job), item, {
        ok: false,
        code: 'worker_failed',
        message: `No scan worker could finish this file (${ITEM_ATTEMPTS} attempts; the last said: ${reason}). The file is kept in storage; re-scan it once the workers are healthy.`,
      });
      this.checkHeld();
    } catch (err) {
      this.ctx.logger.error({ err, itemId }, 'recording a failed item');
    }
  }
}
