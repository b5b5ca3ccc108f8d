import { strToU8 } from 'fflate';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spectrumToCsv } from '../../backend/src/demo/spectrum-files';
import { generateSyntheticSpectrum } from '../../backend/src/spectra/generateSyntheticSpectrum';
import { concat, float32BE, header, padData } from '../unit/spectra/fits-writer';
import { zip } from '../helpers/spectrum-archives';
import { createTestApp, type TestApp, waitForJob } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ SCAN_THREADS: '1' });
}, 60_000);
afterAll(() => t.cleanup());


/** An echelle-pipeline-like FITS file: instrument, date and exposure in the primary header; object, position and unit on the extension. */
function echelleFits(): Uint8Array {
  const s = generateSyntheticSpectrum({ class: 'galaxy', z: 1.288, snr: 10, seed: 7, pixels: 1500 });
  const n = s.flux.length;
  const lo = s.wavelength[0]!;
  const step = (s.wavelength[n - 1]! - lo) / (n - 1);
  const primary = header([
    ['SIMPLE', true],
    ['BITPIX', 8],
    ['NAXIS', 0],
    ['EXTEND', true],
    ['INSTRUME', 'DEMO-ECHELLE'],
    ['DATE-OBS', '2024-03-05T01:02:03'],
    ['EXPTIME', 1800],
  ]);
  const ext = header([
    ['XTENSION', 'IMAGE'],
    ['BITPIX', -32],
    ['NAXIS', 1],
    ['NAXIS1', n],
    ['PCOUNT', 0],
    ['GCOUNT', 1],
    ['CTYPE1', 'WAVE'],
    ['CRPIX1', 1],
    ['CRVAL1', lo],
    ['CDELT1', step],
    ['OBJECT', 'LNT-C3.2'],
    ['RA', 160.512],
    ['DEC', -11.634],
    ['BUNIT', '10^-17 erg/s/cm2/A'],
  ]);
  return concat(primary, ext, padData(float32BE(Array.from(s.flux))));
}

describe('the per-file upload report', () => {
  it('says for every file whether it was stored, a duplicate or failed (why), its target or none, and its top solution', { timeout: 90_000 }, async () => {
    const lead = await t.signIn('lead@demo.test');
    const catalogue = ['ID,RA,DEC', 'LNT-C3.1,160.5000,-11.6300', 'LNT-C3.2,160.5300,-11.6500'].join('\n');
    const imported = await lead.post('/api/campaigns/1/targets').attach('files', Buffer.from(catalogue), 'targets.csv');
    expect(imported.status, JSON.stringify(imported.body)).toBe(200);
    const galaxy = strToU8(spectrumToCsv(generateSyntheticSpectrum({ class: 'galaxy', z: 1.288, snr: 9, seed: 3, pixels: 2000 }), 'flux in 1e-17 erg/s/cm^2/A'));
    const loner = strToU8(spectrumToCsv(generateSyntheticSpectrum({ class: 'galaxy', z: 0.6, snr: 9, seed: 4, pixels: 2000 })));
    const archive = zip({ 'LNT-C3.1.csv': galaxy, 'mystery-object.csv': loner, 'copy/LNT-C3.1-again.csv': galaxy, 'echelle_0042.fits': echelleFits(), 'notes/empty.txt': new Uint8Array(0) });
    const res = await lead.post('/api/campaigns/1/uploads').attach('files', archive, 'night7.zip');
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    await waitForJob(lead, res.body.jobId);

    const report = await lead.get(`/api/jobs/${res.body.jobId}/files`);
    expect(report.status).toBe(200);
    expect(report.body).toMatchObject({ jobId: res.body.jobId, total: 5, truncated: false });
    const byFile = Object.fromEntries(report.body.files.map((f: { file: string }) => [f.file.replace('night7.zip/', ''), f]));
    expect(Object.keys(byFile).sort()).toEqual(['LNT-C3.1.csv', 'copy/LNT-C3.1-again.csv', 'echelle_0042.fits', 'mystery-object.csv', 'notes/empty.txt']);

    expect(byFile['LNT-C3.1.csv']).toMatchObject({ state: 'done', outcome: 'stored', error: null, target: { catalogueId: 'LNT-C3.1', linkMethod: 'file-name' }, readersAssigned: 0 });
    expect(byFile['LNT-C3.1.csv'].scan.spectrumClass).toEqual(expect.any(String));
    expect(typeof byFile['LNT-C3.1.csv'].scan.zBest).toBe('number');
    // The same bytes again in the same upload: a duplicate pointing at the stored spectrum.
    expect(byFile['copy/LNT-C3.1-again.csv']).toMatchObject({ state: 'done', outcome: 'duplicate', spectrumId: byFile['LNT-C3.1.csv'].spectrumId });
    expect(byFile['mystery-object.csv']).toMatchObject({ outcome: 'stored', target: null });
    expect(byFile['echelle_0042.fits']).toMatchObject({ outcome: 'stored', objectName: 'LNT-C3.2', instrument: 'DEMO-ECHELLE', target: { catalogueId: 'LNT-C3.2', linkMethod: 'object-keyword' } });
    expect(byFile['notes/empty.txt']).toMatchObject({ state: 'failed', outcome: null, spectrumId: null, error: { code: 'empty-file', message: 'The file is empty.' } });

    // Header metadata from the primary and the extension header, and the flux unit, on the spectrum detail.
    const detail = await lead.get(`/api/spectra/${byFile['echelle_0042.fits'].spectrumId}`);
    expect(detail.status).toBe(200);
    expect(detail.body.spectrum).toMatchObject({
      objectName: 'LNT-C3.2',
      instrument: 'DEMO-ECHELLE',
      dateObs: '2024-03-05T01:02:03',
      exposureS: 1800,
      ra: 160.512,
      dec: -11.634,
      fluxUnit: { quantity: 'f-lambda', scale: 1e-17, unit: 'erg s⁻¹ cm⁻² Å⁻¹', raw: '10^-17 erg/s/cm2/A' },
    });
    const csvDetail = await lead.get(`/api/spectra/${byFile['LNT-C3.1.csv'].spectrumId}`);
    expect(csvDetail.body.spectrum.fluxUnit).toEqual({ quantity: 'f-lambda', scale: 1e-17, unit: 'erg s⁻¹ cm⁻² Å⁻¹', raw: '1e-17 erg/s/cm^2/A' });
    const plain = await lead.get(`/api/spectra/${byFile['mystery-object.csv'].spectrumId}`);
    expect(plain.body.spectrum.fluxUnit).toEqual({ quantity: 'arbitrary', scale: 1, unit: 'arbitrary', raw: null });

    // The plotted arrays carry the same unit in their header.
    const data = await lead.get(`/api/spectra/${byFile['echelle_0042.fits'].spectrumId}/data`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(data.status).toBe(200);
    const body = data.body as Buffer;
    const head = JSON.parse(body.subarray(4, 4 + body.readUInt32LE(0)).toString('utf8'));
    expect(head.fluxUnit).toMatchObject({ quantity: 'f-lambda', scale: 1e-17 });

    // Assigning afterwards (the existing route) shows in the report.
    const members = await lead.get('/api/campaigns/1/members');
    const readers = members.body.members.filter((m: { role: string }) => m.role === 'reader').map((m: { userId: number }) => m.userId);
    const assigned = await lead.post('/api/campaigns/1/assignments').send({ readerIds: readers });
    expect(assigned.status, JSON.stringify(assigned.body)).toBe(200);
    const after = await lead.get(`/api/jobs/${res.body.jobId}/files`);
    const stored = after.body.files.filter((f: { outcome: string }) => f.outcome === 'stored');
    expect(stored.map((f: { readersAssigned: number }) => f.readersAssigned)).toEqual([2, 2, 2]);
  });

  it('sorts the spectra list by file name ignoring case', async () => {
    const lead = await t.signIn('lead@demo.test');
    const list = await lead.get('/api/campaigns/1/spectra?sort=fileName&dir=asc');
    expect(list.body.rows.map((r: { fileName: string }) => r.fileName)).toEqual(['night7.zip/echelle_0042.fits', 'night7.zip/LNT-C3.1.csv', 'night7.zip/mystery-object.csv']);
  });

  it('shows each campaign\'s progress on the campaign list: unread, agreed, confirmed (not "agreed" to a reader)', async () => {
    const lead = await t.signIn('lead@demo.test');
    const progressOf = async (agent: ReturnType<TestApp['agent']>) => (await agent.get('/api/campaigns')).body.campaigns.find((c: { id: number }) => c.id === 1).progress;
    expect(await progressOf(lead)).toEqual({ spectra: 3, unread: 3, agreed: 0, confirmed: 0, openDisagreements: 0 });
    const list = await lead.get('/api/campaigns/1/spectra?sort=fileName');
    const id = list.body.rows[0].id;
    for (const email of ['reader1@demo.test', 'reader2@demo.test']) {
      const reader = await t.signIn(email);
      const saved = await reader.post(`/api/spectra/${id}/readings`).send({ z: 1.288, grade: 'sure', class: 'galaxy' });
      expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    }
    expect(await progressOf(lead)).toEqual({ spectra: 3, unread: 2, agreed: 1, confirmed: 1, openDisagreements: 0 });
    expect(await progressOf(await t.signIn('reader1@demo.test'))).toEqual({ spectra: 3, unread: 2, agreed: null, confirmed: 1, openDisagreements: null });
  });

  it('is for leads only, and a job of another campaign is not found for a stranger', async () => {
    const reader = await t.signIn('reader1@demo.test');
    const res = await reader.get('/api/jobs/1/files');
    expect(res.status).toBe(403);
  });
});
