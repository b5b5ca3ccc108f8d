import { availableParallelism } from 'node:os';
import { Piscina } from 'piscina';
import { ArchiveRefusedError, type ArchiveLimits, type ExpandedEntry } from '../ingest/expand-archive';
import type { BlobStore } from './blob-store';
import type { ExpandResult, StoreTask } from './store-worker';

const workerFile = new URL('./store-worker.ts', import.meta.url).href;

let pool: Piscina | null = null;

/**
 * The thread(s) that take uploads into the store, started on the first upload and stopped when
 * idle (piscina unreferences idle threads, so they never keep a process alive). Before this,
 * expanding a 2,000-file archive and storing its files held the web thread for ≈ 3–4 s in bursts
 * (CPU profile, issue 13's load benchmark). One thread on a two-core machine, so that a core stays
 * for the web thread and the scans; two at most.
 */
function storePool(): Piscina {
  pool ??= new Piscina({
    filename: workerFile,
    minThreads: 0,
    maxThreads: Math.max(1, Math.min(2, availableParallelism() - 1)),
    idleTimeout: 30_000,
    execArgv: ['--import', 'tsx'],
  });
  return pool;
}

/** expandArchive (same limits, same refusals, same streaming), run on the store's thread. */
export async function expandArchiveOffThread(zipPath: string, archiveName: string, store: BlobStore, limits: ArchiveLimits): Promise<ExpandedEntry[]> {
  const result = (await storePool().run({ kind: 'expand', storeRoot: store.root, zipPath, archiveName, limits } satisfies StoreTask)) as ExpandResult;
  if (!result.ok) throw new ArchiveRefusedError(result.code, result.message);
  return result.entries;
}

/** BlobStore.hashFile on the store's thread. */
export async function hashFileOffThread(store: BlobStore, file: string): Promise<{ sha256: string; sizeBytes: number }> {
  return (await storePool().run({ kind: 'hash', storeRoot: store.root, file } satisfies StoreTask)) as { sha256: string; sizeBytes: number };
}

/** BlobStore.commitHashed for each file, in order, on the store's thread; how many were new. */
export async function commitOffThread(store: BlobStore, files: { tempFile: string; sha256: string; sizeBytes: number }[]): Promise<number> {
  return (await storePool().run({ kind: 'commit', storeRoot: store.root, files } satisfies StoreTask)) as number;
}
