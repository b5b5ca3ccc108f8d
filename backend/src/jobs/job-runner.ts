import { and, eq, isNotNull } from 'drizzle-orm';
import { jobs, targets } from '../db/schema';
import type { LinkableTarget } from '../ingest/link-target';
import type { ServiceContext } from '../services/context';
import type { BlobStore } from '../storage/blob-store';
import { claimNextJob, finishJob, isCancelRequested, pendingItems, renewLease, requeueExpiredJobs, type JobRow } from './job-store';
import { processPhotoZItem } from './photoz-job';
import { processItem, type JobSettings } from './process-item';
import type { JobQueue } from './job-queue';
import type { ScanPool } from './scan-pool';

export interface JobRunnerOptions {
  leaseMs: number;
  /** How often an idle runner looks for work queued by another process. */
  idlePollMs?: number;
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
      const worker = async () => {
        for (let item = queue.shift(); item; item = queue.shift()) {
          if (!this.running) return;
          if (isCancelRequested(db, job.id)) {
            cancelled = true;
            return;
          }
          await (job.kind === 'photoz' ? processPhotoZItem(this.ctx, job, item) : processItem(itemContext, item));
        }
      };
      await Promise.all(Array.from({ length: this.pool.threads }, worker));
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
