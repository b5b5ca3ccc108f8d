import { and, eq } from 'drizzle-orm';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { combLinesResponseSchema } from '../../backend/src/contracts/line-measurements';
import { spectrumDetailSchema } from '../../backend/src/contracts/spectra';
import { confirmedRedshifts, readings } from '../../backend/src/db/schema';
import { signInDemoMembers, uploadAssignedSpectra, type Agent } from '../helpers/assigned-spectra';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let ids: number[];
let reader1: Agent;
let reader2: Agent;
let lead: Agent;

beforeAll(async () => {
  t = await createTestApp({ SCAN_THREADS: '2' });
  // File 1 is an emission-line galaxy at z = 0.2, file 3 one at z = 0.26 (tests/helpers/spectrum-archives.ts);
  // file 3's Hα is clear of the generator's randomly masked pixels (file 1's Hα peak pixel is masked).
  ids = await uploadAssignedSpectra(t, 3, 'LINES');
  ({ reader1, reader2, lead } = await signInDemoMembers(t));
}, 60_000);
afterAll(() => t.cleanup());

const topZ = async (agent: Agent, id: number) => (await agent.get(`/api/spectra/${id}`)).body.scan.solutions[0].z as number;

describe('GET /api/spectra/:id/lines', () => {
  it('measures the comb lines at a trial z: the galaxy lines detected, nothing outside the data', async () => {
    const z = await topZ(reader1, ids[2]!);
    expect(z).toBeCloseTo(0.26, 2);
    // No class: every comb line is a candidate, so only the data range decides what comes back.
    const res = await reader1.get(`/api/spectra/${ids[2]}/lines?z=${z}`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(combLinesResponseSchema.safeParse(res.body).error).toBeUndefined();
    const detail = (await reader1.get(`/api/spectra/${ids[2]}`)).body.spectrum;
    for (const m of res.body.lines) {
      expect(m.observed).toBeGreaterThanOrEqual(detail.wavelengthMin - 1);
      expect(m.observed).toBeLessThanOrEqual(detail.wavelengthMax + 1);
    }
    const byName = new Map(res.body.lines.map((m: { name: string }) => [m.name, m]));
    expect(byName.has('Ly-alpha')).toBe(false);
    const halpha = byName.get('H-alpha') as { detected: boolean; snr: number; flux: number; fluxErr: number; offsetKms: number };
    expect(halpha.detected).toBe(true);
    expect(halpha.snr).toBeGreaterThan(5);
    expect(halpha.flux).toBeGreaterThan(0);
    expect(Math.abs(halpha.offsetKms)).toBeLessThan(150);
    // Not every line in range is seen: the measurement is what decides, not the comb.
    const detected = res.body.lines.filter((m: { detected: boolean }) => m.detected).length;
    expect(detected).toBeGreaterThan(1);
    expect(detected).toBeLessThan(res.body.lines.length);
    expect(res.body.resolution.from).toMatch(/pixel scale/);
    // For a galaxy solution only the lines galaxy templates draw are measured: no stellar bands.
    const galaxy = (await reader1.get(`/api/spectra/${ids[2]}/lines?z=${z}&class=galaxy`)).body.lines.map((m: { name: string }) => m.name);
    expect(galaxy).toContain('H-alpha');
    expect(galaxy).not.toContain('C2 5165');
    expect(galaxy.length).toBeLessThan(res.body.lines.length);
    // 2000 pixels over 3600–9800 Å: 150.2 km/s per pixel, FWHM 300.5 km/s → σ_z = (1 + z) × 300.5 / (2.355 c).
    expect(res.body.resolution.pixelKms).toBeCloseTo(150.2, 0);
    expect(res.body.zErrFloor).toBeCloseTo(((1 + z) * 300.45) / (2.3548 * 299792.458), 6);
  });

  it('answers a bad z with a clear 400, and an unknown spectrum with 404', async () => {
    const bad = await reader1.get(`/api/spectra/${ids[0]}/lines?z=abc`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('invalid_input');
    expect(bad.body.error.message).toMatch(/z/);
    expect((await reader1.get(`/api/spectra/${ids[0]}/lines`)).status).toBe(400);
    expect((await reader1.get(`/api/spectra/${ids[0]}/lines?z=40`)).status).toBe(400);
    expect((await reader1.get('/api/spectra/99999/lines?z=1')).status).toBe(404);
  });
});

describe('readings store the measurements of the lines used', () => {
  it('stores one measurement per line used that is on the data, and widens the error by the resolution floor', async () => {
    const id = ids[2]!;
    const z = await topZ(reader1, id);
    const res = await reader1.post(`/api/spectra/${id}/readings`).send({ z, zErr: 2e-5, grade: 'sure', class: 'galaxy', lines: ['H-alpha', 'H-beta', 'Ly-alpha'] });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const reading = res.body.reading;
    const floor = reading.lineMeasurements.zErrFloor;
    expect(floor).toBeGreaterThan(4e-4);
    expect(reading.zErr).toBeCloseTo(Math.hypot(2e-5, floor), 10);
    // Ly-alpha lies off the data at z = 0.26: it stays among the lines named but has no measurement.
    expect(reading.lines).toEqual(['H-alpha', 'H-beta', 'Ly-alpha']);
    expect(reading.lineMeasurements.lines.map((m: { name: string }) => m.name)).toEqual(['H-beta', 'H-alpha']);
    const [hbeta, halpha] = reading.lineMeasurements.lines;
    expect(halpha).toMatchObject({ name: 'H-alpha', detected: true, measure: 'flux' });
    expect(halpha.snr).toBeGreaterThan(5);
    // Hβ was ticked by hand: stored with its measurement, which says it is not detected.
    expect(hbeta).toMatchObject({ name: 'H-beta', detected: false });
    // Saving the same reading again changes nothing: the measurement is deterministic.
    const again = await reader1.post(`/api/spectra/${id}/readings`).send({ z, zErr: 2e-5, grade: 'sure', class: 'galaxy', lines: ['H-alpha', 'H-beta', 'Ly-alpha'] });
    expect(again.body.changed).toBe(false);
  });

  it('a confirmed value carries the measurements and an error not below the floor, though the mean of two would shrink it', async () => {
    const id = ids[2]!;
    const z = await topZ(reader2, id);
    await reader2.post(`/api/spectra/${id}/readings`).send({ z, zErr: 2e-5, grade: 'sure', class: 'galaxy', lines: ['H-alpha', '[O III] 5008'] });
    const confirmed = (await lead.get(`/api/spectra/${id}/confirmed`)).body;
    const current = confirmed.history.find((h: { isCurrent: boolean }) => h.isCurrent);
    expect(current.lines).toEqual(['H-alpha', 'H-beta', 'Ly-alpha', '[O III] 5008']);
    const floor = (await reader1.get(`/api/spectra/${id}/lines?z=${z}`)).body.zErrFloor;
    expect(current.zErr).toBeGreaterThanOrEqual(floor);

    // The CSV export: z to the digits of its error, the error not below the floor, the lines with their measurements.
    const csv = await lead.get('/api/campaigns/1/confirmed?format=csv');
    const row = Papa.parse<Record<string, string>>(csv.text, { header: true, comments: '#', skipEmptyLines: true }).data.find((r) => r.spectrum_id === String(id))!;
    const decimals = row.z!.split('.')[1]!.length;
    expect(decimals).toBeLessThanOrEqual(2 - 1 - Math.floor(Math.log10(current.zErr)));
    expect(Math.abs(Number(row.z) - current.z)).toBeLessThanOrEqual(0.5 * 10 ** -decimals + 1e-12);
    expect(Number(row.z_err)).toBeGreaterThanOrEqual(Number(row.z_err_floor));
    expect(Number(row.z_err_floor)).toBeCloseTo(floor, 8);
    expect(row.lines_measured).toMatch(/H-alpha:flux=[0-9.e+-]+\+\/-[0-9.e+-]+:sn=\d+\.\d:dv=-?\d+/);
    expect(row.lines_measured).toMatch(/H-beta:flux=.*below-3sigma/);
    expect(row.z_caveat).toBe('');
    expect(csv.text).toMatch(/^# lya_caveat: .*Shapley et al\. 2003, from memory/m);
  });

  it('a reading saved before lines were measured still loads', async () => {
    const id = ids[0]!;
    await reader1.post(`/api/spectra/${id}/readings`).send({ z: 0.2, grade: 'likely', class: 'galaxy', lines: ['H-alpha'] });
    t.ctx.db.update(readings).set({ lineMeasurements: null }).where(and(eq(readings.spectrumId, id))).run();
    const detail = (await lead.get(`/api/spectra/${id}`)).body;
    expect(spectrumDetailSchema.safeParse(detail).error).toBeUndefined();
    expect(detail.readings[0].lineMeasurements).toBeNull();
    expect(detail.readings[0].lines).toEqual(['H-alpha']);
  });

  it('a confirmed record made before lines were measured still exports, with its lines and no measurements', async () => {
    const id = ids[0]!;
    await reader2.post(`/api/spectra/${id}/readings`).send({ z: 0.2, grade: 'likely', class: 'galaxy', lines: ['H-alpha'] });
    t.ctx.db.update(readings).set({ lineMeasurements: null }).where(eq(readings.spectrumId, id)).run();
    t.ctx.db.update(confirmedRedshifts).set({ lineMeasurements: null }).where(eq(confirmedRedshifts.spectrumId, id)).run();
    const page = (await lead.get('/api/campaigns/1/confirmed')).body;
    const row = page.rows.find((r: { spectrumId: number }) => r.spectrumId === id);
    expect(row).toMatchObject({ lines: ['H-alpha'], lineMeasurements: [], lineFluxUnit: null, zErrFloor: null });
    for (const format of ['csv', 'ecsv', 'votable', 'fits']) expect((await lead.get(`/api/campaigns/1/confirmed?format=${format}`)).status, format).toBe(200);
    const csv = Papa.parse<Record<string, string>>((await lead.get('/api/campaigns/1/confirmed?format=csv')).text, { header: true, comments: '#', skipEmptyLines: true });
    const old = csv.data.find((r) => r.spectrum_id === String(id))!;
    expect(old).toMatchObject({ lines: 'H-alpha', lines_measured: '', z_err_floor: '' });
  });
});
