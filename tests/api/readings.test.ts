import { decodeScanCurves } from '../../backend/src/contracts/scan-curves-binary';
import { and, desc, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spectrumDetailSchema } from '../../backend/src/contracts/spectra';
import { auditEvents, readings } from '../../backend/src/db/schema';
import { signInDemoMembers, uploadAssignedSpectra, type Agent } from '../helpers/assigned-spectra';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let spectrumIds: number[];
let reader1: Agent;
let reader2: Agent;
let lead: Agent;
let observer: Agent;

beforeAll(async () => {
  t = await createTestApp({ SCAN_THREADS: '2' });
  spectrumIds = await uploadAssignedSpectra(t, 4, 'READ');
  ({ reader1, reader2, lead, observer } = await signInDemoMembers(t));
}, 60_000);
afterAll(() => t.cleanup());

describe('the reading queue', () => {
  it('lists the assigned, unread spectra with their first/second order', async () => {
    const q1 = (await reader1.get('/api/me/queue?campaign=1')).body;
    const q2 = (await reader2.get('/api/me/queue?campaign=1')).body;
    expect(q1).toHaveLength(4);
    expect(q1.every((q: { readingOrder: string }) => q.readingOrder === 'first')).toBe(true);
    expect(q2.every((q: { readingOrder: string }) => q.readingOrder === 'second')).toBe(true);
    expect(q1[0]).toMatchObject({ campaignId: 1, fileName: 'night1/READ-0001.csv' });
    expect(typeof q1[0].zBest).toBe('number');
  });

  it('is refused to observers and to people outside the campaign', async () => {
    expect((await observer.get('/api/me/queue?campaign=1')).status).toBe(403);
    expect((await observer.get('/api/me/queue?campaign=2')).status).toBe(404);
    expect((await reader1.get('/api/me/queue')).status).toBe(400);
  });
});

describe('readings', () => {
  const good = { z: 0.2, grade: 'sure', class: 'galaxy', lines: ['H-alpha', '[N II] 6585'], note: 'Hα + [N II] clear' };

  it('saves a reading once: a double submit changes nothing', async () => {
    const id = spectrumIds[0]!;
    const first = await reader1.post(`/api/spectra/${id}/readings`).send({ ...good, timeSpentMs: 12_000 });
    expect(first.status, JSON.stringify(first.body)).toBe(200);
    expect(first.body).toMatchObject({ changed: true, reading: { z: 0.2, grade: 'sure', class: 'galaxy', readingOrder: 'first', revision: 1, timeSpentMs: 12_000 } });
    const again = await reader1.post(`/api/spectra/${id}/readings`).send({ ...good, timeSpentMs: 12_000 });
    expect(again.body).toMatchObject({ changed: false, reading: { id: first.body.reading.id, revision: 1 } });
    expect(t.ctx.db.select().from(readings).where(eq(readings.spectrumId, id)).all()).toHaveLength(1);
    expect((await reader1.get('/api/me/queue?campaign=1')).body.map((q: { id: number }) => q.id)).not.toContain(id);
  });

  it('keeps every revision in the audit trail', async () => {
    const id = spectrumIds[0]!;
    const revised = await reader1.post(`/api/spectra/${id}/readings`).send({ ...good, grade: 'likely', timeSpentMs: 3_000 });
    expect(revised.body).toMatchObject({ changed: true, reading: { grade: 'likely', revision: 2, timeSpentMs: 15_000 } });
    const event = t.ctx.db.select().from(auditEvents).where(and(eq(auditEvents.action, 'reading.revised'), eq(auditEvents.subjectId, revised.body.reading.id))).orderBy(desc(auditEvents.id)).get()!;
    expect(event.before).toMatchObject({ grade: 'sure', revision: 1 });
    expect(event.after).toMatchObject({ grade: 'likely', revision: 2 });
  });

  it('is blind: the second reader never sees the first reading; the lead sees both', async () => {
    const id = spectrumIds[0]!;
    const forReader2 = (await reader2.get(`/api/spectra/${id}`)).body;
    // The answer has exactly the shape the shared contract (and so the inspection screen) expects.
    expect(spectrumDetailSchema.safeParse(forReader2).error).toBeUndefined();
    expect(forReader2.readings).toEqual([]);
    expect(forReader2.assignment).toEqual({ readingOrder: 'second' });
    await reader2.post(`/api/spectra/${id}/readings`).send({ ...good, z: 0.2004 });
    const forLead = (await lead.get(`/api/spectra/${id}`)).body;
    expect(forLead.readings.map((r: { readingOrder: string; z: number }) => [r.readingOrder, r.z])).toEqual([
      ['first', 0.2],
      ['second', 0.2004],
    ]);
    const forReader1 = (await reader1.get(`/api/spectra/${id}`)).body;
    expect(forReader1.readings.map((r: { reader: { name: string } }) => r.reader.name)).toEqual(['Rafael Demo (reader 1)']);
    expect((await observer.get(`/api/spectra/${id}`)).body.readings).toEqual([]);
  });

  it('refuses a z outside the campaign range, a grade not in the scheme and unknown lines, storing nothing', async () => {
    const id = spectrumIds[1]!;
    const outside = await reader1.post(`/api/spectra/${id}/readings`).send({ ...good, z: 9.5 });
    expect(outside.status).toBe(400);
    expect(outside.body.error).toEqual({ code: 'z_out_of_range', message: "z = 9.5 lies outside this campaign's range 0 ≤ z ≤ 9." });
    const grade = await reader1.post(`/api/spectra/${id}/readings`).send({ ...good, grade: 'firm' });
    expect(grade.body.error.code).toBe('unknown_grade');
    expect(grade.body.error.message).toBe("Grade firm is not in this campaign's scheme: sure (sure), likely (likely), possible (possible), no-z (no redshift), unusable (unusable).");
    const line = await reader1.post(`/api/spectra/${id}/readings`).send({ ...good, lines: ['H-alpha', 'Unobtainium 5000'] });
    expect(line.body.error).toEqual({ code: 'unknown_line', message: 'Not in the line list: Unobtainium 5000.' });
    const cls = await reader1.post(`/api/spectra/${id}/readings`).send({ ...good, class: 'comet' });
    expect(cls.status).toBe(400);
    expect(t.ctx.db.select().from(readings).where(eq(readings.spectrumId, id)).all()).toEqual([]);
  });

  it('refuses readings from people not assigned, observers, and outsiders', async () => {
    const id = spectrumIds[1]!;
    const leadTry = await lead.post(`/api/spectra/${id}/readings`).send(good);
    expect(leadTry.status).toBe(403);
    expect(leadTry.body.error.code).toBe('not_assigned');
    expect((await observer.post(`/api/spectra/${id}/readings`).send(good)).status).toBe(403);
    const admin = await t.signIn('admin@demo.test');
    expect((await admin.post(`/api/spectra/${id}/readings`).send(good)).status).toBe(403);
    const outsider = t.agent();
    await outsider.post('/api/campaigns').send({});
    expect((await outsider.post(`/api/spectra/${id}/readings`).send(good)).status).toBe(401);
  });
});

describe('spectrum data for plotting', () => {
  it('packs vacuum wavelengths as float64 and flux, error, mask compactly', async () => {
    const res = await reader1.get(`/api/spectra/${spectrumIds[2]}/data`).buffer(true).parse(collectBytes);
    expect(res.status).toBe(200);
    // The stored file never changes: the answer is validated by its hash, and served again from memory.
    expect(res.headers.etag).toMatch(/^"[0-9a-f]{64}-v\d+"$/);
    expect((await reader1.get(`/api/spectra/${spectrumIds[2]}/data`).set('If-None-Match', res.headers.etag!)).status).toBe(304);
    const second = await reader1.get(`/api/spectra/${spectrumIds[2]}/data`).buffer(true).parse(collectBytes);
    expect(Buffer.compare(second.body as Buffer, res.body as Buffer)).toBe(0);
    const buf = res.body as Buffer;
    const headerLength = buf.readUInt32LE(0);
    const header = JSON.parse(buf.subarray(4, 4 + headerLength).toString('utf8'));
    expect(header).toMatchObject({ pixels: 2000, medium: 'vacuum', convertedFromAir: false, sky: false });
    const start = Math.ceil((4 + headerLength) / 8) * 8;
    const copy = new Uint8Array(buf.subarray(start, start + 2000 * 8));
    const wavelength = new Float64Array(copy.buffer);
    // The synthetic spectra span 3600–9800 Å on a log-uniform grid (tests/helpers/spectrum-archives.ts).
    expect(wavelength[0]).toBeCloseTo(3600, 2);
    expect(wavelength[1999]).toBeCloseTo(9800, 2);
    // float64 wavelength, float32 flux and error, uint8 mask; no sky column in these files.
    expect(buf.length).toBe(start + 2000 * (8 + 4 + 4 + 1));
  });

  it('serves the best-fit model of a solution on the spectrum pixels', async () => {
    const res = await reader1.get(`/api/spectra/${spectrumIds[2]}/solutions/1/model`).buffer(true).parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    const model = new Float32Array(new Uint8Array(res.body as Buffer).buffer);
    expect(model.length).toBe(2000);
    const finite = Array.from(model).filter(Number.isFinite);
    expect(finite.length).toBeGreaterThan(1500);
    expect(Math.max(...finite)).toBeGreaterThan(Math.min(...finite));
    const missing = await reader1.get(`/api/spectra/${spectrumIds[2]}/solutions/99/model`);
    expect(missing.status).toBe(404);
    expect(missing.headers['content-type']).toMatch(/^application\/json/);
    expect(missing.body.error.code).toBe('solution_not_found');
  });

  it('names the scan a model belongs to: cached only then, and a superseded scan id is refused', async () => {
    const id = spectrumIds[2]!;
    const scanId = (await reader1.get(`/api/spectra/${id}`)).body.scan.id as number;
    const named = await reader1.get(`/api/spectra/${id}/solutions/1/model?scan=${scanId}`).buffer(true);
    expect(named.status).toBe(200);
    expect(named.headers['cache-control']).toBe('private, max-age=3600');
    const unnamed = await reader1.get(`/api/spectra/${id}/solutions/1/model`).buffer(true);
    expect(unnamed.headers['cache-control']).toBe('no-cache');
    const stale = await reader1.get(`/api/spectra/${id}/solutions/1/model?scan=${scanId + 1000}`);
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('scan_superseded');
    const bad = await reader1.get(`/api/spectra/${id}/solutions/1/model?scan=latest`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('invalid_input');
  });

  it('serves the χ²(z) curves packed as stored, revalidated by scan, and the line list of the comb', async () => {
    const res = await reader1.get(`/api/spectra/${spectrumIds[2]}/scan-curves`).buffer(true).parse(collectBytes);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/octet-stream');
    const scanId = (await reader1.get(`/api/spectra/${spectrumIds[2]}`)).body.scan.id;
    expect(res.headers.etag).toBe(`"scan-${scanId}"`);
    const { curves } = decodeScanCurves(res.body as Buffer);
    expect(curves.length).toBeGreaterThan(2);
    expect(curves[0]!.z.length).toBe(curves[0]!.chi2.length);
    expect(curves[0]!.z[0]).toBeGreaterThanOrEqual(0);
    expect(curves.every((c) => c.chi2.every(Number.isFinite))).toBe(true);
    const again = await reader1.get(`/api/spectra/${spectrumIds[2]}/scan-curves`).set('If-None-Match', res.headers.etag!);
    expect(again.status).toBe(304);
    const lines = (await reader1.get('/api/line-list')).body;
    expect(lines.medium).toBe('vacuum');
    // NIST vacuum wavelength of Hα (reference-values.md §1): 6564.61 Å.
    expect(lines.lines.find((l: { name: string }) => l.name === 'H-alpha').rest).toBeCloseTo(6564.61, 1);
  });
});

function collectBytes(r: import('superagent').Response, done: (err: Error | null, body: Buffer) => void): void {
  const chunks: Buffer[] = [];
  r.on('data', (c: Buffer) => chunks.push(c));
  r.on('end', () => done(null, Buffer.concat(chunks)));
}
