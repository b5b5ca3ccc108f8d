import { availableParallelism } from 'node:os';
import { Piscina } from 'piscina';
import type { ModelTask, ModelTaskResult, ScanTask, ScanTaskResult } from './scan-worker';

export interface ScanPool {
  run(task: ScanTask): Promise<ScanTaskResult>;
  model(task: ModelTask): Promise<ModelTaskResult>;
  readonly threads: number;
  destroy(): Promise<void>;
}

const workerFile = new URL('./scan-worker.ts', import.meta.url).href;

/**
 * Worker threads for scans, one per core by default: the engine is CPU-bound and the main
 * thread only moves results into SQLite. Workers load TypeScript through tsx.
 */
export function createScanPool(threads = availableParallelism()): ScanPool {
  const pool = new Piscina({
    filename: workerFile,
    // Threads start on the first scan, so a server with nothing to scan holds none.
    minThreads: 0,
    maxThreads: threads,
    execArgv: ['--import', 'tsx'],
    idleTimeout: 60_000,
  });
  return {
    threads,
    run: (task) => pool.run(task) as Promise<ScanTaskResult>,
    model: (task) => pool.run(task, { name: 'runModelTask' }) as Promise<ModelTaskResult>,
    destroy: () => pool.destroy(),
  };
}
