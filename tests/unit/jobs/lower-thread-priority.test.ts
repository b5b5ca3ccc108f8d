import { readFileSync } from 'node:fs';
import { Piscina } from 'piscina';
import { describe, expect, it } from 'vitest';
import { lowerThisThreadPriority, SCAN_THREAD_NICENESS } from '../../../backend/src/jobs/lower-thread-priority';

const niceOf = (statPath: string) => Number(readFileSync(statPath, 'utf8').split(') ')[1]!.split(' ')[16]);

describe.runIf(process.platform === 'linux')('scan threads at a lower priority than the web thread', () => {
  it('lowers only the worker thread that asks, never the process or the main thread', async () => {
    const pool = new Piscina({ filename: new URL('./fixtures/niceness-worker.ts', import.meta.url).href, maxThreads: 1, execArgv: ['--import', 'tsx'] });
    const result = (await pool.run(null)) as { tid: number | null; before: number; after: number; process: number };
    await pool.destroy();
    expect(result.tid).toBeGreaterThan(0);
    expect(result.after).toBe(Math.max(result.before, SCAN_THREAD_NICENESS));
    // The main thread (the process's first thread) keeps its priority.
    expect(result.process).toBe(result.before);
  });

  it('does nothing on the main thread', () => {
    const before = niceOf('/proc/self/stat');
    expect(lowerThisThreadPriority()).toBeNull();
    expect(niceOf('/proc/self/stat')).toBe(before);
  });
});
