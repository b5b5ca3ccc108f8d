import { describe, expect, it } from 'vitest';
import { SpectrumReadError } from '../../../backend/src/spectra/errors';
import { readSpectrum } from '../../../backend/src/spectra/readSpectrum';

const encode = (s: string) => new TextEncoder().encode(s);
const rows = (f: (i: number) => string) => Array.from({ length: 50 }, (_, i) => f(i)).join('\n') + '\n';

describe('text tables: which column is the flux', () => {
  it('refuses a header that names columns but no flux column, saying so', () => {
    const bytes = encode('wavelength,sky\n' + rows((i) => `${4000 + i},${i % 7}`));
    expect(() => readSpectrum(bytes)).toThrowError(SpectrumReadError);
    try {
      readSpectrum(bytes);
    } catch (e) {
      expect((e as SpectrumReadError).code).toBe('text-table');
      expect((e as Error).message).toMatch(/^Line 1: .*wavelength, sky.*no(ne of them is a)? flux column/);
    }
  });

  it('refuses a commented header without a flux column, naming its line', () => {
    const bytes = encode('# observed with a long slit\n# wave err sky\n' + rows((i) => `${4000 + i} 0.1 ${i % 7}`));
    expect(() => readSpectrum(bytes)).toThrowError(/Line 2: .*flux column/);
  });

  it('takes the named flux column wherever it sits', () => {
    // A little scatter (0, 0.1, 0.2): without an error column the uncertainties are estimated from it.
    const s = readSpectrum(encode('sky,wavelength,flux\n' + rows((i) => `${i % 7},${4000 + i},${10 + i + (i % 3) / 10}`)));
    expect(s.flux[3]).toBe(13);
    expect(s.wavelength[3]).toBe(4003);
    expect(s.meta.columns.flux).toBe('flux');
  });

  it('reads columns by position when there is no header (wavelength, flux, error)', () => {
    const s = readSpectrum(encode(rows((i) => `${4000 + i} ${10 + i} 0.5`)));
    expect(s.flux[0]).toBe(10);
    expect(s.ivar[0]).toBeCloseTo(4, 12);
  });
});
