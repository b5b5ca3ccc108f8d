import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { REAL_SPECTRA_DIR } from '../../../backend/src/fuzz/load-corpus';
import { seededRandom } from '../../../backend/src/fuzz/mutate-spectrum';
import { SpectrumReadError } from '../../../backend/src/spectra/errors';
import { generateSyntheticSpectrum } from '../../../backend/src/spectra/generateSyntheticSpectrum';
import { readSpectrum } from '../../../backend/src/spectra/readSpectrum';
import { MAX_GRID_PIXELS, resampleToLogGrid } from '../../../backend/src/spectra/resampleToLogGrid';
import { assertFiniteScan, nonFiniteInScan } from '../../../backend/src/spectra/scanResultCheck';
import { scanSpectrum } from '../../../backend/src/spectra/scanSpectrum';
import { concat, float32BE, header, padData, type Card } from './fits-writer';

const quasarText = readFileSync(path.join(REAL_SPECTRA_DIR, 'highz/J0836+0054_ESI.txt'), 'utf8');
const encode = (s: string) => new TextEncoder().encode(s);

/** The quasar's text table with the wavelength on file line `line` replaced by `value`. */
function withWavelength(line: number, value: string): Uint8Array {
  const lines = quasarText.split('\n');
  lines[line - 1] = lines[line - 1]!.replace(/^\S+/, value);
  return encode(lines.join('\n'));
}

function readError(bytes: Uint8Array): SpectrumReadError {
  try {
    readSpectrum(bytes);
  } catch (e) {
    if (e instanceof SpectrumReadError) return e;
    throw e;
  }
  throw new Error('the file was read');
}

describe('wavelengths a reader refuses (defect: scans that never finished)', () => {
  it.each([
    ['1e308', 'outside 100 Å – 1 mm'],
    ['1e-320', 'outside 100 Å – 1 mm'],
    ['-4000', 'not positive'],
    ['nan', 'not a number'],
    ['inf', 'not a number'],
    ['Infinity', 'infinite'],
    ['50', 'outside 100 Å – 1 mm'],
  ])('a text table with %s on line 500 is refused naming the line', (value, why) => {
    const e = readError(withWavelength(500, value));
    expect(e.code).toBe('bad-wavelength');
    expect(e.message).toContain('Text table, line 500: the wavelength');
    expect(e.message).toContain(why);
  });

  it('the real file itself still reads (1850 pixels, 3901.9 – 10926.5 Å)', () => {
    const s = readSpectrum(encode(quasarText));
    expect(s.wavelength.length).toBe(1850);
    expect(s.wavelength[0]).toBeCloseTo(3901.93, 2);
    expect(s.meta.ignoredPixels).toBe(0);
  });

  it('a FITS image whose WCS reaches past 1 mm is refused naming the pixel and the keywords', () => {
    const bytes = concat(header([['SIMPLE', true], ['BITPIX', -32], ['NAXIS', 1], ['NAXIS1', 40], ['CRVAL1', 5000], ['CDELT1', 1e306], ['CRPIX1', 1]]), padData(float32BE(Array.from({ length: 40 }, (_, i) => 1 + (i % 7)))));
    const e = readError(bytes);
    expect(e.code).toBe('bad-wavelength');
    expect(e.message).toMatch(/^FITS HDU 0 image, pixel 2 \(from CRVAL1 = 5000, CDELT1 = 1e\+306, CRPIX1 = 1\): the wavelength 1e\+306 Å is outside 100 Å – 1 mm/);
  });

  it('a binary table with a NaN wavelength is refused naming the row and the column', () => {
    const rows = 20;
    const data = new Uint8Array(rows * 8);
    const view = new DataView(data.buffer);
    for (let r = 0; r < rows; r++) {
      view.setFloat32(r * 8, r === 7 ? NaN : 5000 + r);
      view.setFloat32(r * 8 + 4, 1 + (r % 3));
    }
    const table: Card[] = [['XTENSION', 'BINTABLE'], ['BITPIX', 8], ['NAXIS', 2], ['NAXIS1', 8], ['NAXIS2', rows], ['PCOUNT', 0], ['GCOUNT', 1], ['TFIELDS', 2], ['TTYPE1', 'WAVE'], ['TFORM1', 'E'], ['TTYPE2', 'FLUX'], ['TFORM2', 'E']];
    const e = readError(concat(header([['SIMPLE', true], ['BITPIX', 8], ['NAXIS', 0], ['EXTEND', true]]), header(table), padData(data)));
    expect(e.code).toBe('bad-wavelength');
    expect(e.message).toMatch(/^FITS HDU 1 binary table, row 8 of column WAVE: the wavelength NaN Å is not a number/);
  });
});

describe('sizes checked before anything is allocated', () => {
  const primary: Card[] = [['SIMPLE', true], ['BITPIX', 8], ['NAXIS', 0], ['EXTEND', true]];
  const table = (extra: Card[], naxis2 = 10): Card[] => [['XTENSION', 'BINTABLE'], ['BITPIX', 8], ['NAXIS', 2], ['NAXIS1', 8], ['NAXIS2', naxis2], ...extra, ['TFIELDS', 2], ['TTYPE1', 'WAVE'], ['TTYPE2', 'FLUX']];
  const withTable = (cards: Card[]) => concat(header(primary), header(cards), new Uint8Array(2880));

  it('GCOUNT other than 1 in a binary table (it made the decoder read past its data)', () => {
    const e = readError(withTable(table([['PCOUNT', 0], ['GCOUNT', 0], ['TFORM1', 'E'], ['TFORM2', 'E']])));
    expect(e.code).toBe('fits-header');
    expect(e.message).toBe('HDU 1: GCOUNT = 0, but a binary table must have GCOUNT = 1.');
  });

  it('THEAP outside the heap', () => {
    const e = readError(withTable(table([['PCOUNT', 0], ['GCOUNT', 1], ['THEAP', 1e12], ['TFORM1', 'E'], ['TFORM2', 'E']])));
    expect(e.code).toBe('fits-table');
    expect(e.message).toBe('HDU 1: THEAP = 1000000000000 is not a byte offset between the end of the table (80) and the end of the heap (80).');
  });

  it('a TFORM repeat count larger than the row', () => {
    const e = readError(withTable(table([['PCOUNT', 0], ['GCOUNT', 1], ['TFORM1', '99999999999999999999E'], ['TFORM2', 'E']])));
    expect(e.code).toBe('fits-table');
    expect(e.message).toMatch(/^HDU 1: TFORM1 = '99999999999999999999E' repeats 99999999999999999999 times, more than a row of NAXIS1 = 8 bytes can hold\.$/);
  });

  it('an image with PCOUNT ≠ 0', () => {
    const e = readError(concat(header([['SIMPLE', true], ['BITPIX', -32], ['NAXIS', 1], ['NAXIS1', 40], ['PCOUNT', 5], ['CRVAL1', 5000], ['CDELT1', 2]]), new Uint8Array(2880)));
    expect(e).toMatchObject({ code: 'fits-header', message: 'HDU 0: PCOUNT = 5, but an image must have PCOUNT = 0.' });
  });

  it('a spectrum of 10⁷ pixels is refused with the count', () => {
    const n = 10_000_000;
    const bytes = concat(header([['SIMPLE', true], ['BITPIX', -32], ['NAXIS', 1], ['NAXIS1', n], ['CRVAL1', 3600], ['CDELT1', 0.00064]]), new Uint8Array(Math.ceil((4 * n) / 2880) * 2880));
    expect(readError(bytes)).toMatchObject({ code: 'too-many-pixels', message: 'FITS HDU 0 image: 10,000,000 pixels along NAXIS1; Redward scans 1D spectra of at most 2,000,000 pixels.' });
  });

  it('a text table of 10⁷ lines is refused before it is split into lines', () => {
    const bytes = new Uint8Array(10_000_001 * 2).fill(0x0a);
    for (let i = 0; i < bytes.length; i += 2) bytes[i] = 0x31;
    expect(readError(bytes)).toMatchObject({ code: 'too-many-pixels' });
  });

  it('the resampler refuses a log grid past its limit before allocating it', () => {
    const w = Float64Array.from({ length: 10 }, (_, i) => 4000 + i);
    const ones = new Float64Array(10).fill(1);
    expect(() => resampleToLogGrid(w, ones, ones, 1e-10)).toThrowError(
      /^The log grid would have 108\d{5} pixels \(3999\.50 – 4009\.50 Å at 1e-10 dex per pixel\), more than the 2,000,000 allowed; check the wavelengths and the grid step\.$/,
    );
    expect(MAX_GRID_PIXELS).toBe(2_000_000);
  });

  it('duplicated byte regions of a real SDSS file give a spectrum or a reader error, never another exception', () => {
    const real = new Uint8Array(readFileSync(path.join(REAL_SPECTRA_DIR, 'sdss/spec-0266-51602-0001.fits')));
    const rnd = seededRandom(13);
    let refused = 0;
    for (let k = 0; k < 60; k++) {
      const len = 1 + Math.floor(rnd() * 20000);
      const from = Math.floor(rnd() * (real.length - len));
      const to = Math.floor(rnd() * real.length);
      const bytes = concat(real.subarray(0, to), real.subarray(from, from + len), real.subarray(to));
      try {
        const s = readSpectrum(bytes);
        for (let i = 0; i < s.wavelength.length; i++) expect(s.wavelength[i]).toBeGreaterThanOrEqual(100);
      } catch (e) {
        expect(e).toBeInstanceOf(SpectrumReadError);
        refused++;
      }
    }
    expect(refused).toBeGreaterThan(0);
  });
});

/** A synthetic galaxy at z = 0.42 as a text table (wavelength, flux, error) with `edit` applied per row. */
function galaxyTable(edit: (i: number, cols: [string, string, string]) => [string, string, string]): Uint8Array {
  const s = generateSyntheticSpectrum({ class: 'galaxy', z: 0.42, snr: 10, seed: 3, pixels: 3000 });
  const lines = ['# wavelength flux error (vacuum)'];
  for (let i = 0; i < s.wavelength.length; i++) {
    const sigma = s.ivar[i]! > 0 ? 1 / Math.sqrt(s.ivar[i]!) : 0;
    lines.push(edit(i, [String(s.wavelength[i]), String(s.flux[i]), String(sigma)]).join(' '));
  }
  return encode(lines.join('\n'));
}

describe('values that used to give "ok" with z = 0 and a NaN or zero χ²', () => {
  it('fluxes with NaN, ±Inf and ±1e308 mixed in are ignored and counted; the scan still finds z = 0.42', () => {
    const bad = ['nan', 'inf', '-inf', '1e308', '-1e308'];
    const bytes = galaxyTable((i, [w, f, e]) => (i % 7 === 3 ? [w, bad[i % bad.length]!, e] : [w, f, e]));
    const s = readSpectrum(bytes);
    expect(s.meta.ignoredPixels).toBe(429);
    expect(s.meta.warnings).toContain('429 pixels with non-finite or absurd values ignored.');
    const r = assertFiniteScan(scanSpectrum(s, { zMax: 2 }));
    expect(r.solutions[0]!.z).toBeCloseTo(0.42, 2);
    expect(Number.isFinite(r.chi2Null)).toBe(true);
  });

  it('an error column of zeros: uncertainties are estimated as for a file without one, and the result says so', () => {
    const zero = readSpectrum(galaxyTable((_, [w, f]) => [w, f, '0']));
    expect(zero.meta.errorsEstimated).toBe(true);
    expect(zero.meta.warnings).toContain('The file gives no usable uncertainty at any pixel (all zero, negative or not a number); uncertainties were estimated from the scatter of the flux instead.');
    const s = generateSyntheticSpectrum({ class: 'galaxy', z: 0.42, snr: 10, seed: 3, pixels: 3000 });
    const none = readSpectrum(encode(['# wavelength flux (vacuum)', ...Array.from(s.wavelength, (w, i) => `${w} ${s.flux[i]}`)].join('\n')));
    expect(none.meta.errorsEstimated).toBe(true);
    expect(Array.from(zero.ivar)).toEqual(Array.from(none.ivar));
    const a = assertFiniteScan(scanSpectrum(zero, { zMax: 2 }));
    const b = scanSpectrum(none, { zMax: 2 });
    expect(a.solutions.map((x) => [x.z, x.chi2])).toEqual(b.solutions.map((x) => [x.z, x.chi2]));
    expect(a.solutions[0]!.chi2).toBeGreaterThan(0);
  });

  it('errors that are NaN everywhere count as none, too', () => {
    const s = readSpectrum(galaxyTable((_, [w, f]) => [w, f, 'nan']));
    expect(s.meta.errorsEstimated).toBe(true);
    expect(s.meta.ignoredPixels).toBe(0);
  });

  it('a file with no finite flux at all is refused', () => {
    expect(readError(galaxyTable((_, [w, , e]) => [w, 'nan', e]))).toMatchObject({ code: 'text-table' });
    const fewGood = galaxyTable((_, [w, f, e]) => [w, Number(w) < 3603 ? f : 'nan', e]);
    expect(readError(fewGood).code).toMatch(/^(text-table|no-valid-pixels)$/);
  });

  it('the final guard names the first non-finite number of a scan', () => {
    const s = readSpectrum(galaxyTable((i, c) => c));
    const r = scanSpectrum(s, { zMax: 2 });
    expect(nonFiniteInScan(r)).toBeUndefined();
    const broken = { ...r, solutions: r.solutions.map((x, k) => (k === 1 ? { ...x, chi2: NaN } : x)) };
    expect(nonFiniteInScan(broken)).toBe(`solution 2 (${r.solutions[1]!.template}) has chi2 = NaN`);
    expect(() => assertFiniteScan(broken)).toThrow(/^The scan produced a non-finite number \(solution 2 .* has chi2 = NaN\)/);
  });
});
