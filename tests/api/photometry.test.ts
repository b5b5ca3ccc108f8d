import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadShippedFilters } from '../../backend/src/cli/photoz-data';
import { campaignFilters, catalogueMappings, photoZFits, targetPhotometry, targets } from '../../backend/src/db/schema';
import { DEMO_BANDS, demoFluxes } from '../../backend/src/demo/demo-photometry';
import type { DemoTarget } from '../../backend/src/demo/demo-scenario';
import { abMagnitude } from '../../backend/src/photoz/photometry';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ JOB_RUNNER: '0' });
});
afterAll(() => t.cleanup());

const FILTERS = DEMO_BANDS.map((b) => b.filter);
const invented = (id: string, truth: DemoTarget['truth'], mag: number): DemoTarget => ({ id, ra: 160.5, dec: -11.6, mag, truth, photoZ: 1, priority: 1, instrument: 'demo-grism' });
// Invented sources: a z = 6.2 Lyman-break galaxy, a z = 1.3 old dusty interloper, a cool dwarf.
const SOURCES = [
  invented('DROP-1', { class: 'lyman-break', template: 'lyman-break', z: 6.2, snr: 5 }, 25.5),
  invented('LOWZ-1', { class: 'galaxy', template: 'galaxy-absorption', z: 1.3, snr: 5 }, 24.5),
  invented('STAR-1', { class: 'star', template: 'star-cool', z: 0, snr: 5 }, 24.5),
];
const FLUXES = demoFluxes(SOURCES, loadShippedFilters(FILTERS), 99);

function nJyCatalogue(): string {
  const header = ['id', 'ra', 'dec', ...FILTERS.flatMap((f) => [`flux_${f}`, `err_${f}`])];
  const rows = SOURCES.map((s, i) => [s.id, s.ra, s.dec, ...FILTERS.flatMap((_, b) => [FLUXES[i]!.flux[b], FLUXES[i]!.err[b]])].join(','));
  return [header.join(','), ...rows].join('\n') + '\n';
}

const upload = (agent: ReturnType<TestApp['agent']>, campaign: number, text: string, opts: { mapping?: object; dryRun?: boolean } = {}) => {
  let req = agent.post(`/api/campaigns/${campaign}/targets${opts.dryRun ? '?dryRun=1' : ''}`).attach('files', Buffer.from(text), 'targets.csv');
  if (opts.mapping) req = req.field('mapping', JSON.stringify(opts.mapping));
  return req;
};

describe('catalogue photometry and photometric redshifts', () => {
  it('proposes flux_<filter>/err_<filter> columns as nJy bands of the shipped filters', async () => {
    const lead = await t.signIn('lead@demo.test');
    const res = await upload(lead, 1, nJyCatalogue(), { dryRun: true });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.mapping.bands).toHaveLength(10);
    expect(res.body.mapping.bands[0]).toEqual({ filter: 'acs_wfc_f435w', flux: 'flux_acs_wfc_f435w', err: 'err_acs_wfc_f435w', unit: 'nJy' });
  });

  it('stores the fluxes, computes each target’s photo-z on import and lists it with the targets', async () => {
    const lead = await t.signIn('lead@demo.test');
    const res = await upload(lead, 1, nJyCatalogue());
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ created: 3, photoZFits: 3 });
    expect(t.ctx.db.select().from(targetPhotometry).all()).toHaveLength(30);
    const list = await lead.get('/api/campaigns/1/targets');
    const byId = new Map(list.body.targets.map((x: { catalogueId: string }) => [x.catalogueId, x]));
    const drop = byId.get('DROP-1') as { photoZFit: { z: number; z95: [number, number]; pLowZ: number; class: string; filters: string[] } };
    expect(Math.abs(drop.photoZFit.z - 6.2) / 7.2).toBeLessThan(0.05);
    expect(drop.photoZFit.z95[0]).toBeGreaterThan(5);
    expect(drop.photoZFit.pLowZ).toBeLessThan(0.01);
    expect(drop.photoZFit.class).toBe('galaxy');
    expect(drop.photoZFit.filters).toHaveLength(10);
    const lowz = byId.get('LOWZ-1') as { photoZFit: { z: number; pLowZ: number } };
    expect(lowz.photoZFit.pLowZ).toBeGreaterThan(0.5);
    expect((byId.get('STAR-1') as { photoZFit: { class: string } }).photoZFit.class).toBe('star');
    // The mapping is remembered for the campaign.
    const remembered = t.ctx.db.select().from(catalogueMappings).where(eq(catalogueMappings.campaignId, 1)).get()!;
    expect((remembered.mapping as { bands: unknown[] }).bands).toHaveLength(10);
  });

  it('gives a target’s SED: bands in λ order, non-detections as limits, P(z) of unit mass, best galaxy and star through the bands', async () => {
    const lead = await t.signIn('lead@demo.test');
    const id = t.ctx.db.select().from(targets).where(eq(targets.catalogueId, 'DROP-1')).get()!.id;
    const res = await lead.get(`/api/campaigns/1/targets/${id}/photometry`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const body = res.body;
    expect(body.bands.map((b: { filter: string }) => b.filter)).toEqual(FILTERS);
    const lam = body.bands.map((b: { wavelengthEff: number }) => b.wavelengthEff);
    expect([...lam].sort((a, b) => a - b)).toEqual(lam);
    // Blueward of Lyα at z = 6.2 (8750 Å) nothing is detected: F435W and F606W are limits, F160W a detection.
    expect(body.bands[0].detected).toBe(false);
    expect(body.bands[1].detected).toBe(false);
    expect(body.bands[5].detected).toBe(true);
    const { z, p } = body.posterior;
    expect(z).toHaveLength(p.length);
    let mass = 0;
    for (let k = 1; k < z.length; k++) mass += 0.5 * (p[k] + p[k - 1]) * (z[k] - z[k - 1]);
    expect(mass).toBeCloseTo(1, 2);
    const galaxy = body.models.find((m: { kind: string }) => m.kind === 'galaxy');
    expect(galaxy.template).toBe(body.fit.galaxyTemplate);
    // The drawn galaxy model reproduces the detected F160W flux within its error.
    expect(Math.abs(galaxy.bandFluxNjy[5] - body.bands[5].fluxNjy)).toBeLessThan(3 * body.bands[5].errNjy);
    expect(body.models.some((m: { kind: string }) => m.kind === 'star')).toBe(true);
    expect(body.assumptions.join(' ')).toMatch(/Lyman-break.*IGM/);
  });

  it('reads AB magnitudes with magnitude errors, and a 99 sentinel as a non-detection at the 1σ limit given', async () => {
    const lead = await t.signIn('lead@demo.test');
    const f = FLUXES[0]!;
    const cells = FILTERS.flatMap((_, b) => {
      const flux = f.flux[b]!;
      const err = f.err[b]!;
      // Below 1σ: the catalogue writes 99 and the 1σ limiting magnitude.
      return flux > err ? [abMagnitude(flux).toFixed(3), ((2.5 / Math.LN10) * (err / flux)).toFixed(4)] : ['99', abMagnitude(err).toFixed(3)];
    });
    const text = ['id,' + FILTERS.flatMap((x) => [`mag_${x}`, `magerr_${x}`]).join(','), `MAG-DROP,${cells.join(',')}`].join('\n');
    const res = await upload(lead, 2, text);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.mapping.bands[0].unit).toBe('ABmag');
    const target = t.ctx.db.select().from(targets).where(eq(targets.catalogueId, 'MAG-DROP')).get()!;
    const blue = t.ctx.db.select().from(targetPhotometry).where(eq(targetPhotometry.targetId, target.id)).all().find((r) => r.filter === 'acs_wfc_f435w')!;
    expect(blue).toMatchObject({ fluxNjy: 0, givenValue: 99, unit: 'ABmag' });
    expect(blue.errNjy).toBeCloseTo(f.err[0]!, 0);
    const fit = t.ctx.db.select().from(photoZFits).where(eq(photoZFits.targetId, target.id)).get()!;
    expect(Math.abs(fit.z - 6.2) / 7.2).toBeLessThan(0.05);
  });

  it('refuses bad band cells and unknown filters, naming line and column, and imports nothing', async () => {
    const lead = await t.signIn('lead@demo.test');
    const text = ['id,flux_jwst_f444w,err_jwst_f444w', 'B-1,12.5,abc', 'B-2,,3.1', 'B-3,-4.0,0', 'B-4,-2.0,1.5'].join('\n');
    const res = await upload(lead, 2, text);
    expect(res.status).toBe(400);
    expect(res.body.error.details.errors).toEqual([
      { line: 2, column: 'err_jwst_f444w', message: '"abc" is not a number (jwst_f444w).' },
      { line: 3, column: 'flux_jwst_f444w', message: 'Empty while err_jwst_f444w is given (jwst_f444w); leave both cells empty for a band not observed.' },
      { line: 4, column: 'err_jwst_f444w', message: 'A flux error must be positive, got 0 (jwst_f444w); a non-detection keeps its flux (zero or negative) with its error.' },
    ]);
    expect(t.ctx.db.select().from(targets).where(eq(targets.catalogueId, 'B-4')).get()).toBeUndefined();
    const unknown = await upload(lead, 2, 'id,a,b\nX,1,2\n', { mapping: { id: 'id', bands: [{ filter: 'nosuch_f999w', flux: 'a', err: 'b', unit: 'uJy' }] } });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.details.errors[0].message).toBe('"nosuch_f999w" is neither a shipped filter nor one of this campaign\'s own curves.');
  });

  it('lets a lead add the campaign’s own filter curve, validated, and map a band to it', async () => {
    const lead = await t.signIn('lead@demo.test');
    const curve = ['# our own box filter', ...Array.from({ length: 21 }, (_, i) => `${40000 + 250 * i} ${i === 0 || i === 20 ? 0 : 0.9}`)].join('\n');
    const bad = await lead.post('/api/campaigns/2/filters').field('name', 'box_f400').attach('files', Buffer.from('4000 0.5\n3990 0.6\n'), 'box.txt');
    expect(bad.status).toBe(400);
    expect(bad.body.error).toEqual({ code: 'filter_curve_invalid', message: 'box_f400: line 2: wavelength 3990 Å does not increase on line 1 (4000 Å); wavelengths must be strictly increasing' });
    const shippedName = await lead.post('/api/campaigns/2/filters').field('name', 'jwst_f444w').attach('files', Buffer.from(curve), 'box.txt');
    expect(shippedName.status).toBe(409);
    const ok = await lead.post('/api/campaigns/2/filters').field('name', 'box_f400').attach('files', Buffer.from(curve), 'box.txt');
    expect(ok.status, JSON.stringify(ok.body)).toBe(201);
    expect(ok.body.wavelengthEff).toBeGreaterThan(42000);
    expect(ok.body.wavelengthEff).toBeLessThan(43000);
    expect(t.ctx.db.select().from(campaignFilters).all()).toHaveLength(1);
    const again = await lead.post('/api/campaigns/2/filters').field('name', 'box_f400').attach('files', Buffer.from(curve), 'box.txt');
    expect(again.status).toBe(409);
    const list = await lead.get('/api/campaigns/2/filters');
    expect(list.body.filters.find((x: { name: string }) => x.name === 'box_f400')).toMatchObject({ source: 'campaign' });
    const withOwn = await upload(lead, 2, 'id,flux_box_f400,err_box_f400\nOWN-1,120,10\n');
    expect(withOwn.status, JSON.stringify(withOwn.body)).toBe(200);
    expect(withOwn.body.mapping.bands).toEqual([{ filter: 'box_f400', flux: 'flux_box_f400', err: 'err_box_f400', unit: 'nJy' }]);
    expect(withOwn.body.photoZFits).toBe(1);
    // Other campaigns do not see it.
    expect((await lead.get('/api/campaigns/1/filters')).body.filters.some((x: { name: string }) => x.name === 'box_f400')).toBe(false);
  });
});
