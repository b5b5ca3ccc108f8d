import { describe, expect, it } from 'vitest';
import { gzipSync } from 'fflate';
import { readSpectrum } from '../../backend/src/spectra/readSpectrum';
import { SpectrumReadError } from '../../backend/src/spectra/errors';
import { concat, float32BE, header, padData, type Card } from '../unit/spectra/fits-writer';

// Files written byte by byte to the FITS 4.0 layout (Pence et al. 2010, A&A 524, A42: 2880-byte
// blocks of 80-character ASCII cards, big-endian IEEE data; binary tables §7.3); WCS keywords
// after Greisen et al. 2006 (Paper III: WAVE, AWAV, WAVE-LOG).
describe('FITS files written to the standard layout', () => {
  const flux = Array.from({ length: 50 }, (_, i) => 10 + Math.sin(i / 3));

  it('1D primary image with linear WAVE WCS in Å', () => {
    const bytes = concat(
      header([['SIMPLE', true], ['BITPIX', -32], ['NAXIS', 1], ['NAXIS1', 50], ['CTYPE1', 'WAVE'], ['CUNIT1', 'Angstrom'], ['CRVAL1', 5000], ['CDELT1', 2], ['CRPIX1', 1]]),
      padData(float32BE(flux)),
    );
    const s = readSpectrum(bytes);
    expect(s.wavelength.length).toBe(50);
    expect(s.wavelength[0]).toBeCloseTo(5000, 6);
    expect(s.wavelength[49]).toBeCloseTo(5098, 6);
    expect(s.flux[3]).toBeCloseTo(flux[3]!, 5);
    expect(s.meta.medium).toBe('vacuum');
    expect(s.meta.errorsEstimated).toBe(true);
  });

  it('AWAV in nm is converted to Å and marked air; CRPIX offsets the reference pixel', () => {
    const bytes = concat(
      header([['SIMPLE', true], ['BITPIX', -32], ['NAXIS', 1], ['NAXIS1', 50], ['CTYPE1', 'AWAV'], ['CUNIT1', 'nm'], ['CRVAL1', 600], ['CDELT1', 0.5], ['CRPIX1', 11]]),
      padData(float32BE(flux)),
    );
    const s = readSpectrum(bytes);
    expect(s.meta.medium).toBe('air');
    expect(s.wavelength[10]).toBeCloseTo(6000, 4);
    expect(s.wavelength[0]).toBeCloseTo(5950, 4);
  });

  it('WAVE-LOG: λ = CRVAL1·exp(CDELT1·(p − CRPIX1)/CRVAL1) (Paper III)', () => {
    const bytes = concat(
      header([['SIMPLE', true], ['BITPIX', -32], ['NAXIS', 1], ['NAXIS1', 50], ['CTYPE1', 'WAVE-LOG'], ['CUNIT1', 'Angstrom'], ['CRVAL1', 4000], ['CDELT1', 1], ['CRPIX1', 1]]),
      padData(float32BE(flux)),
    );
    const s = readSpectrum(bytes);
    expect(s.wavelength[49]).toBeCloseTo(4000 * Math.exp(49 / 4000), 6);
  });

  it('log-linear DC-FLAG = 1 and COEFF0/COEFF1 conventions (log10 Å), common practice of IRAF/SDSS', () => {
    const dc = concat(
      header([['SIMPLE', true], ['BITPIX', -32], ['NAXIS', 1], ['NAXIS1', 50], ['CTYPE1', 'LINEAR'], ['DC-FLAG', 1], ['CRVAL1', 3.6], ['CDELT1', 1e-4], ['CRPIX1', 1]]),
      padData(float32BE(flux)),
    );
    expect(readSpectrum(dc).wavelength[10]).toBeCloseTo(10 ** 3.601, 6);
    const coeff = concat(
      header([['SIMPLE', true], ['BITPIX', -32], ['NAXIS', 1], ['NAXIS1', 50], ['COEFF0', 3.58], ['COEFF1', 1e-4], ['VACUUM', true]]),
      padData(float32BE(flux)),
    );
    const s = readSpectrum(coeff);
    expect(s.wavelength[0]).toBeCloseTo(10 ** 3.58, 6);
    expect(s.meta.medium).toBe('vacuum');
  });

  it('standard CRVAL1/CD1_1 win over stale COEFF0/COEFF1 (an IRAF rewrite of an SDSS spectrum)', () => {
    // IRAF writes the linear dispersion it applied in CRVAL1/CD1_1 with DC-FLAG = 0 and keeps the
    // SDSS COEFFn cards it did not touch (common practice).
    const bytes = concat(
      header([['SIMPLE', true], ['BITPIX', -32], ['NAXIS', 1], ['NAXIS1', 50], ['CTYPE1', 'LINEAR'], ['DC-FLAG', 0], ['COEFF0', 3.5811], ['COEFF1', 1e-4], ['CRVAL1', 3634.79], ['CD1_1', 1.343], ['CRPIX1', 1]]),
      padData(float32BE(flux)),
    );
    const s = readSpectrum(bytes);
    expect(s.wavelength[0]).toBeCloseTo(3634.79, 3);
    expect(s.wavelength[10]).toBeCloseTo(3634.79 + 13.43, 3);
  });

  it('an axis Doppler-corrected to the header Z (ends = COEFF0/COEFF1 range ÷ (1 + Z)) is put back to observed wavelengths', () => {
    // Common practice (IRAF-style dopcor + linear re-dispersion of an SDSS spectrum): CRVAL1/CD1_1
    // span the observed COEFF0/COEFF1 range divided by 1 + Z, and Z is kept in the header.
    const n = 200;
    const z = 0.05;
    const first = 4000;
    const last = 10 ** (Math.log10(first) + 1e-4 * (n - 1));
    const cards: Card[] = [['SIMPLE', true], ['BITPIX', -32], ['NAXIS', 1], ['NAXIS1', n], ['CTYPE1', 'LINEAR'], ['DC-FLAG', 0], ['COEFF0', Math.log10(first)], ['COEFF1', 1e-4], ['CRVAL1', first / (1 + z)], ['CD1_1', (last - first) / (1 + z) / (n - 1)], ['CRPIX1', 1]];
    // A little scatter: a file without errors is weighted by the scatter of its flux, and a
    // perfectly flat one (nothing to estimate from) is refused.
    const data = padData(float32BE(Array.from({ length: n }, (_, i) => 1 + 0.01 * ((i * 7) % 5))));
    const shifted = readSpectrum(concat(header([...cards, ['Z', z]]), data));
    expect(shifted.wavelength[0]).toBeCloseTo(first, 2);
    expect(shifted.wavelength[n - 1]).toBeCloseTo(last, 2);
    expect(shifted.wavelength[100]).toBeCloseTo((first / (1 + z) + (100 * (last - first)) / (1 + z) / (n - 1)) * (1 + z), 2);
    expect(shifted.meta.warnings.join(' ')).toMatch(/rest frame/);
    // Without Z nothing says the axis was shifted: the standard keywords stand.
    const plain = readSpectrum(concat(header(cards), data));
    expect(plain.wavelength[0]).toBeCloseTo(first / (1 + z), 2);
  });

  it('binary table with loglam/flux/ivar columns, TSCAL/TZERO on an integer column, gzip', () => {
    const rows = 20;
    const rowBytes = 4 + 4 + 4 + 2;
    const data = new Uint8Array(rows * rowBytes);
    const view = new DataView(data.buffer);
    for (let r = 0; r < rows; r++) {
      view.setFloat32(r * rowBytes, 3.7 + r * 1e-4);
      view.setFloat32(r * rowBytes + 4, 2 + r);
      view.setFloat32(r * rowBytes + 8, 4);
      view.setInt16(r * rowBytes + 12, r === 5 ? 1 : 0);
    }
    const bytes = concat(
      header([['SIMPLE', true], ['BITPIX', 8], ['NAXIS', 0], ['EXTEND', true]]),
      header([
        ['XTENSION', 'BINTABLE'], ['BITPIX', 8], ['NAXIS', 2], ['NAXIS1', rowBytes], ['NAXIS2', rows], ['PCOUNT', 0], ['GCOUNT', 1], ['TFIELDS', 4],
        ['TTYPE1', 'loglam'], ['TFORM1', 'E'], ['TTYPE2', 'flux'], ['TFORM2', 'E'], ['TTYPE3', 'ivar'], ['TFORM3', 'E'],
        ['TTYPE4', 'badpix'], ['TFORM4', 'I'], ['TSCAL4', 1], ['TZERO4', 0],
      ]),
      padData(data),
    );
    for (const input of [bytes, gzipSync(bytes)]) {
      const s = readSpectrum(input);
      expect(s.wavelength.length).toBe(rows);
      expect(s.wavelength[0]).toBeCloseTo(10 ** 3.7, 2);
      expect(s.flux[7]).toBe(9);
      expect(s.ivar[0]).toBe(4);
      expect(s.mask[5]).toBe(1);
      expect(s.ivar[5]).toBe(0);
      expect(s.meta.columns.flux).toBe('flux');
    }
  });

  it('2D image with labelled rows (flux, error, mask)', () => {
    const n = 30;
    const rows = [Array(n).fill(5), Array(n).fill(0.5), Array.from({ length: n }, (_, i) => (i === 3 ? 1 : 0))].flat();
    const bytes = concat(
      header([['SIMPLE', true], ['BITPIX', -32], ['NAXIS', 2], ['NAXIS1', n], ['NAXIS2', 3], ['CRVAL1', 5000], ['CDELT1', 1], ['ARRAY1', 'SPECTRUM'], ['ARRAY2', 'ERROR'], ['ARRAY3', 'MASK']]),
      padData(float32BE(rows)),
    );
    const s = readSpectrum(bytes);
    expect(s.ivar[0]).toBeCloseTo(4, 6);
    expect(s.mask[3]).toBe(1);
    expect(s.meta.errorsEstimated).toBe(false);
  });

  it('a header claiming NAXIS1 = 10^12 is a typed error naming the HDU, not an allocation', () => {
    const bytes = concat(header([['SIMPLE', true], ['BITPIX', -32], ['NAXIS', 1], ['NAXIS1', 1e12]]), new Uint8Array(2880));
    expect(() => readSpectrum(bytes)).toThrowError(SpectrumReadError);
    expect(() => readSpectrum(bytes)).toThrowError(/HDU 0: the header claims 4000000000000 data bytes/);
  });
});
