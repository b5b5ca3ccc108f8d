import { availableParallelism } from 'node:os';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import type { PhotoZTask, PhotoZTaskResult } from './photoz-fit-task';
import type { ModelTask, ModelTaskResult, ScanTask, ScanTaskResult } from './scan-worker';

export interface ScanPool {
  run(task: ScanTask): Promise<ScanTaskResult>;
  model(task: ModelTask): Promise<ModelTaskResult>;
  /** Fits one photo-z job item's sources (with P(z)) off the web thread. */
  photoZ(task: PhotoZTask): Promise<PhotoZTaskResult>;
  readonly threads: number;
  destroy(): Promise<void>;
}

export interface ScanPoolOptions {
  /** Wall-clock limit of one task from the moment its thread starts on it, ms (default 60 s). */
  timeLimitMs?: number;
}

const workerFile = new URL('./scan-worker.ts', import.meta.url).href;

/**
 * Worker threads for scans, one per core by default: the engine is CPU-bound and the main
 * thread only moves results into SQLite. Workers load TypeScript through tsx. A task that runs
 * past the time limit is aborted, which makes piscina terminate its thread (a busy JavaScript
 * thread cannot be interrupted otherwise) and start a fresh one for the next task; the task then
 * answers as a failed file instead of holding a thread, and with it the job, for ever.
 */
export function createScanPool(threads = availableParallelism(), options: ScanPoolOptions = {}): ScanPool {
  const timeLimitMs = options.timeLimitMs ?? 60_000;
  const pool = new Piscina({
    filename: workerFile,
    // Threads start on the first scan, so a server with nothing to scan holds none.
    minThreads: 0,
    maxThreads: threads,
    execArgv: ['--import', 'tsx'],
    idleTimeout: 60_000,
  });
  const limit = `${timeLimitMs / 1000} s`;
  return {
    threads,
    run: (task) =>
      runLimited(pool, task, undefined, timeLimitMs, () => ({
        ok: false,
        code: 'scan_timeout',
        message: `The scan took longer than ${limit} and was stopped (SCAN_TIME_LIMIT_S); the file is kept in storage, and the rest of the upload went on without it.`,
      })) as Promise<ScanTaskResult>,
    model: (task) =>
      runLimited(pool, task, 'runModelTask', timeLimitMs, () => ({ ok: false, message: `Rebuilding the model took longer than ${limit} and was stopped.` })) as Promise<ModelTaskResult>,
    photoZ: (task) =>
      runLimited(pool, task, 'runPhotoZTask', timeLimitMs, () => ({ ok: false, message: `Fitting these targets took longer than ${limit} and was stopped.` })) as Promise<PhotoZTaskResult>,
    destroy: () => pool.destroy(),
  };
}

/**
 * Runs one task with a wall-clock limit that starts when a thread begins it (the worker posts on
 * `started`), so time spent queued or starting a thread does not count against the file.
 */
async function runLimited<T extends ScanTask | ModelTask | PhotoZTask, R>(pool: Piscina, task: T, name: string | undefined, limitMs: number, onTimeout: () => R): Promise<R> {
  const controller = new AbortController();
  const { port1, port2 } = new MessageChannel();
  let timer: NodeJS.Timeout | undefined;
  let timedOut = false;
  let finished = false;
  port1.once('message', () => {
    if (finished) return;
    timer = setTimeout(() => {
      timedOut = true;
      controller.abort();
    }, limitMs);
  });
  try {
    return (await pool.run({ ...task, started: port2 }, { ...(name ? { name } : {}), signal: controller.signal, transferList: [port2] })) as R;
  } catch (err) {
    if (timedOut) return onTimeout();
    throw err;
  } finally {
    finished = true;
    clearTimeout(timer);
    port1.close();
  }
}
