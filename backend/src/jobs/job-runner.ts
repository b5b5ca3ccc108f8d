import { and, eq, isNotNull } from 'drizzle-orm';
import type { Db } from '../db/client';
import { requestActivity } from '../http/request-activity';
import { jobs, targets } from '../db/schema';
import type { LinkableTarget } from '../ingest/link-target';
import type { ServiceContext } from '../services/context';
import type { BlobStore } from '../storage/blob-store';
import { claimNextJob, finishJob, isCancelRequested, pendingItems, renewLease, requeueExpiredJobs, type JobItemRow, type JobRow } from './job-store';
import { processPhotoZItem } from './photoz-job';
import { processItem, recordItemResult, type ItemContext, type JobSettings, type ResultContext } from './process-item';
import type { JobQueue } from './job-queue';
import type { ScanPool } from './scan-pool';
import type { ScanTaskResult } from './scan-worker';

export interface JobRunnerOptions {
  leaseMs: number;
  /** How often an idle runner looks for work queued by another process. */
  idlePollMs?: number;
  /** Most scan results written in one transaction (default 8; 1 writes each on its own). */
  resultBatch?: number;
  /** Longest a finished scan waits for others to share its transaction, ms (default 100). */
  resultBatchWaitMs?: number;
  /**
   * While API requests are being answered, one scan thread fewer takes items (never fewer than
   * one), so a core stays for the web thread; an idle server scans on every thread.
   */
  yieldToWeb?: boolean;
}

/**
 * Executes durable jobs one at a time, their items in parallel across the scan pool. Progress
 * lives in SQLite, so the web server, the import command and a restarted runner all see the
 * same state, and a job cut short by a crash resumes where it stopped.
 */
export class JobRunner implements JobQueue {
  readonly kind = 'sqlite';
  private running = false;
  private loopDone: Promise<void> = Promise.resolve();
  private wakeUp: (() => void) | null = null;

  constructor(
    private readonly ctx: ServiceContext,
    private readonly store: BlobStore,
    private readonly pool: ScanPool,
    private readonly options: JobRunnerOptions,
  ) {}

  start(): void {
    if (this.running) return;
    this.running = true;
    requeueExpiredJobs(this.ctx.db, this.ctx.now());
    this.loopDone = this.loop();
  }

  /** Call after queueing a job so an idle runner starts at once. */
  wake(): void {
    this.wakeUp?.();
  }

  /** Finishes the items in flight, puts the job back in the queue, and stops. */
  async stop(): Promise<void> {
    this.running = false;
    this.wake();
    await this.loopDone;
  }

  private async loop(): Promise<void> {
    while (this.running) {
      const job = claimNextJob(this.ctx.db, this.ctx.now(), this.options.leaseMs);
      if (job) {
        await this.runJob(job);
        continue;
      }
      requeueExpiredJobs(this.ctx.db, this.ctx.now());
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

  private async runJob(job: JobRow): Promise<void> {
    const { db, logger } = this.ctx;
    const lease = setInterval(() => renewLease(db, job.id, this.ctx.now(), this.options.leaseMs), Math.max(100, this.options.leaseMs / 3));
    try {
      const settings = job.settings as unknown as JobSettings;
      let targetCache: LinkableTarget[] | null = null;
      const itemContext = {
        ctx: this.ctx,
        store: this.store,
        pool: this.pool,
        job,
        settings,
        targets: () => (targetCache ??= loadTargets(this.ctx, job.campaignId)),
      };
      const queue = pendingItems(db, job.id);
      let cancelled = false;
      const results = new ResultBatch(db, itemContext, this.options.resultBatch ?? 8, this.options.resultBatchWaitMs ?? 100);
      const threads = this.pool.threads;
      const worker = async (index: number) => {
        for (;;) {
          // The last of several threads waits while people are being answered (the item stays queued).
          if (this.options.yieldToWeb && threads > 1 && index === threads - 1) {
            while (this.running && queue.length > 0 && requestActivity.busy()) await new Promise((r) => setTimeout(r, 50));
          }
          const item = queue.shift();
          if (!item) return;
          if (!this.running) return;
          if (isCancelRequested(db, job.id)) {
            cancelled = true;
            return;
          }
          // A photo-z item writes its own fits in its own transaction; scans go through the batch.
          await (job.kind === 'photoz' ? processPhotoZItem(this.ctx, job, item) : processItem(itemContext, item, (i, r) => results.add(i, r)));
        }
      };
      try {
        await Promise.all(Array.from({ length: threads }, (_, index) => worker(index)));
      } finally {
        // What was scanned is kept even when the job stops on an error.
        results.flush();
      }
      if (cancelled) finishJob(db, job.id, 'cancelled', this.ctx.now());
      else if (!this.running) db.update(jobs).set({ state: 'queued', leaseExpiresAt: null }).where(eq(jobs.id, job.id)).run();
      else finishJob(db, job.id, 'done', this.ctx.now());
    } catch (err) {
      logger.error({ err, jobId: job.id }, 'job failed');
      finishJob(db, job.id, 'failed', this.ctx.now(), `The job stopped on an unexpected error: ${(err as Error).message}`);
    } finally {
      clearInterval(lease);
    }
  }
}

function loadTargets(ctx: ServiceContext, campaignId: number): LinkableTarget[] {
  return ctx.db
    .select({ id: targets.id, catalogueId: targets.catalogueId, ra: targets.ra, dec: targets.dec })
    .from(targets)
    .where(and(eq(targets.campaignId, campaignId), isNotNull(targets.catalogueId)))
    .all();
}

/**
 * Scan results written several to a transaction. Each result's own transaction
 * (`recordItemResult`: the spectrum, its scan and the item's state together) runs as a savepoint
 * inside one outer transaction, so a batch costs one commit — one WAL sync — instead of one per
 * spectrum; on the web thread that commit was ≈ 1.5 ms of every result (CPU profile, issue 13's
 * load benchmark). Nothing about an item changes: it is still written whole or not at all and
 * still idempotent (a repeat finds it finished). A crash loses at most the batch not yet written
 * — at most `maxItems` results and `maxWaitMs` of scanning — whose items are still pending and
 * are scanned again on resume. The batch is bounded so that one write does not hold the web
 * thread for long (≈ 1 ms a result).
 */
export class ResultBatch {
  private pending: { item: JobItemRow; result: ScanTaskResult }[] = [];
  private timer: NodeJS.Timeout | null = null;
  private failure: { error: unknown } | null = null;

  constructor(
    private readonly db: Db,
    private readonly rc: ResultContext,
    private readonly maxItems: number,
    private readonly maxWaitMs: number,
  ) {}

  /** Queues one result; throws the error of an earlier write that failed. */
  add(item: JobItemRow, result: ScanTaskResult): void {
    this.rethrow();
    this.pending.push({ item, result });
    if (this.pending.length >= this.maxItems) this.flush();
    else
      this.timer ??= setTimeout(() => {
        try {
          this.flush();
        } catch (error) {
          // Raised to the job from its next add() or final flush().
          this.failure ??= { error };
        }
      }, this.maxWaitMs);
  }

  /** Writes what is queued; throws the first error met (the other results are still written). */
  flush(): void {
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    const batch = this.pending;
    this.pending = [];
    if (batch.length > 0) {
      let first: { error: unknown } | null = null;
      this.db.transaction(() => {
        for (const { item, result } of batch) {
          try {
            recordItemResult(this.rc, item, result);
          } catch (error) {
            // Its savepoint is rolled back, so the item stays pending; the others are kept.
            first ??= { error };
          }
        }
      });
      this.failure ??= first;
    }
    this.rethrow();
  }

  private rethrow(): void {
    if (!this.failure) return;
    const { error } = this.failure;
    this.failure = null;
    throw error;
  }
}
