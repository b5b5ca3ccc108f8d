import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadShippedFilters } from '../../backend/src/cli/photoz-data';
import { spectra } from '../../backend/src/db/schema';
import { DEMO_BANDS, demoFluxes } from '../../backend/src/demo/demo-photometry';
import type { DemoTarget } from '../../backend/src/demo/demo-scenario';
import { syntheticSpectrumFiles, zip } from '../helpers/spectrum-archives';
import { createTestApp, type TestApp, waitForJob } from '../helpers/test-app';

// The engine's photo-z prior as a reader sees it (issue 12): applied when the spectrum detail is
// read, from the typed catalogue photo-z if the target has one, else from the computed P(z), else
// none; a catalogue imported after the scan takes effect without a re-scan.
let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ SCAN_THREADS: '1' });
}, 60_000);
afterAll(() => t.cleanup());

const FILTERS = DEMO_BANDS.map((b) => b.filter);
// syntheticSpectrumFiles draws its fourth file as a Lyman-break source at z = 5.3.
const DROPOUT: DemoTarget = { id: 'PRIOR-0004', ra: 160.5, dec: -11.6, mag: 25, truth: { class: 'lyman-break', template: 'lyman-break', z: 5.3, snr: 8 }, photoZ: 5.3, priority: 1, instrument: 'demo-grism' };
const FLUX = demoFluxes([DROPOUT], loadShippedFilters(FILTERS), 7)[0]!;

function catalogue(typed?: [number, number, number]): string {
  const header = ['id', 'ra', 'dec', ...(typed ? ['photoz', 'zlo', 'zhi'] : []), ...FILTERS.flatMap((f) => [`flux_${f}`, `err_${f}`])];
  const row = [DROPOUT.id, DROPOUT.ra, DROPOUT.dec, ...(typed ?? []), ...FILTERS.flatMap((_, b) => [FLUX.flux[b], FLUX.err[b]])];
  return `${header.join(',')}\n${row.join(',')}\n`;
}


describe('photo-z prior on the spectrum detail', () => {
  it('is absent before a catalogue, computed P(z) after photometry, the typed photo-z when the catalogue gives one', { timeout: 120_000 }, async () => {
    const lead = await t.signIn('lead@demo.test');
    const up = await lead.post('/api/campaigns/1/uploads').attach('files', zip(syntheticSpectrumFiles(4, { prefix: 'PRIOR' })), 'prior.zip');
    expect(up.status, JSON.stringify(up.body)).toBe(202);
    expect((await waitForJob(lead, up.body.jobId)).state).toBe('done');
    const row = t.ctx.db.select().from(spectra).all().find((s) => s.fileName.endsWith('PRIOR-0004.csv'))!;
    expect(row.targetId).toBeNull();

    const before = await lead.get(`/api/spectra/${row.id}`);
    expect(before.status).toBe(200);
    expect(before.body.scan.solutions.length).toBeGreaterThan(1);
    expect(before.body.scan.photoZPrior).toBeUndefined();

    // Photometry only: the computed P(z) of a z = 5.3 dropout becomes the prior.
    const imported = await lead.post('/api/campaigns/1/targets').attach('files', Buffer.from(catalogue()), 'targets.csv');
    expect(imported.status, JSON.stringify(imported.body)).toBe(200);
    expect(imported.body).toMatchObject({ linked: 1, photoZFits: 1 });
    const computed = (await lead.get(`/api/spectra/${row.id}`)).body.scan;
    expect(computed.photoZPrior.source).toBe('computed');
    expect(computed.photoZPrior.message).toContain('computed P(z)');
    expect(computed.photoZPrior.order).toHaveLength(computed.solutions.length);
    expect(Math.abs(computed.solutions[computed.photoZPrior.order[0]].z - 5.3)).toBeLessThan(0.1);

    // A typed photo-z wins over the computed P(z) once the catalogue gives one.
    const typed = await lead.post('/api/campaigns/1/targets').attach('files', Buffer.from(catalogue([5.25, 5.15, 5.35])), 'targets.csv');
    expect(typed.status, JSON.stringify(typed.body)).toBe(200);
    const withTyped = (await lead.get(`/api/spectra/${row.id}`)).body.scan;
    expect(withTyped.photoZPrior.source).toBe('typed');
    expect(withTyped.photoZPrior.message).toContain('catalogue photo-z');
    expect(Math.abs(withTyped.solutions[withTyped.photoZPrior.order[0]].z - 5.3)).toBeLessThan(0.1);
    // The stored ranking is never rewritten: the scan's own order is what it was before any catalogue.
    expect(withTyped.solutions.map((s: { z: number }) => s.z)).toEqual(before.body.scan.solutions.map((s: { z: number }) => s.z));
  });
});
