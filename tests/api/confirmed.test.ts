import Papa from 'papaparse';
import { XMLParser } from 'fast-xml-parser';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { disagreements, targets } from '../../backend/src/db/schema';
import { uploadAssignedSpectra } from '../helpers/assigned-spectra';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let ids: number[];


beforeAll(async () => {
  t = await createTestApp({ SCAN_THREADS: '2' });
  ids = await uploadAssignedSpectra(t, 3, 'CNF');
  const lead = await t.signIn('lead@demo.test');
  // A catalogue so the table carries targets, photometric redshifts and an image family.
  await lead.post('/api/campaigns/1/targets').attach('files', Buffer.from('id,ra,dec,zphot,zphot_l68,zphot_u68,family\nCNF-0001,160.51,-11.63,1.1,0.9,1.3,A\nCNF-0002,160.52,-11.64,1.0,0.8,1.2,A\nCNF-0003,160.53,-11.65,0.4,0.3,0.5,\n'), 'c.csv');
  const r1 = await t.signIn('reader1@demo.test');
  const r2 = await t.signIn('reader2@demo.test');
  await r1.post(`/api/spectra/${ids[0]}/readings`).send({ z: 1.0, zErr: 0.001, grade: 'sure', class: 'galaxy', lines: ['H-beta'] });
  await r2.post(`/api/spectra/${ids[0]}/readings`).send({ z: 1.001, zErr: 0.001, grade: 'sure', class: 'galaxy', lines: ['H-beta'] });
  await r1.post(`/api/spectra/${ids[1]}/readings`).send({ z: 1.5, grade: 'likely', class: 'galaxy' });
  await r2.post(`/api/spectra/${ids[1]}/readings`).send({ z: 1.51, grade: 'likely', class: 'galaxy' });
  await r1.post(`/api/spectra/${ids[2]}/readings`).send({ z: 0.4, grade: 'possible', class: 'galaxy' });
}, 60_000);
afterAll(() => t.cleanup());

describe('the confirmed table', () => {
  it('lists current confirmed redshifts with the assumptions and the state counts; observers may read it', async () => {
    const observer = await t.signIn('observer@demo.test');
    const res = await observer.get('/api/campaigns/1/confirmed');
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(1);
    expect(res.body.rows[0]).toMatchObject({ targetId: 'CNF-0001', gradeCode: 'sure', gradeLabel: 'sure', confirmedBy: 'agreement', imageFamily: 'A', photoZ: 1.1 });
    // Equal errors sent, widened by floors that grow with (1 + z): the mean leans to z = 1.0 by 1e-7.
    expect(res.body.rows[0].z).toBeCloseTo(1.0005, 6);
    expect(res.body.rows[0].readers).toEqual(['Rafael Demo (reader 1)', 'Rosa Demo (reader 2)']);
    expect(res.body.states).toEqual({ unread: 0, 'one reading': 1, agreed: 1, disagreement: 1, settled: 0 });
    expect((await observer.get('/api/campaigns/1/confirmed?confirmedBy=agreement')).body.total).toBe(1);
    expect((await observer.get('/api/campaigns/1/confirmed?confirmedBy=settlement')).body.total).toBe(0);
    expect(res.body.assumptions).toMatchObject({ wavelengths: 'vacuum', tolerance: 0.003, cosmology: { h0: 67.4, omegaM: 0.315, flat: true } });
  });

  it('exports CSV, ECSV, VOTable and FITS with the assumptions in each', async () => {
    const observer = await t.signIn('observer@demo.test');
    const csv = await observer.get('/api/campaigns/1/confirmed?format=csv');
    expect(csv.headers['content-disposition']).toMatch(/attachment; filename="lantern-cluster-arcs-confirmed-\d{4}-\d{2}-\d{2}\.csv"/);
    expect(csv.text).toMatch(/^# .*vacuum/m);
    const parsed = Papa.parse<Record<string, string>>(csv.text, { header: true, comments: '#', skipEmptyLines: true });
    expect(parsed.data).toHaveLength(1);
    expect(Object.values(parsed.data[0]!)).toContain('CNF-0001');

    const ecsv = await observer.get('/api/campaigns/1/confirmed?format=ecsv');
    expect(ecsv.text.split('\n')[0]).toBe('# %ECSV 1.0');

    const vot = await observer.get('/api/campaigns/1/confirmed?format=votable');
    expect(vot.headers['content-type']).toMatch(/votable/);
    const xml = new XMLParser({ ignoreAttributes: false }).parse(vot.text);
    expect(xml.VOTABLE['@_xmlns']).toBe('http://www.ivoa.net/xml/VOTable/v1.3');
    expect(JSON.stringify(xml)).toContain('src.redshift');

    const fits = await observer.get('/api/campaigns/1/confirmed?format=fits').buffer(true).parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    });
    const bytes = fits.body as Buffer;
    expect(bytes.length % 2880).toBe(0);
    expect(bytes.subarray(0, 30).toString('ascii')).toBe('SIMPLE  =                    T');
    expect(bytes.toString('ascii')).toContain("XTENSION= 'BINTABLE'");
  });

  it('shows in the spectra list how many readings each spectrum has', async () => {
    const lead = await t.signIn('lead@demo.test');
    const rows = (await lead.get('/api/campaigns/1/spectra?q=CNF&sort=fileName')).body.rows;
    expect(rows.map((r: { readingsAssigned: number; readingsDone: number }) => [r.readingsAssigned, r.readingsDone])).toEqual([
      [2, 2],
      [2, 2],
      [2, 1],
    ]);
  });

  it('computes the pictures from real records: photo-z outliers, grades, reader agreement', async () => {
    const observer = await t.signIn('observer@demo.test');
    const res = await observer.get('/api/campaigns/1/statistics');
    expect(res.status).toBe(200);
    // One confirmed value (z ≈ 1.0005) whose target has z_phot = 1.1: |Δz|/(1+z) = 0.0497, not an outlier.
    expect(res.body.photoZ).toMatchObject({ threshold: 0.15, n: 1, outlierFraction: 0 });
    expect(res.body.photoZ.points[0]).toMatchObject({ targetId: 'CNF-0001', zPhot: 1.1, outlier: false });
    expect(res.body.gradeDistribution.find((g: { code: string }) => g.code === 'sure').count).toBe(1);
    // Two complete pairs: one agreed (Δz/(1+z) = 0.0005), one did not (0.004 > 0.003).
    expect(res.body.readerPairs).toEqual([{ readers: ['Rafael Demo (reader 1)', 'Rosa Demo (reader 2)'], n: 2, agreeFraction: 0.5, kappaOnGrades: 1 }]);
  });

  it('flags image families whose members are not all confirmed', async () => {
    const lead = await t.signIn('lead@demo.test');
    const res = await lead.get('/api/campaigns/1/families');
    expect(res.status).toBe(200);
    const a = res.body.families.find((f: { family: string }) => f.family === 'A');
    expect(a).toMatchObject({ incomplete: true, flagged: true });
    // CNF-0002's readings (1.5 and 1.51) disagree: its entry points at the open disagreement.
    const open = t.ctx.db.select().from(disagreements).where(eq(disagreements.spectrumId, ids[1]!)).get()!;
    expect(a.unconfirmed).toEqual([{ imageFamily: 'A', targetId: 'CNF-0002', spectrumId: ids[1], openDisagreementId: open.id }]);
    expect(t.ctx.db.select().from(targets).all()).toHaveLength(3);
  });
});
