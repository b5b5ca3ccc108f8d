import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { count, eq, inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { scanResults, spectra, storedFiles } from '../../backend/src/db/schema';
import { readSpectrum } from '../../backend/src/spectra/readSpectrum';
import { solutionModel } from '../../backend/src/spectra/solutionModel';
import { brokenSpectrumFiles, syntheticSpectrumFiles, zip } from '../helpers/spectrum-archives';
import { createTestApp, type TestApp, waitForJob } from '../helpers/test-app';

let t: TestApp;
let archive: Buffer;

beforeAll(async () => {
  t = await createTestApp({ SCAN_THREADS: '2' });
  archive = zip({ ...syntheticSpectrumFiles(200), ...brokenSpectrumFiles() });
}, 60_000);
afterAll(() => t.cleanup());


const countRows = (table: typeof spectra | typeof storedFiles | typeof scanResults) => t.ctx.db.select({ n: count() }).from(table).get()!.n;

describe('uploading a zip of spectra', () => {
  it('stores and scans 200 spectra and explains the 3 broken files', { timeout: 120_000 }, async () => {
    const lead = await t.signIn('lead@demo.test');
    const res = await lead.post('/api/campaigns/1/uploads').attach('files', archive, 'night1.zip');
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    expect(res.body).toMatchObject({ files: 1, entries: 203 });

    const job = await waitForJob(lead, res.body.jobId);
    expect(job.state).toBe('done');
    expect(job).toMatchObject({ done: 203, total: 203 });
    expect(job.summary).toMatchObject({ stored: 200, duplicates: 0, failed: 3 });
    const reasons = Object.fromEntries(job.errors.map((e: { file: string; code: string; message: string }) => [e.file, e]));
    expect(Object.keys(reasons).sort()).toEqual(['night1.zip/broken/empty.txt', 'night1.zip/broken/no-flux-column.csv', 'night1.zip/broken/truncated.fits']);
    expect(reasons['night1.zip/broken/empty.txt'].message).toBe('The file is empty.');
    expect(reasons['night1.zip/broken/truncated.fits'].message).toMatch(/HDU|data|bytes|truncat/i);
    expect(reasons['night1.zip/broken/no-flux-column.csv'].message).toMatch(/flux/i);

    expect(countRows(spectra)).toBe(200);
    expect(countRows(scanResults)).toBe(200);
    // Every file is kept, the broken ones too: nothing uploaded is lost.
    expect(countRows(storedFiles)).toBe(203);

    const list = await lead.get('/api/campaigns/1/spectra?sort=fileName&pageSize=5');
    expect(list.status).toBe(200);
    expect(list.body.total).toBe(200);
    expect(list.body.rows[0]).toMatchObject({ fileName: 'night1.zip/night1/TST-0001.csv', scanState: 'scanned' });
    expect(typeof list.body.rows[0].zBest).toBe('number');
    expect(list.body.rows[0]).toMatchObject({ readingsAssigned: 0, readingsDone: 0 });
    const jobsList = await lead.get('/api/campaigns/1/jobs');
    expect(jobsList.body.jobs[0]).toMatchObject({ id: res.body.jobId, kind: 'ingest', state: 'done', summary: { stored: 200, failed: 3 } });
  });

  it('recognises the same zip again as 200 duplicates and stores nothing twice', { timeout: 60_000 }, async () => {
    const lead = await t.signIn('lead@demo.test');
    const res = await lead.post('/api/campaigns/1/uploads').attach('files', archive, 'night1-again.zip');
    expect(res.status).toBe(202);
    const job = await waitForJob(lead, res.body.jobId);
    expect(job.summary).toMatchObject({ stored: 0, duplicates: 200, failed: 3 });
    expect(countRows(spectra)).toBe(200);
    expect(countRows(scanResults)).toBe(200);
    expect(countRows(storedFiles)).toBe(203);
  });

  it('refuses a zip bomb with a clear message and stores nothing', async () => {
    const lead = await t.signIn('lead@demo.test');
    const before = countRows(storedFiles);
    const bomb = zip({ 'harmless.csv': new Uint8Array(60 * 1024 * 1024) });
    expect(bomb.length).toBeLessThan(200 * 1024);
    const res = await lead.post('/api/campaigns/1/uploads').attach('files', bomb, 'bomb.zip');
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('archive_ratio');
    expect(res.body.error.message).toMatch(/bomb\.zip expands more than 200 times its size .* Nothing from this upload was stored\./);
    expect(countRows(storedFiles)).toBe(before);
    expect(readdirSync(path.join(t.ctx.config.uploadsDir, 'tmp'))).toEqual([]);
  });

  it('refuses an upload from a reader before reading it', async () => {
    const reader = await t.signIn('reader1@demo.test');
    const before = countRows(storedFiles);
    const res = await reader.post('/api/campaigns/1/uploads').attach('files', Buffer.from('wavelength,flux\n1,2\n'), 'sneaky.csv');
    expect(res.status).toBe(403);
    expect(countRows(storedFiles)).toBe(before);
  });

  it('streams progress as server-sent events, ending with the finished job', async () => {
    const lead = await t.signIn('lead@demo.test');
    const res = await lead.get('/api/jobs/1/events').buffer(true).parse((r, done) => {
      let text = '';
      r.on('data', (c: Buffer) => (text += c.toString()));
      r.on('end', () => done(null, text));
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/event-stream/);
    const events = String(res.body).split('\n\n').filter((e) => e.startsWith('event: progress'));
    const last = JSON.parse(events.at(-1)!.split('\ndata: ')[1]!);
    expect(last).toMatchObject({ id: 1, state: 'done', done: 203, total: 203 });
  });

  it('lets a lead link an unlinked spectrum by hand, and re-links by catalogue id on import', async () => {
    const lead = await t.signIn('lead@demo.test');
    const catalogue = 'id,ra,dec\nTST-0001,150.1,2.2\nTST-0002,150.2,2.3\n';
    const imported = await lead.post('/api/campaigns/1/targets').attach('files', Buffer.from(catalogue), 'cat.csv');
    expect(imported.status).toBe(200);
    // TST-0001 and TST-0002 are in the spectra's file names: the import links them.
    expect(imported.body.linked).toBe(2);
    const unlinked = await lead.get('/api/campaigns/1/spectra?linked=no&pageSize=1&sort=fileName');
    expect(unlinked.body.total).toBe(198);
    const spectrumId = unlinked.body.rows[0].id;
    const targetId = (await lead.get('/api/campaigns/1/targets?q=TST-0002')).body.targets[0].id;
    const linked = await lead.patch(`/api/spectra/${spectrumId}/target`).send({ targetId });
    expect(linked.status).toBe(200);
    const reader = await t.signIn('reader1@demo.test');
    expect((await reader.patch(`/api/spectra/${spectrumId}/target`).send({ targetId: null })).status).toBe(403);
    const row = (await lead.get('/api/campaigns/1/spectra?linked=yes&q=TST-0002&pageSize=10')).body.rows;
    expect(row.map((r: { target: { catalogueId: string } }) => r.target.catalogueId)).toEqual(['TST-0002', 'TST-0002']);
  });

  it('offers a re-scan after the redshift range changes, keeping the earlier results', { timeout: 90_000 }, async () => {
    const lead = await t.signIn('lead@demo.test');
    const upload = await lead.post('/api/campaigns/2/uploads').attach('files', zip(syntheticSpectrumFiles(6, { prefix: 'RESCAN' })), 'six.zip');
    await waitForJob(lead, upload.body.jobId);
    expect((await lead.get('/api/campaigns/2/scan-status')).body).toMatchObject({ spectra: 6, upToDate: 6, stale: 0, zMin: 0, zMax: 9 });
    expect((await lead.post('/api/campaigns/2/rescans').send({})).body.error.code).toBe('nothing_to_rescan');

    await lead.patch('/api/campaigns/2').send({ zMax: 7 });
    expect((await lead.get('/api/campaigns/2/scan-status')).body).toMatchObject({ upToDate: 0, stale: 6, zMax: 7 });
    const rescan = await lead.post('/api/campaigns/2/rescans').send({});
    expect(rescan.status).toBe(202);
    expect(rescan.body.spectra).toBe(6);
    const job = await waitForJob(lead, rescan.body.jobId);
    expect(job).toMatchObject({ kind: 'scan', state: 'done', summary: { rescanned: 6, failed: 0 } });
    expect((await lead.get('/api/campaigns/2/scan-status')).body).toMatchObject({ upToDate: 6, stale: 0 });
    const ids = (await lead.get('/api/campaigns/2/spectra')).body.rows.map((r: { id: number }) => r.id);
    const rows = t.ctx.db.select().from(scanResults).where(inArray(scanResults.spectrumId, ids)).all();
    expect(rows).toHaveLength(12);
    expect(rows.filter((r) => r.isCurrent).every((r) => (r.settings as { zMax: number }).zMax === 7)).toBe(true);
    expect(rows.filter((r) => r.isCurrent)).toHaveLength(6);
  });

  it('offers a re-scan after the scan grid changes, and scans on each file\'s own sampling', { timeout: 90_000 }, async () => {
    const lead = await t.signIn('lead@demo.test');
    const ids = (await lead.get('/api/campaigns/2/spectra')).body.rows.map((r: { id: number }) => r.id);
    const current = () => t.ctx.db.select().from(scanResults).where(inArray(scanResults.spectrumId, ids)).all().filter((r) => r.isCurrent);
    expect(current().map((r) => r.settings)).toEqual(Array(6).fill({ zMin: 0, zMax: 7, gridStep: 'default' }));

    // A scan stored before campaigns had a grid setting carries none: it was made on the default grid.
    const legacy = current()[0]!;
    t.ctx.db.update(scanResults).set({ settings: { zMin: 0, zMax: 7 } }).where(eq(scanResults.id, legacy.id)).run();
    expect((await lead.get('/api/campaigns/2/scan-status')).body).toMatchObject({ upToDate: 6, stale: 0, gridStep: 'default' });
    expect((await lead.get(`/api/spectra/${legacy.spectrumId}`)).body.scan.settings).toEqual({ zMin: 0, zMax: 7, gridStep: 'default' });

    expect((await lead.patch('/api/campaigns/2').send({ gridStep: 'native' })).status).toBe(200);
    expect((await lead.get('/api/campaigns/2/scan-status')).body).toMatchObject({ spectra: 6, upToDate: 0, stale: 6, zMax: 7, gridStep: 'native' });
    const rescan = await lead.post('/api/campaigns/2/rescans').send({});
    expect(rescan.status).toBe(202);
    expect(rescan.body.spectra).toBe(6);
    const job = await waitForJob(lead, rescan.body.jobId);
    expect(job).toMatchObject({ kind: 'scan', state: 'done', summary: { rescanned: 6, failed: 0 } });
    expect((await lead.get('/api/campaigns/2/scan-status')).body).toMatchObject({ upToDate: 6, stale: 0, gridStep: 'native' });
    // 2000 pixels over 3600–9800 Å are log10(9800/3600)/1999 = 2.18e-4 dex wide: the nearest grid level is 2e-4.
    expect(current().map((r) => [(r.settings as { gridStep: string }).gridStep, (r.meta as { step: number }).step])).toEqual(Array(6).fill(['native', 2e-4]));
  });

  it("stores a native-grid scan at the file's snapped pixel and rebuilds its model on the same grid", { timeout: 90_000 }, async () => {
    const lead = await t.signIn('lead@demo.test');
    const created = await lead.post('/api/campaigns').send({ name: 'Prism arcs', gridStep: 'native' });
    expect(created.status).toBe(201);
    const campaignId: number = created.body.campaign.id;
    // 1088 pixels log-uniform over 3600–9800 Å: log10(9800/3600)/1087 = 4.0008e-4 dex, nearest level 4e-4.
    const upload = await lead.post(`/api/campaigns/${campaignId}/uploads`).attach('files', zip(syntheticSpectrumFiles(2, { pixels: 1088, prefix: 'PRISM' })), 'prism.zip');
    expect(upload.status).toBe(202);
    const job = await waitForJob(lead, upload.body.jobId);
    expect(job.summary).toMatchObject({ stored: 2, failed: 0 });

    const stored = t.ctx.db.select({ id: spectra.id, sha256: spectra.sha256, pixels: spectra.pixels }).from(spectra).where(eq(spectra.campaignId, campaignId)).all();
    expect(stored.map((s) => s.pixels)).toEqual([1088, 1088]);
    for (const s of stored) {
      const detail = (await lead.get(`/api/spectra/${s.id}`)).body;
      expect(detail.campaign.gridStep).toBe('native');
      expect(detail.scan.settings).toEqual({ zMin: 0, zMax: 9, gridStep: 'native' });
      expect(detail.scan.meta.step).toBe(4e-4);
    }

    const { id, sha256 } = stored[0]!;
    const top = (await lead.get(`/api/spectra/${id}`)).body.scan.solutions[0];
    const res = await lead.get(`/api/spectra/${id}/solutions/1/model`).buffer(true).parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    const served = Array.from(new Float32Array(new Uint8Array(res.body as Buffer).buffer));
    const spectrum = readSpectrum(readFileSync(t.ctx.store.pathOf(sha256)));
    const onNative = Array.from(new Float32Array(solutionModel(spectrum, top, { zMin: 0, zMax: 9, step: 'native' })));
    const onDefault = Array.from(new Float32Array(solutionModel(spectrum, top, { zMin: 0, zMax: 9 })));
    expect(served).toHaveLength(1088);
    expect(served).toEqual(onNative);
    expect(served).not.toEqual(onDefault);
  });

  it('says when no file arrived', async () => {
    const lead = await t.signIn('lead@demo.test');
    const res = await lead.post('/api/campaigns/1/uploads').field('note', 'forgot the files');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('no_files');
  });
});

describe('upload limits', () => {
  let small: TestApp;
  beforeAll(async () => {
    small = await createTestApp({ UPLOAD_MAX_FILE_MB: '1', UPLOAD_MAX_TOTAL_MB: '3', JOB_RUNNER: '0' });
  });
  afterAll(() => small.cleanup());

  it('answers 413 for a file over the per-file limit and keeps nothing', async () => {
    const lead = await small.signIn('lead@demo.test');
    const res = await lead.post('/api/campaigns/1/uploads').attach('files', Buffer.alloc(1024 * 1024 + 10, 65), 'huge.txt');
    expect(res.status).toBe(413);
    expect(res.body.error).toEqual({
      code: 'file_too_large',
      message: 'A file is larger than the 1 MB limit for one file (files). Nothing from this upload was stored.',
    });
    expect(readdirSync(path.join(small.ctx.config.uploadsDir, 'tmp'))).toEqual([]);
  });

  it('cancels a queued job at once, and refuses to cancel it twice', async () => {
    const lead = await small.signIn('lead@demo.test');
    const upload = await lead.post('/api/campaigns/1/uploads').attach('files', Buffer.from('wavelength,flux\n4000,1\n'), 'one.csv');
    expect(upload.status).toBe(202);
    const cancelled = await lead.post(`/api/jobs/${upload.body.jobId}/cancel`);
    expect(cancelled.status).toBe(200);
    expect(cancelled.body.state).toBe('cancelled');
    const again = await lead.post(`/api/jobs/${upload.body.jobId}/cancel`);
    expect(again.status).toBe(400);
    expect(again.body.error).toEqual({ code: 'job_finished', message: 'The job has already ended (cancelled).' });
  });

  it('answers 413 from the declared length when the whole upload is too large', async () => {
    const lead = await small.signIn('lead@demo.test');
    const res = await lead.post('/api/campaigns/1/uploads').set('Content-Length', String(2 * 1024 ** 3)).send('');
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('upload_too_large');
    expect(res.body.error.message).toMatch(/The upload is 2048 MB; one upload may be at most 3 MB/);
  });
});
