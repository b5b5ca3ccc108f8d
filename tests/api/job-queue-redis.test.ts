import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { and, count, eq, ne, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../backend/src/config';
import { jobItems, jobs, scanResults, spectra } from '../../backend/src/db/schema';
import { startServer, type RunningServer } from '../../backend/src/server';
import { createWorkerToken } from '../../backend/src/services/worker-tokens';
import { startRedis, type TestRedis } from '../helpers/redis-server';
import { syntheticSpectrumFiles, zip } from '../helpers/spectrum-archives';

// The Redis queue end to end: redis-server, the web server (dispatching to BullMQ), two worker
// processes exactly as `npm run jobs` starts them on other machines; one is killed with SIGKILL
// in the middle of an item.
const FILES = 16;
const LEASE_SECONDS = '2';

let redis: TestRedis;
let server: RunningServer;
let dataDir: string;
const workers: ChildProcess[] = [];
let survivor: WorkerProcess | null = null;

interface WorkerProcess {
  child: ChildProcess;
  lines: string[];
  /** Resolves on the first line matching, among the lines from index `from` on. */
  waitFor(pattern: RegExp, options?: { from?: number; timeoutMs?: number }): Promise<RegExpExecArray>;
}

function startWorker(token: string): WorkerProcess {
  const child = spawn(process.execPath, ['--import', 'tsx', 'backend/src/cli/run-jobs.ts'], {
    env: {
      ...process.env,
      JOB_QUEUE: redis.url,
      REDWARD_SERVER_URL: `http://127.0.0.1:${server.port}`,
      REDWARD_WORKER_TOKEN: token,
      SCAN_THREADS: '1',
      JOB_LEASE_SECONDS: LEASE_SECONDS,
      DATA_DIR: path.join(dataDir, 'worker-never-writes-here'),
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  workers.push(child);
  const lines: string[] = [];
  const waiters: { pattern: RegExp; resolve: (m: RegExpExecArray) => void }[] = [];
  let partial = '';
  const onText = (chunk: Buffer) => {
    partial += chunk.toString('utf8');
    const parts = partial.split('\n');
    partial = parts.pop()!;
    for (const line of parts) {
      lines.push(line);
      for (const w of waiters.splice(0)) {
        const m = w.pattern.exec(line);
        if (m) w.resolve(m);
        else waiters.push(w);
      }
    }
  };
  child.stdout!.on('data', onText);
  child.stderr!.on('data', onText);
  return {
    child,
    lines,
    waitFor(pattern, { from = 0, timeoutMs = 40_000 } = {}) {
      for (const line of lines.slice(from)) {
        const m = pattern.exec(line);
        if (m) return Promise.resolve(m);
      }
      return new Promise((resolve, reject) => {
        const timer = setTimeout(() => reject(new Error(`no line matching ${pattern} within ${timeoutMs} ms; the worker said:\n${lines.join('\n')}`)), timeoutMs);
        waiters.push({ pattern, resolve: (m) => (clearTimeout(timer), resolve(m)) });
      });
    },
  };
}

beforeAll(async () => {
  dataDir = mkdtempSync(path.join(tmpdir(), 'redward-redis-queue-'));
  redis = await startRedis();
  server = await startServer(
    loadConfig({
      DATA_DIR: dataDir,
      PORT: '0',
      HOST: '127.0.0.1',
      LOG_LEVEL: 'silent',
      MAIL_CATCHER_PORT: '0',
      REDWARD_DEMO_SPECTRA: '0',
      JOB_QUEUE: redis.url,
      JOB_LEASE_SECONDS: LEASE_SECONDS,
    }),
  );
}, 60_000);

afterAll(async () => {
  for (const w of workers) if (w.exitCode === null && w.signalCode === null) w.kill('SIGKILL');
  await server?.close();
  await redis?.stop();
  rmSync(dataDir, { recursive: true, force: true });
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('scan workers on other machines (JOB_QUEUE=redis://…)', () => {
  it('finish the job after one is killed mid-item: every spectrum has exactly one current scan', { timeout: 90_000 }, async () => {
    const t0 = performance.now();
    const mark = (what: string) => console.log(`${((performance.now() - t0) / 1000).toFixed(1)} s: ${what}`);
    const { token } = createWorkerToken(server.ctx, null, 'test workers');
    const a = startWorker(token);
    const b = startWorker(token);
    survivor = b;
    await Promise.all([a.waitFor(/^Redward scan worker: 1 thread/), b.waitFor(/^Redward scan worker: 1 thread/)]);

    mark('both workers up');
    const login = await fetch(`${server.url}/api/auth/login`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email: 'lead@demo.test', password: 'redward-demo' }) });
    const headers = { cookie: login.headers.get('set-cookie')!.split(';')[0]!, origin: server.url };
    const form = new FormData();
    // 8,000-pixel spectra: a scan lasts long enough that a kill lands inside one.
    form.append('files', new Blob([new Uint8Array(zip(syntheticSpectrumFiles(FILES, { pixels: 8000, prefix: 'RQ' })))]), 'night.zip');
    const upload = await fetch(`${server.url}/api/campaigns/1/uploads`, { method: 'POST', headers, body: form });
    expect(upload.status).toBe(202);
    const { jobId } = (await upload.json()) as { jobId: number };

    // Worker A has recorded two items; kill it the moment it takes its next one.
    const recordedByA = () => a.lines.filter((l) => /^item \d+ recorded/.test(l)).length;
    await a.waitFor(/^item \d+ recorded/);
    const afterFirst = a.lines.length;
    await a.waitFor(/^item \d+ recorded/, { from: afterFirst });
    const heldItem = Number((await a.waitFor(/^item (\d+) taken/, { from: a.lines.length }))[1]);
    mark(`killing worker A inside item ${heldItem}`);
    a.child.kill('SIGKILL');
    await new Promise((r) => a.child.once('exit', r));
    // Killed inside the item: A never recorded it.
    expect(a.lines.some((l) => l.startsWith(`item ${heldItem} recorded`))).toBe(false);
    const db = server.ctx.db;
    expect(db.select({ state: jobItems.state }).from(jobItems).where(eq(jobItems.id, heldItem)).get()!.state).toBe('pending');

    // Its lock runs out (JOB_LEASE_SECONDS) and B takes the item back from the queue.
    await b.waitFor(new RegExp(`^item ${heldItem} recorded: done \\(stored\\)`));
    mark(`worker B recorded item ${heldItem}`);
    for (let i = 0; i < 400; i++) {
      if (db.select({ state: jobs.state }).from(jobs).where(eq(jobs.id, jobId)).get()!.state === 'done') break;
      await sleep(100);
    }
    mark('job finished');
    const job = db.select().from(jobs).where(eq(jobs.id, jobId)).get()!;
    expect(job).toMatchObject({ state: 'done', done: FILES, total: FILES });
    expect(db.select({ n: count() }).from(spectra).get()!.n).toBe(FILES);
    expect(db.select({ n: count() }).from(jobItems).where(eq(jobItems.outcome, 'stored')).get()!.n).toBe(FILES);
    const perSpectrum = db
      .select({ spectrumId: scanResults.spectrumId, current: sql<number>`sum(${scanResults.isCurrent})`, all: count() })
      .from(scanResults)
      .groupBy(scanResults.spectrumId)
      .all();
    expect(perSpectrum).toHaveLength(FILES);
    expect(perSpectrum.filter((r) => r.current !== 1 || r.all !== 1)).toEqual([]);
    // Both workers did part of the job.
    const recordedByB = b.lines.filter((l) => /^item \d+ recorded/.test(l)).length;
    expect(recordedByA() + recordedByB).toBe(FILES);
    expect(recordedByA()).toBeGreaterThanOrEqual(2);
    expect(recordedByB).toBeGreaterThan(0);
  });

  it('queue again what Redis lost (a restart without persistence) and still finish', { timeout: 60_000 }, async () => {
    const b = survivor!;
    const login = await fetch(`${server.url}/api/auth/login`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email: 'lead@demo.test', password: 'redward-demo' }) });
    const headers = { cookie: login.headers.get('set-cookie')!.split(';')[0]!, origin: server.url };
    const form = new FormData();
    form.append('files', new Blob([new Uint8Array(zip(syntheticSpectrumFiles(8, { pixels: 7000, prefix: 'LOST' })))]), 'lost.zip');
    const from = b.lines.length;
    const upload = await fetch(`${server.url}/api/campaigns/1/uploads`, { method: 'POST', headers, body: form });
    const { jobId } = (await upload.json()) as { jobId: number };
    await b.waitFor(/^item \d+ recorded/, { from });
    // Empty Redis under the running job, as a restart of a Redis without persistence would.
    const { Redis } = await import('ioredis');
    const admin = new Redis({ host: '127.0.0.1', port: redis.port });
    expect(await admin.flushall()).toBe('OK');
    await admin.quit();
    const db = server.ctx.db;
    for (let i = 0; i < 400; i++) {
      if (db.select({ state: jobs.state }).from(jobs).where(eq(jobs.id, jobId)).get()!.state === 'done') break;
      await sleep(100);
    }
    expect(db.select().from(jobs).where(eq(jobs.id, jobId)).get()).toMatchObject({ state: 'done', done: 8, total: 8 });
    const stored = db.select({ n: count() }).from(jobItems).where(eq(jobItems.jobId, jobId)).all()[0]!.n;
    expect(stored).toBe(8);
    const perSpectrum = db
      .select({ current: sql<number>`sum(${scanResults.isCurrent})`, all: count() })
      .from(scanResults)
      .innerJoin(spectra, eq(spectra.id, scanResults.spectrumId))
      .where(eq(spectra.uploadJobId, jobId))
      .groupBy(scanResults.spectrumId)
      .all();
    expect(perSpectrum).toHaveLength(8);
    expect(perSpectrum.every((r) => r.current === 1 && r.all === 1)).toBe(true);
  });

  it('stop scanning a cancelled job: it ends cancelled and its remaining items are left alone', { timeout: 60_000 }, async () => {
    const b = survivor!;
    const login = await fetch(`${server.url}/api/auth/login`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email: 'lead@demo.test', password: 'redward-demo' }) });
    const headers = { cookie: login.headers.get('set-cookie')!.split(';')[0]!, origin: server.url };
    const form = new FormData();
    form.append('files', new Blob([new Uint8Array(zip(syntheticSpectrumFiles(30, { pixels: 6000, prefix: 'CANCEL' })))]), 'cancel.zip');
    const from = b.lines.length;
    const upload = await fetch(`${server.url}/api/campaigns/1/uploads`, { method: 'POST', headers, body: form });
    const { jobId } = (await upload.json()) as { jobId: number };
    await b.waitFor(/^item \d+ recorded/, { from });
    const cancel = await fetch(`${server.url}/api/jobs/${jobId}/cancel`, { method: 'POST', headers });
    expect(cancel.status).toBe(200);
    const db = server.ctx.db;
    for (let i = 0; i < 100; i++) {
      if (db.select({ state: jobs.state }).from(jobs).where(eq(jobs.id, jobId)).get()!.state === 'cancelled') break;
      await sleep(100);
    }
    expect(db.select({ state: jobs.state }).from(jobs).where(eq(jobs.id, jobId)).get()!.state).toBe('cancelled');
    // Whatever was in flight may finish; after that nothing more of this job is scanned.
    await sleep(3000);
    const done = db.select({ n: count() }).from(jobItems).where(and(eq(jobItems.jobId, jobId), ne(jobItems.state, 'pending'))).get()!.n;
    await sleep(2000);
    expect(db.select({ n: count() }).from(jobItems).where(and(eq(jobItems.jobId, jobId), ne(jobItems.state, 'pending'))).get()!.n).toBe(done);
    expect(done).toBeLessThan(30);
    expect(done).toBeGreaterThan(0);
  });
});
