import Papa from 'papaparse';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { loadShippedFilters } from '../../backend/src/cli/photoz-data';
import { DEMO_BANDS, demoFluxes } from '../../backend/src/demo/demo-photometry';
import type { DemoTarget } from '../../backend/src/demo/demo-scenario';
import { uploadAssignedSpectra } from '../helpers/assigned-spectra';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let ids: number[];
const FILTERS = DEMO_BANDS.map((b) => b.filter);

beforeAll(async () => {
  t = await createTestApp({ SCAN_THREADS: '1' });
  ids = await uploadAssignedSpectra(t, 1, 'PHX');
  const lead = await t.signIn('lead@demo.test');
  // Invented imaging of an emission-line galaxy at z = 1.0 for the spectrum's target.
  const target: DemoTarget = { id: 'PHX-0001', ra: 160.51, dec: -11.63, mag: 23.5, truth: { class: 'galaxy', template: 'galaxy-emission', z: 1.0, snr: 8 }, photoZ: 1, priority: 1, instrument: 'demo-slit' };
  const [f] = demoFluxes([target], loadShippedFilters(FILTERS), 7);
  const header = ['id', 'ra', 'dec', ...FILTERS.flatMap((x) => [`flux_${x}`, `err_${x}`])].join(',');
  const row = ['PHX-0001', 160.51, -11.63, ...FILTERS.flatMap((_, b) => [f!.flux[b], f!.err[b]])].join(',');
  const res = await lead.post('/api/campaigns/1/targets').attach('files', Buffer.from(`${header}\n${row}\n`), 'c.csv');
  expect(res.body.photoZFits).toBe(1);
  const r1 = await t.signIn('reader1@demo.test');
  const r2 = await t.signIn('reader2@demo.test');
  await r1.post(`/api/spectra/${ids[0]}/readings`).send({ z: 1.0, zErr: 0.001, grade: 'sure', class: 'galaxy', lines: ['H-beta'] });
  await r2.post(`/api/spectra/${ids[0]}/readings`).send({ z: 1.0005, zErr: 0.001, grade: 'sure', class: 'galaxy', lines: ['H-beta'] });
}, 60_000);
afterAll(() => t.cleanup());

it('exports the computed photo-z with its 68 % interval and P(z < 2), stating the filters and templates', async () => {
  const observer = await t.signIn('observer@demo.test');
  const page = await observer.get('/api/campaigns/1/confirmed');
  expect(page.status).toBe(200);
  const row = page.body.rows[0];
  expect(row.photoZ).toBeNull(); // the catalogue typed none
  expect(Math.abs(row.zPhot - 1.0) / 2).toBeLessThan(0.05);
  expect(row.zPhotLow).toBeLessThan(row.zPhot);
  expect(row.zPhotHigh).toBeGreaterThan(row.zPhot);
  expect(row.zPhotPLowZ).toBeGreaterThan(0.9);

  const csv = await observer.get('/api/campaigns/1/confirmed?format=csv');
  expect(csv.text).toMatch(new RegExp(`^# photometric_redshift_filters: ${[...FILTERS].sort().join(' ')}$`, 'm'));
  expect(csv.text).toMatch(/^# photometric_redshift_templates: Redward photo-z templates: 14 Lyman-break .* mean IGM Inoue et al\. \(2014\)$/m);
  const parsed = Papa.parse<Record<string, string>>(csv.text, { header: true, comments: '#', skipEmptyLines: true });
  expect(Number(parsed.data[0]!.z_phot)).toBeCloseTo(row.zPhot, 4);
  expect(Number(parsed.data[0]!.z_phot_p_low_z)).toBeCloseTo(row.zPhotPLowZ, 4);

  const ecsv = await observer.get('/api/campaigns/1/confirmed?format=ecsv');
  expect(ecsv.text).toMatch(/^# {3}photometric_redshift: \{filters: "acs_wfc_f435w /m);

  // The spec-z vs photo-z picture uses the computed value.
  const stats = await observer.get('/api/campaigns/1/statistics');
  expect(stats.body.photoZ.points).toEqual([expect.objectContaining({ zPhot: expect.closeTo(row.zPhot, 3), source: 'computed' })]);
});

it("checks the spectrum's own synthetic photometry against the catalogue in the bands it covers", async () => {
  const observer = await t.signIn('observer@demo.test');
  const list = await observer.get('/api/campaigns/1/targets');
  const target = list.body.targets.find((x: { catalogueId: string }) => x.catalogueId === 'PHX-0001');
  const res = await observer.get(`/api/campaigns/1/targets/${target.id}/photometry`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  expect(res.body.spectra).toEqual([{ id: ids[0], fileName: 'night1/PHX-0001.csv' }]);
  const [check] = res.body.spectrumPhotometry;
  // The synthetic file states no flux unit: ratios are relative, fluxes scaled to the catalogue.
  expect(check).toMatchObject({ spectrumId: ids[0], calibrated: false });
  const filters = check.bands.map((b: { filter: string }) => b.filter);
  // 3600–9800 Å covers the ACS bands; nothing redward of 1 µm.
  expect(filters).toContain('acs_wfc_f606w');
  expect(filters.some((f: string) => f.startsWith('jwst') || f.startsWith('wfc3_ir'))).toBe(false);
  for (const b of check.bands) {
    expect(Number.isFinite(b.ratio)).toBe(true);
    expect(b.ratioErr).toBeGreaterThan(0);
  }
  const scaled = check.bands.map((b: { ratio: number }) => b.ratio / check.medianRatio).sort((a: number, b: number) => a - b);
  expect(scaled[Math.floor(scaled.length / 2)]).toBeCloseTo(1, 6);
});

it('states the photo-z prior convention in every export, with the records under each prior, as the spectrum detail applies it', async () => {
  const observer = await t.signIn('observer@demo.test');
  const detail = await observer.get(`/api/spectra/${ids[0]}`);
  expect(detail.status).toBe(200);
  // No typed photo-z, a computed fit: the detail ranks with the computed P(z), and the export counts it so.
  expect(detail.body.scan.photoZPrior.source).toBe('computed');
  const csv = await observer.get('/api/campaigns/1/confirmed?format=csv');
  expect(csv.text).toMatch(/^# photo_z_prior: photo-z prior: typed \| computed P\(z\) \| none\. .*typed catalogue photo-z .* else with the P\(z\) Redward computed .* else with none; .*readers' confirmed value, which no prior changes$/m);
  expect(csv.text).toMatch(/^# photo_z_prior_records: typed 0, computed P\(z\) 1, none 0 \(of 1 current confirmed records in the campaign, at export\)$/m);
  const votable = await observer.get('/api/campaigns/1/confirmed?format=votable');
  expect(votable.text).toMatch(/<INFO name="photo_z_prior_records" value="typed 0, computed P\(z\) 1, none 0 /);
  const ecsv = await observer.get('/api/campaigns/1/confirmed?format=ecsv');
  expect(ecsv.text).toMatch(/^# {3}photo_z_prior: "photo-z prior: typed \| computed P\(z\) \| none\./m);
  const fits = await observer.get('/api/campaigns/1/confirmed?format=fits').buffer(true).parse((res, cb) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => cb(null, Buffer.concat(chunks)));
  });
  const header = (fits.body as Buffer).toString('latin1').replace(/(.{80})/g, '$1\n');
  expect(header).toMatch(/^COMMENT Prior records: typed 0, computed P\(z\) 1, none 0/m);

  // The catalogue now types a photo-z for the target: it wins over the computed P(z), in the detail and the export alike.
  const lead = await t.signIn('lead@demo.test');
  const typed = await lead.post('/api/campaigns/1/targets').attach('files', Buffer.from('id,zphot,zphot_l68,zphot_u68\nPHX-0001,1.02,0.95,1.1\n'), 'typed.csv');
  expect(typed.status, JSON.stringify(typed.body)).toBe(200);
  expect((await observer.get(`/api/spectra/${ids[0]}`)).body.scan.photoZPrior.source).toBe('typed');
  const after = await observer.get('/api/campaigns/1/confirmed?format=csv');
  expect(after.text).toMatch(/^# photo_z_prior_records: typed 1, computed P\(z\) 0, none 0 /m);
});
