import { readlinkSync } from 'node:fs';
import { getPriority, setPriority } from 'node:os';
import { isMainThread } from 'node:worker_threads';

/**
 * Scan threads run at a lower scheduling priority than the web thread, so that a survey-sized
 * upload being scanned on every core does not make readers wait: when the web thread has work it
 * gets the core first, and when it is idle the scans take all of it (no throughput is lost on an
 * idle server, unlike keeping a core in reserve).
 *
 * On Linux, niceness is per thread, and setpriority(2) with a thread id changes only that thread;
 * a worker finds its own id from /proc/thread-self (a link to "<pid>/task/<tid>"). Elsewhere, or
 * where the link or the call is refused, the thread keeps its priority: this is an optimisation,
 * never a reason for a scan to fail.
 */
export const SCAN_THREAD_NICENESS = 10;

/** Lowers the calling worker thread's priority; returns its thread id, or null where nothing changed. */
export function lowerThisThreadPriority(niceness = SCAN_THREAD_NICENESS): number | null {
  // Never the main thread: that is the web server this exists to protect.
  if (isMainThread || process.platform !== 'linux') return null;
  try {
    const tid = Number(readlinkSync('/proc/thread-self').split('/').pop());
    if (!Number.isInteger(tid) || tid <= 0) return null;
    // Only ever lower it: a server already started under `nice` keeps its own, lower, priority.
    if (getPriority(tid) < niceness) setPriority(tid, niceness);
    return tid;
  } catch {
    return null;
  }
}
