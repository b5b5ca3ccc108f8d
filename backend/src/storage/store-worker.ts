import { lowerThisThreadPriority } from '../jobs/lower-thread-priority';
import { ArchiveRefusedError, expandArchive, type ArchiveLimits, type ExpandedEntry } from '../ingest/expand-archive';
import { BlobStore } from './blob-store';

/**
 * Runs in the store's worker thread (store-thread.ts): the CPU and file-system work of taking an
 * upload in — inflating archives, hashing, moving files into place — so that the web thread
 * keeps answering readers meanwhile. Background work, like scans: it yields the core to the web
 * thread.
 */
lowerThisThreadPriority();

const stores = new Map<string, BlobStore>();
const storeAt = (root: string) => {
  let store = stores.get(root);
  if (!store) stores.set(root, (store = new BlobStore(root)));
  return store;
};

export type ExpandResult = { ok: true; entries: ExpandedEntry[] } | { ok: false; code: ArchiveRefusedError['code']; message: string };

/** expandArchive, with a refusal as an answer (an error's class does not survive the thread boundary). */
export async function expand(task: { storeRoot: string; zipPath: string; archiveName: string; limits: ArchiveLimits }): Promise<ExpandResult> {
  try {
    return { ok: true, entries: await expandArchive(task.zipPath, task.archiveName, storeAt(task.storeRoot), task.limits) };
  } catch (err) {
    if (err instanceof ArchiveRefusedError) return { ok: false, code: err.code, message: err.message };
    throw err;
  }
}

export function hash(task: { storeRoot: string; file: string }): Promise<{ sha256: string; sizeBytes: number }> {
  return storeAt(task.storeRoot).hashFile(task.file);
}

export function commit(task: { storeRoot: string; files: { tempFile: string; sha256: string; sizeBytes: number }[] }): number {
  const store = storeAt(task.storeRoot);
  let added = 0;
  for (const f of task.files) if (!store.commitHashed(f.tempFile, f.sha256, f.sizeBytes).existed) added += 1;
  return added;
}

export type StoreTask =
  | ({ kind: 'expand' } & Parameters<typeof expand>[0])
  | ({ kind: 'hash' } & Parameters<typeof hash>[0])
  | ({ kind: 'commit' } & Parameters<typeof commit>[0]);

/**
 * The thread's entry point. piscina needs a default export to load a TypeScript worker (under
 * tsx, a module with only named exports fails to load with "Unknown file extension .ts").
 */
export default function runStoreTask(task: StoreTask): Promise<unknown> | unknown {
  switch (task.kind) {
    case 'expand':
      return expand(task);
    case 'hash':
      return hash(task);
    case 'commit':
      return commit(task);
  }
}
