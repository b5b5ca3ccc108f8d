import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { count, eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../backend/src/config';
import { jobItems, jobs, scanResults, spectra } from '../../backend/src/db/schema';
import { createRedward, type Redward } from '../../backend/src/server';
import { receiveUpload } from '../../backend/src/services/receive-upload';
import { syntheticSpectrumFiles } from '../helpers/spectrum-archives';
import { writeFileSync } from 'node:fs';

const ENV = (dataDir: string) => ({ DATA_DIR: dataDir, LOG_LEVEL: 'silent', REDWARD_DEMO_SPECTRA: '0', MAIL_CATCHER: '0', SMTP_URL: 'smtp://127.0.0.1:9', JOB_LEASE_SECONDS: '1', SCAN_THREADS: '1' });
const FILES = 60;

let dataDir: string;
let redward: Redward | null = null;

beforeAll(() => {
  dataDir = mkdtempSync(path.join(tmpdir(), 'redward-crash-'));
});
afterAll(async () => {
  await redward?.close();
  rmSync(dataDir, { recursive: true, force: true });
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('a job runner killed mid-job', () => {
  it('resumes on restart: the job finishes, each spectrum has exactly one current scan, nothing twice', { timeout: 180_000 }, async () => {
    // Queue an ingest job with the runner off, as a web server without a runner would.
    const config = loadConfig({ ...ENV(dataDir), JOB_RUNNER: '0' });
    const queueing = await createRedward(config);
    const lead = { id: 2, email: 'lead@demo.test', name: 'Lena', isAdmin: false };
    const files = Object.entries(syntheticSpectrumFiles(FILES, { prefix: 'CRASH' })).map(([name, bytes]) => {
      const tempFile = queueing.ctx.store.tempPath();
      writeFileSync(tempFile, bytes);
      return { originalName: name, tempFile };
    });
    const { jobId } = await receiveUpload(queueing.ctx, queueing.ctx.store, lead, 1, files);
    await queueing.close();

    // A separate runner process starts the job; kill -9 it once some, not all, items are done.
    const child = spawn(process.execPath, ['--import', 'tsx', 'backend/src/cli/run-jobs.ts'], { env: { ...process.env, ...ENV(dataDir) }, stdio: 'ignore' });
    const watcher = await createRedward(config);
    let doneBeforeKill = 0;
    for (let i = 0; i < 1200; i++) {
      doneBeforeKill = watcher.ctx.db.select({ done: jobs.done }).from(jobs).where(eq(jobs.id, jobId)).get()!.done;
      if (doneBeforeKill >= 5) break;
      await sleep(100);
    }
    child.kill('SIGKILL');
    await new Promise((r) => child.once('exit', r));
    const killed = watcher.ctx.db.select().from(jobs).where(eq(jobs.id, jobId)).get()!;
    await watcher.close();
    expect(doneBeforeKill).toBeGreaterThanOrEqual(5);
    expect(killed.state).toBe('running');
    expect(killed.done).toBeLessThan(FILES);

    // Restart: the expired lease puts the job back in the queue and the new runner finishes it.
    redward = await createRedward(loadConfig({ ...ENV(dataDir), JOB_RUNNER: '1' }));
    const db = redward.ctx.db;
    for (let i = 0; i < 1200; i++) {
      if (db.select({ state: jobs.state }).from(jobs).where(eq(jobs.id, jobId)).get()!.state === 'done') break;
      await sleep(100);
    }
    const job = db.select().from(jobs).where(eq(jobs.id, jobId)).get()!;
    expect(job).toMatchObject({ state: 'done', done: FILES, total: FILES });
    expect(job.attempts).toBe(2);
    expect(db.select({ n: count() }).from(spectra).get()!.n).toBe(FILES);
    expect(db.select({ n: count() }).from(jobItems).where(eq(jobItems.outcome, 'stored')).get()!.n).toBe(FILES);
    const perSpectrum = db
      .select({ spectrumId: scanResults.spectrumId, current: sql<number>`sum(${scanResults.isCurrent})`, all: count() })
      .from(scanResults)
      .groupBy(scanResults.spectrumId)
      .all();
    expect(perSpectrum).toHaveLength(FILES);
    expect(perSpectrum.every((r) => r.current === 1 && r.all === 1)).toBe(true);
  });
});
