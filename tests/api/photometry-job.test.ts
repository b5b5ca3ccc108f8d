import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { count, countDistinct, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadShippedFilters } from '../../backend/src/cli/photoz-data';
import { loadConfig } from '../../backend/src/config';
import { campaignFilters, jobItems, jobs, photoZFits, targetPhotometry, targets } from '../../backend/src/db/schema';
import { DEMO_BANDS, demoFluxes } from '../../backend/src/demo/demo-photometry';
import { demoCatalogueCsv, TIDEWATER_TARGETS, type DemoTarget } from '../../backend/src/demo/demo-scenario';
import { JobRunner } from '../../backend/src/jobs/job-runner';
import { PHOTOZ_JOB_CHUNK } from '../../backend/src/jobs/photoz-job';
import { createRedward, type Redward } from '../../backend/src/server';
import { importCatalogue } from '../../backend/src/services/import-catalogue';
import { createTestApp, waitForJob, type TestApp } from '../helpers/test-app';

const FILTERS = DEMO_BANDS.map((b) => b.filter);
const invented = (id: string, truth: DemoTarget['truth'], mag: number): DemoTarget => ({ id, ra: 160.5, dec: -11.6, mag, truth, photoZ: 1, priority: 1, instrument: 'demo-grism' });
// Invented sources (as in photometry.test.ts): a z = 6.2 Lyman-break galaxy, a z = 1.3 old dusty interloper, a cool dwarf.
const DROPOUT_Z = 6.2;
const SOURCES = [
  invented('DROP-1', { class: 'lyman-break', template: 'lyman-break', z: DROPOUT_Z, snr: 5 }, 25.5),
  invented('LOWZ-1', { class: 'galaxy', template: 'galaxy-absorption', z: 1.3, snr: 5 }, 24.5),
  invented('STAR-1', { class: 'star', template: 'star-cool', z: 0, snr: 5 }, 24.5),
];
const CURVES = loadShippedFilters(FILTERS);

/** A catalogue of `sources` with fresh noise (seed) in the ten demo bands, nJy columns. */
function catalogue(sources: DemoTarget[], seed: number): string {
  return demoCatalogueCsv(sources, { filters: FILTERS, fluxes: demoFluxes(sources, CURVES, seed) });
}
const copies = (n: number, prefix: string) => Array.from({ length: n }, (_, i) => ({ ...SOURCES[i % SOURCES.length]!, id: `${prefix}-${SOURCES[i % SOURCES.length]!.id}-${i}` }));

type Listed = { catalogueId: string; photoZFit: null | { z: number; z68: [number, number]; z95: [number, number]; pLowZ: number; class: string } };

let t: TestApp;
beforeAll(async () => {
  // Above 3 rows with photometry the fit is a job (the default threshold is 2,000).
  t = await createTestApp({ PHOTOZ_JOB_THRESHOLD: '3', SCAN_THREADS: '1' });
});
afterAll(() => t.cleanup());

const upload = (agent: ReturnType<TestApp['agent']>, campaign: number, text: string) =>
  agent.post(`/api/campaigns/${campaign}/targets`).attach('files', Buffer.from(text), 'targets.csv');

describe('catalogue import: photo-z in the request or as a job', () => {
  it('fits a small catalogue (at the threshold) in the request: 200, fits stored, no job', async () => {
    const lead = await t.signIn('lead@demo.test');
    const jobsBefore = t.ctx.db.select({ n: count() }).from(jobs).get()!.n;
    const res = await upload(lead, 1, catalogue(SOURCES, 5));
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ created: 3, photoZFits: 3, photoZJobId: null });
    expect(t.ctx.db.select({ n: count() }).from(jobs).get()!.n).toBe(jobsBefore);
    const list = (await lead.get('/api/campaigns/1/targets')).body.targets as Listed[];
    const drop = list.find((x) => x.catalogueId === 'DROP-1')!.photoZFit!;
    expect(drop.z95[0]).toBeLessThanOrEqual(DROPOUT_Z);
    expect(drop.z95[1]).toBeGreaterThanOrEqual(DROPOUT_Z);
  });

  it('stores a large catalogue’s targets and fluxes in the request, answers 202 with a photo-z job, and the job fits them', async () => {
    const lead = await t.signIn('lead@demo.test');
    const sources = copies(9, 'BIG');
    const res = await upload(lead, 2, catalogue(sources, 7));
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    expect(res.body).toMatchObject({ dryRun: false, created: 9, photoZFits: 0, errors: [] });
    const jobId = res.body.photoZJobId as number;
    expect(Number.isInteger(jobId)).toBe(true);
    // The fluxes were stored before the answer, whatever the job has done since.
    const big = t.ctx.db.select({ id: targets.id }).from(targets).where(eq(targets.campaignId, 2)).all().map((r) => r.id);
    expect(big).toHaveLength(9);
    const bands = t.ctx.db.select({ n: count() }).from(targetPhotometry).innerJoin(targets, eq(targets.id, targetPhotometry.targetId)).where(eq(targets.campaignId, 2)).get()!.n;
    expect(bands).toBe(9 * FILTERS.length);

    const job = await waitForJob(lead, jobId);
    expect(job).toMatchObject({ id: jobId, kind: 'photoz', campaignId: 2, state: 'done', done: 1, total: 1, errors: [], failure: null });
    const files = (await lead.get(`/api/jobs/${jobId}/files`)).body;
    expect(files.files.map((f: { file: string; state: string }) => [f.file, f.state])).toEqual([['photo-z of catalogue targets 1–9 of 9', 'done']]);

    const list = (await lead.get('/api/campaigns/2/targets')).body.targets as Listed[];
    expect(list.filter((x) => x.photoZFit !== null)).toHaveLength(9);
    for (const x of list.filter((r) => r.catalogueId.includes('DROP-1'))) {
      const fit = x.photoZFit!;
      // The invented dropout's true z is inside its 95 % interval and the fit is near it.
      expect(fit.z95[0]).toBeLessThanOrEqual(DROPOUT_Z);
      expect(fit.z95[1]).toBeGreaterThanOrEqual(DROPOUT_Z);
      expect(Math.abs(fit.z - DROPOUT_Z) / (1 + DROPOUT_Z)).toBeLessThan(0.05);
      expect(fit.pLowZ).toBeLessThan(0.01);
    }
    for (const x of list.filter((r) => r.catalogueId.includes('LOWZ-1'))) expect(x.photoZFit!.pLowZ).toBeGreaterThan(0.5);
    for (const x of list.filter((r) => r.catalogueId.includes('STAR-1'))) expect(x.photoZFit!.class).toBe('star');
    // The SED answer reads the job's fit.
    const drop = list.find((x) => x.catalogueId.includes('DROP-1'))!;
    const id = t.ctx.db.select({ id: targets.id }).from(targets).where(eq(targets.catalogueId, drop.catalogueId)).get()!.id;
    const sed = await lead.get(`/api/campaigns/2/targets/${id}/photometry`);
    expect(sed.status).toBe(200);
    expect(sed.body.fit.z).toBe(drop.photoZFit!.z);
  });

  it('removes a re-imported large catalogue’s old fits with its old fluxes, then refits from the new ones', async () => {
    const lead = await t.signIn('lead@demo.test');
    const sources = copies(9, 'BIG');
    const before = t.ctx.db.select().from(photoZFits).all().length;
    const res = await upload(lead, 2, catalogue(sources, 8));
    expect(res.status).toBe(202);
    expect(res.body).toMatchObject({ created: 0, updated: 9 });
    const job = await waitForJob(lead, res.body.photoZJobId);
    expect(job.state).toBe('done');
    // One fit per target: replaced, not added.
    expect(t.ctx.db.select().from(photoZFits).all().length).toBe(before);
  });

  it('shows the job to a lead only', async () => {
    const reader = await t.signIn('reader1@demo.test');
    const jobId = t.ctx.db.select({ id: jobs.id }).from(jobs).where(eq(jobs.kind, 'photoz')).get()!.id;
    expect((await reader.get(`/api/jobs/${jobId}`)).status).toBe(403);
  });
});

describe('a photo-z job cut short by kill -9', () => {
  let dataDir: string;
  let redward: Redward | null = null;
  beforeAll(() => {
    dataDir = mkdtempSync(path.join(tmpdir(), 'redward-photoz-crash-'));
  });
  afterAll(async () => {
    await redward?.close();
    rmSync(dataDir, { recursive: true, force: true });
  });
  const ENV = { LOG_LEVEL: 'silent', REDWARD_DEMO_SPECTRA: '0', MAIL_CATCHER: '0', SMTP_URL: 'smtp://127.0.0.1:9', JOB_LEASE_SECONDS: '1', SCAN_THREADS: '1', PHOTOZ_JOB_THRESHOLD: '10' };
  const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
  const N = 6 * PHOTOZ_JOB_CHUNK;

  it('resumes on restart: every target fitted once, nothing lost', { timeout: 180_000 }, async () => {
    const config = loadConfig({ ...ENV, DATA_DIR: dataDir, JOB_RUNNER: '0' });
    const queueing = await createRedward(config);
    const lead = { id: 2, email: 'lead@demo.test', name: 'Lena', isAdmin: false };
    const result = importCatalogue(queueing.ctx, lead, 1, catalogue(copies(N, 'CRASH'), 11), undefined, false);
    const jobId = result.photoZJobId!;
    expect(result).toMatchObject({ created: N, photoZFits: 0 });
    await queueing.close();

    const child = spawn(process.execPath, ['--import', 'tsx', 'backend/src/cli/run-jobs.ts'], { env: { ...process.env, ...ENV, DATA_DIR: dataDir }, stdio: 'ignore' });
    const watcher = await createRedward(config);
    let doneBeforeKill = 0;
    for (let i = 0; i < 6000; i++) {
      doneBeforeKill = watcher.ctx.db.select({ done: jobs.done }).from(jobs).where(eq(jobs.id, jobId)).get()!.done;
      if (doneBeforeKill >= 1) break;
      await sleep(20);
    }
    child.kill('SIGKILL');
    await new Promise((r) => child.once('exit', r));
    const killed = watcher.ctx.db.select().from(jobs).where(eq(jobs.id, jobId)).get()!;
    const fitsAtKill = watcher.ctx.db.select({ n: count() }).from(photoZFits).get()!.n;
    await watcher.close();
    expect(killed.state).toBe('running');
    expect(killed.done).toBeGreaterThanOrEqual(1);
    expect(killed.done).toBeLessThan(6);
    // Finished items have all their fits, unfinished ones none (fits and item end are one transaction).
    expect(fitsAtKill).toBe(killed.done * PHOTOZ_JOB_CHUNK);

    redward = await createRedward(loadConfig({ ...ENV, DATA_DIR: dataDir, JOB_RUNNER: '1' }));
    const db = redward.ctx.db;
    for (let i = 0; i < 1800; i++) {
      if (db.select({ state: jobs.state }).from(jobs).where(eq(jobs.id, jobId)).get()!.state === 'done') break;
      await sleep(100);
    }
    const job = db.select().from(jobs).where(eq(jobs.id, jobId)).get()!;
    expect(job).toMatchObject({ state: 'done', done: 6, total: 6, attempts: 2 });
    expect(db.select({ n: count() }).from(jobItems).where(eq(jobItems.jobId, jobId)).get()!.n).toBe(6);
    const fits = db.select({ n: count(), targets: countDistinct(photoZFits.targetId) }).from(photoZFits).get()!;
    expect(fits).toEqual({ n: N, targets: N });
  });
});

describe('a photo-z job whose filter curve is gone before it runs', () => {
  let q: TestApp;
  beforeAll(async () => {
    q = await createTestApp({ PHOTOZ_JOB_THRESHOLD: '1', JOB_RUNNER: '0', SCAN_THREADS: '1' });
  });
  afterAll(() => q.cleanup());

  it('fails the item with a message naming the filter, ends the job, and leaves the targets without a fit', { timeout: 60_000 }, async () => {
    const lead = await q.signIn('lead@demo.test');
    const curve = ['# box filter', ...Array.from({ length: 21 }, (_, i) => `${40000 + 250 * i} ${i === 0 || i === 20 ? 0 : 0.9}`)].join('\n');
    expect((await lead.post('/api/campaigns/2/filters').field('name', 'box_f400').attach('files', Buffer.from(curve), 'box.txt')).status).toBe(201);
    const res = await upload(lead, 2, 'id,flux_box_f400,err_box_f400\nOWN-1,120,10\nOWN-2,80,10\n');
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    // The curve disappears from the database before any runner takes the job.
    q.ctx.db.delete(campaignFilters).run();
    const runner = new JobRunner(q.ctx, q.ctx.store, q.ctx.scanPool, { leaseMs: 5000, idlePollMs: 50 });
    runner.start();
    try {
      const job = await waitForJob(lead, res.body.photoZJobId);
      expect(job).toMatchObject({ state: 'done', done: 1, total: 1, failure: null });
      expect(job.errors).toEqual([{ file: 'photo-z of catalogue targets 1–2 of 2', code: 'photoz_failed', message: 'The photo-z fit of these targets stopped on an error: unknown filter box_f400' }]);
    } finally {
      await runner.stop();
    }
    expect(q.ctx.db.select().from(photoZFits).all()).toEqual([]);
  });
});

describe('imports made while a photo-z job waits', () => {
  let q: TestApp;
  beforeAll(async () => {
    q = await createTestApp({ PHOTOZ_JOB_THRESHOLD: '2', JOB_RUNNER: '0', SCAN_THREADS: '1' });
  });
  afterAll(() => q.cleanup());

  it('keep a later import’s own fit, and leave to the job the targets a later import gave no fluxes', { timeout: 60_000 }, async () => {
    const lead = await q.signIn('lead@demo.test');
    const big = await upload(lead, 1, catalogue(SOURCES, 21));
    expect(big.status).toBe(202);
    // Before the job runs, an hour later: new fluxes for the dwarf (fitted in that request) and only a new priority for the dropout.
    q.clock.advanceHours(1);
    const refluxed = await upload(lead, 1, catalogue([SOURCES[2]!], 22));
    expect(refluxed.body).toMatchObject({ photoZFits: 1, photoZJobId: null });
    const idOf = (c: string) => q.ctx.db.select({ id: targets.id }).from(targets).where(eq(targets.catalogueId, c)).get()!.id;
    const starFit = q.ctx.db.select().from(photoZFits).where(eq(photoZFits.targetId, idOf('STAR-1'))).get()!;
    const priorityOnly = await upload(lead, 1, 'id,priority\nDROP-1,5\n');
    expect(priorityOnly.status, JSON.stringify(priorityOnly.body)).toBe(200);
    expect(q.ctx.db.select().from(photoZFits).where(eq(photoZFits.targetId, idOf('DROP-1'))).get()).toBeUndefined();

    const runner = new JobRunner(q.ctx, q.ctx.store, q.ctx.scanPool, { leaseMs: 5000, idlePollMs: 50 });
    runner.start();
    try {
      expect((await waitForJob(lead, big.body.photoZJobId)).state).toBe('done');
    } finally {
      await runner.stop();
    }
    // The dwarf's fit is still the one its own import stored (same row), not the job's from the older fluxes.
    expect(q.ctx.db.select().from(photoZFits).where(eq(photoZFits.targetId, idOf('STAR-1'))).get()).toEqual(starFit);
    // The dropout got its fit from the job.
    const drop = q.ctx.db.select().from(photoZFits).where(eq(photoZFits.targetId, idOf('DROP-1'))).get()!;
    expect(drop.z95Low).toBeLessThanOrEqual(DROPOUT_Z);
    expect(drop.z95High).toBeGreaterThanOrEqual(DROPOUT_Z);
    expect(q.ctx.db.select().from(photoZFits).all()).toHaveLength(3);
  });
});
