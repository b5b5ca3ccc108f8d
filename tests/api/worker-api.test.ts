import { createHash } from 'node:crypto';
import { and, count, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { jobItems, jobs, scanResults, spectra } from '../../backend/src/db/schema';
import { encodeWorkerResult } from '../../backend/src/jobs/worker-result-body';
import type { ScanTaskResult } from '../../backend/src/jobs/scan-worker';
import { syntheticSpectrumFiles, zip } from '../helpers/spectrum-archives';
import { createTestApp, type TestApp } from '../helpers/test-app';

// The HTTP side of remote scan workers, without Redis: the server's own runner is off, and this
// test plays the worker — takes each item's file, scans it on the test app's pool, posts the result.
let t: TestApp;
let workerToken: string;

beforeAll(async () => {
  t = await createTestApp({ JOB_RUNNER: '0', SCAN_THREADS: '1' });
  const admin = await t.signIn('admin@demo.test');
  const res = await admin.post('/api/admin/worker-tokens').send({ name: 'scan-node-01' });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  workerToken = res.body.token;
}, 60_000);
afterAll(() => t.cleanup());

const asWorker = (token = workerToken) => ({ Authorization: `Bearer ${token}` });
const pendingItems = (jobId: number) => t.ctx.db.select().from(jobItems).where(and(eq(jobItems.jobId, jobId), eq(jobItems.state, 'pending'))).all();

async function takeAndScan(itemId: number, zMax = 2): Promise<ScanTaskResult> {
  const file = await request(t.app).get(`/api/worker/items/${itemId}/file`).set(asWorker()).buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });
  expect(file.status).toBe(200);
  const bytes = file.body as Buffer;
  expect(createHash('sha256').update(bytes).digest('hex')).toBe(file.headers['x-content-sha256']);
  return t.ctx.scanPool.run({ bytes: new Uint8Array(bytes), fileName: `item-${itemId}`, zMin: 0, zMax, gridStep: 'default' });
}

const post = (itemId: number, body: Buffer, token = workerToken) =>
  request(t.app).post(`/api/worker/items/${itemId}/result`).set(asWorker(token)).set('Content-Type', 'application/octet-stream').send(body);

describe('worker tokens', () => {
  it('are made by admins only, shown once, and grant nothing but the worker routes', async () => {
    const lead = await t.signIn('lead@demo.test');
    expect((await lead.post('/api/admin/worker-tokens').send({ name: 'mine' })).status).toBe(403);
    const admin = await t.signIn('admin@demo.test');
    const list = await admin.get('/api/admin/worker-tokens');
    expect(list.body.tokens).toHaveLength(1);
    expect(list.body.tokens[0]).toMatchObject({ name: 'scan-node-01', revokedAt: null, prefix: workerToken.slice(0, 12) });
    expect(JSON.stringify(list.body)).not.toContain(workerToken);

    // A worker token is no person: no campaign, no account, no admin page.
    for (const path of ['/api/auth/me', '/api/campaigns', '/api/campaigns/1/spectra', '/api/admin/users']) {
      const res = await request(t.app).get(path).set(asWorker());
      expect(res.status, path).toBe(401);
    }
    // People (cookie or personal token) cannot call the worker routes.
    expect((await lead.get('/api/worker/items/1/file')).status).toBe(403);
    const pat = (await lead.post('/api/account/tokens').send({ name: 'script' })).body.token as string;
    const withPat = await request(t.app).get('/api/worker/items/1/file').set('Authorization', `Bearer ${pat}`);
    expect(withPat.status).toBe(403);
    expect(withPat.body.error.code).toBe('worker_only');
    expect((await request(t.app).get('/api/worker/items/1/file')).status).toBe(401);
    const forged = await request(t.app).get('/api/worker/items/1/file').set(asWorker('rwwkr_' + 'x'.repeat(43)));
    expect(forged.status).toBe(401);
    expect(forged.body.error.code).toBe('invalid_token');
  });

  it('stop working once revoked', async () => {
    const admin = await t.signIn('admin@demo.test');
    const made = await admin.post('/api/admin/worker-tokens').send({ name: 'old node' });
    expect((await request(t.app).get('/api/worker/items/999999/file').set(asWorker(made.body.token))).status).toBe(404);
    const revoked = await admin.delete(`/api/admin/worker-tokens/${made.body.workerToken.id}`);
    expect(revoked.status).toBe(200);
    expect(revoked.body.workerToken.revokedAt).not.toBeNull();
    const after = await request(t.app).get('/api/worker/items/999999/file').set(asWorker(made.body.token));
    expect(after.status).toBe(401);
    expect(after.body.error.code).toBe('invalid_token');
  });
});

describe('results posted by a worker', () => {
  it('store each spectrum once with one current scan, a repeat is a no-op, and the last item finishes the job', { timeout: 60_000 }, async () => {
    const lead = await t.signIn('lead@demo.test');
    const upload = await lead.post('/api/campaigns/1/uploads').attach('files', zip(syntheticSpectrumFiles(3, { prefix: 'WRK' })), 'w.zip');
    expect(upload.status).toBe(202);
    const jobId = upload.body.jobId as number;
    // The dispatcher would mark it running as it hands the items to the queue.
    t.ctx.db.update(jobs).set({ state: 'running' }).where(eq(jobs.id, jobId)).run();
    const items = pendingItems(jobId);
    expect(items).toHaveLength(3);

    const first = await takeAndScan(items[0]!.id);
    expect(first.ok && first.scanned.ok).toBe(true);
    const body = encodeWorkerResult(first);
    const once = await post(items[0]!.id, body);
    expect(once.status, JSON.stringify(once.body)).toBe(200);
    expect(once.body).toMatchObject({ itemId: items[0]!.id, state: 'done', outcome: 'stored', applied: true });
    expect(once.body.scanId).toEqual(expect.any(Number));

    // The same result again (a worker retrying after a lost answer, or a second worker after a lock expired).
    const twice = await post(items[0]!.id, body);
    expect(twice.status).toBe(200);
    expect(twice.body).toEqual({ ...once.body, applied: false });
    const spectrumId = once.body.spectrumId as number;
    expect(t.ctx.db.select({ n: count() }).from(scanResults).where(eq(scanResults.spectrumId, spectrumId)).get()!.n).toBe(1);
    expect(t.ctx.db.select({ n: count() }).from(spectra).where(eq(spectra.uploadJobId, jobId)).get()!.n).toBe(1);
    // The stored scan is what the embedded runner would store: the posted curves, byte for byte.
    const stored = t.ctx.db.select().from(scanResults).where(eq(scanResults.id, once.body.scanId)).get()!;
    expect(first.ok && first.scanned.ok && Buffer.from(first.scanned.curves).equals(stored.curves)).toBe(true);
    expect(stored.zBest).toBe(first.ok && first.scanned.ok ? first.scanned.scan.solutions[0]!.z : NaN);

    // A finished item has no file to hand out.
    const again = await request(t.app).get(`/api/worker/items/${items[0]!.id}/file`).set(asWorker());
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('item_finished');
    expect(t.ctx.db.select().from(jobs).where(eq(jobs.id, jobId)).get()).toMatchObject({ state: 'running', done: 1 });

    // A reading failure reported by the worker fails the item, with its reason.
    const failed = await post(items[1]!.id, encodeWorkerResult({ ok: false, code: 'bad-range', message: 'Wavelength 1e308 Å in row 12 is outside 100 Å – 1 mm.' }));
    expect(failed.body).toMatchObject({ state: 'failed', outcome: null, spectrumId: null, scanId: null, applied: true });

    const third = await post(items[2]!.id, encodeWorkerResult(await takeAndScan(items[2]!.id)));
    expect(third.body).toMatchObject({ state: 'done', outcome: 'stored', applied: true });
    const job = await lead.get(`/api/jobs/${jobId}`);
    expect(job.body).toMatchObject({ state: 'done', done: 3, total: 3, summary: { stored: 2, failed: 1 } });
    expect(job.body.errors[0]).toMatchObject({ code: 'bad-range', message: 'Wavelength 1e308 Å in row 12 is outside 100 Å – 1 mm.' });
  });

  it('refuses a malformed or invalid result with a clear error and loses nothing', { timeout: 60_000 }, async () => {
    const lead = await t.signIn('lead@demo.test');
    const upload = await lead.post('/api/campaigns/1/uploads').attach('files', zip(syntheticSpectrumFiles(1, { prefix: 'BAD', pixels: 3500 })), 'b.zip');
    const [item] = pendingItems(upload.body.jobId);
    const good = await takeAndScan(item!.id);
    const body = encodeWorkerResult(good);

    const notBinary = await request(t.app).post(`/api/worker/items/${item!.id}/result`).set(asWorker()).send({ ok: true });
    expect(notBinary.status).toBe(400);
    expect(notBinary.body.error.code).toBe('result_malformed');
    const cut = await post(item!.id, body.subarray(0, body.length - 100));
    expect(cut.status).toBe(400);
    expect(cut.body.error.message).toMatch(/curves/);
    const lyingLength = Buffer.from(body);
    lyingLength.writeUInt32LE(body.length * 2, 0);
    expect((await post(item!.id, lyingLength)).body.error.code).toBe('result_malformed');
    // Valid JSON that is no scan result: a solution's z missing.
    const json = JSON.parse(body.subarray(4, 4 + body.readUInt32LE(0)).toString('utf8'));
    delete json.scanned.scan.solutions[0].z;
    const bad = encodeWorkerResult({ ...json, scanned: { ...json.scanned, curves: good.ok && good.scanned.ok ? good.scanned.curves : new Uint8Array() } });
    const invalid = await post(item!.id, bad);
    expect(invalid.status).toBe(400);
    expect(invalid.body.error.code).toBe('result_invalid');
    expect(invalid.body.error.message).toMatch(/solutions/);
    expect((await post(999_999, body)).status).toBe(404);
    // A worker on other engine code: refused before anything is recorded.
    if (!good.ok || !good.scanned.ok) throw new Error('the scan should have succeeded');
    const otherEngine = await post(item!.id, encodeWorkerResult({ ...good, scanned: { ...good.scanned, scan: { ...good.scanned.scan, engineVersion: 'redward-engine/0.0.1' } } }));
    expect(otherEngine.status).toBe(409);
    expect(otherEngine.body.error.code).toBe('engine_version_mismatch');

    expect(pendingItems(upload.body.jobId)).toHaveLength(1);
    const ok = await post(item!.id, body);
    expect(ok.body).toMatchObject({ state: 'done', outcome: 'stored', applied: true });
  });

  it('makes a re-scan current once, keeping the earlier scan for the record', { timeout: 60_000 }, async () => {
    const lead = await t.signIn('lead@demo.test');
    const rescan = await lead.post('/api/campaigns/1/rescans').send({ all: true });
    expect(rescan.status, JSON.stringify(rescan.body)).toBe(202);
    const [item] = pendingItems(rescan.body.jobId);
    const result = encodeWorkerResult(await takeAndScan(item!.id, 3));
    const first = await post(item!.id, result);
    expect(first.body).toMatchObject({ state: 'done', outcome: 'rescanned', applied: true });
    const second = await post(item!.id, result);
    expect(second.body).toMatchObject({ scanId: first.body.scanId, applied: false });
    const scans = t.ctx.db.select().from(scanResults).where(eq(scanResults.spectrumId, item!.spectrumId!)).all();
    expect(scans).toHaveLength(2);
    expect(scans.filter((s) => s.isCurrent).map((s) => s.id)).toEqual([first.body.scanId]);
  });
});
