import { Worker, type Job } from 'bullmq';
import { workerItemSchema } from '../../contracts/workers';
import type { Config } from '../../config';
import { createScanPool, type ScanPool } from '../scan-pool';
import { bullConnection } from './bullmq-connection';
import { SCAN_QUEUE } from './queue-names';
import { EngineMismatchError, WorkerClient } from './worker-client';

export interface RemoteWorker {
  readonly threads: number;
  close(): Promise<void>;
}

export type WorkerLog = (line: string) => void;

/**
 * The worker's half of the Redis queue (`npm run jobs` with JOB_QUEUE=redis://…): takes scan items
 * from BullMQ, as many at once as it has scan threads, fetches each file from the server, scans it
 * on this machine and posts the result. It never opens the database.
 *
 * BullMQ holds a lock on each item while it runs (renewed from this process's main thread, which
 * stays free because scans run on worker threads). A worker killed mid-item stops renewing; after
 * JOB_LEASE_SECONDS another worker's stalled-item check puts the item back in the queue.
 */
export function startRemoteWorker(config: Config, log: WorkerLog, onFatal: (err: Error) => void): RemoteWorker {
  const { queue, worker: remote, leaseMs, scanThreads, scanTimeLimitMs } = config.jobs;
  if (queue.kind !== 'redis') throw new Error('startRemoteWorker needs JOB_QUEUE=redis://…');
  if (!remote.serverUrl) throw new Error('Set REDWARD_SERVER_URL to the Redward server this worker scans for (e.g. http://scan-head:3000).');
  if (!remote.token) throw new Error('Set REDWARD_WORKER_TOKEN to a worker token (on the server: npm run worker-token -- <machine name>, or POST /api/admin/worker-tokens as an admin).');
  const pool = createScanPool(scanThreads, { timeLimitMs: scanTimeLimitMs });
  const client = new WorkerClient(remote.serverUrl, remote.token);
  const worker = new Worker(SCAN_QUEUE, (job) => scanItem(job, pool, client, log), {
    connection: bullConnection(queue.url),
    concurrency: pool.threads,
    lockDuration: leaseMs,
    stalledInterval: leaseMs,
    // A file that kills its worker every time (the machine runs out of memory on it) fails after
    // a few rounds instead of taking workers down for ever.
    maxStalledCount: 3,
  });
  worker.on('failed', (job, err) => {
    log(`item ${job?.data?.itemId ?? '?'} failed on this worker: ${err.message}`);
    if (err instanceof EngineMismatchError) onFatal(err);
  });
  worker.on('error', (err) => log(`queue error: ${err.message}`));
  return {
    threads: pool.threads,
    async close() {
      await worker.close();
      await pool.destroy();
    },
  };
}

async function scanItem(job: Job, pool: ScanPool, client: WorkerClient, log: WorkerLog): Promise<string> {
  const item = workerItemSchema.parse(job.data);
  log(`item ${item.itemId} taken (attempt ${job.attemptsMade + 1})`);
  const t0 = performance.now();
  const bytes = await client.takeFile(item.itemId, item.sha256);
  const t1 = performance.now();
  if (!bytes) {
    log(`item ${item.itemId} needs no scan any more`);
    return 'skipped';
  }
  const result = await pool.run({ bytes, fileName: item.fileName, zMin: item.zMin, zMax: item.zMax, gridStep: item.gridStep });
  const t2 = performance.now();
  const state = await client.postResult(item.itemId, result);
  const t3 = performance.now();
  if (!state) {
    log(`item ${item.itemId} scanned, but its job was closed meanwhile`);
    return 'closed';
  }
  // The timings are what npm run bench:ingest -- --workers N reads to measure the per-item overhead.
  const ms = (a: number, b: number) => (b - a).toFixed(1);
  log(
    `item ${item.itemId} recorded: ${state.state}${state.outcome ? ` (${state.outcome})` : ''}${state.applied ? '' : ', already recorded before'} ` +
      `[fetch ${ms(t0, t1)} ms, scan ${ms(t1, t2)} ms, post ${ms(t2, t3)} ms]`,
  );
  return state.state;
}
