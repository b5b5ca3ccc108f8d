import type { ServiceContext } from '../services/context';
import type { BlobStore } from '../storage/blob-store';
import { JobRunner } from './job-runner';
import { RedisJobQueue } from './redis/redis-job-queue';
import type { ScanPool } from './scan-pool';

/**
 * Where the server's queued jobs go to be worked on. Jobs and their items always live in SQLite
 * (the services queue them there); a JobQueue takes them from there to whoever scans:
 *
 * - `sqlite` (default): JobRunner claims a job with a lease and scans its items on this
 *   process's thread pool. `npm run jobs` starts more runners on the same database.
 * - `redis://…`: RedisJobQueue claims the job the same way, but puts each item on a BullMQ queue;
 *   `npm run jobs` processes on any machine take them (redis/redis-worker.ts), fetch the file and
 *   post the result over HTTP, and the server alone writes the database.
 */
export interface JobQueue {
  readonly kind: 'sqlite' | 'redis';
  start(): void;
  /** A job was queued: look for it now rather than at the next poll. */
  wake(): void;
  /** Stops taking jobs; what is in flight is finished or put back, never lost. */
  stop(): Promise<void>;
}

export function createJobQueue(ctx: ServiceContext, store: BlobStore, pool: ScanPool): JobQueue {
  const { queue, leaseMs, yieldToWeb } = ctx.config.jobs;
  return queue.kind === 'redis' ? new RedisJobQueue(ctx, queue.url, { leaseMs }) : new JobRunner(ctx, store, pool, { leaseMs, yieldToWeb });
}
