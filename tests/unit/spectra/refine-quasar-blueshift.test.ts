import { describe, expect, it } from 'vitest';
import { generateSyntheticSpectrum } from '../../../backend/src/spectra/generateSyntheticSpectrum';
import { blueshiftPriorChi2 } from '../../../backend/src/spectra/refineQuasarBlueshift';
import { scanSpectrum } from '../../../backend/src/spectra/scanSpectrum';
import { quasarBlueshiftOf, quasarTemplateId } from '../../../backend/src/spectra/templateRecipes';

const C_KMS = 299_792.458;
const dv = (z: number, truth: number) => (C_KMS * (z - truth)) / (1 + truth);

describe('fitted quasar blueshift (refineQuasarBlueshift.ts)', () => {
  it('names the steps and keeps the two scanned templates for 2500 and 5000 km/s', () => {
    expect(quasarTemplateId(2500)).toBe('quasar');
    expect(quasarTemplateId(5000)).toBe('quasar-strong-outflow');
    expect(quasarTemplateId(1000)).toBe('quasar-blueshift-1000');
    expect(quasarBlueshiftOf('quasar-blueshift-1000')).toBe(1000);
    expect(quasarBlueshiftOf('galaxy-emission')).toBeUndefined();
    expect(blueshiftPriorChi2(1500)).toBe(0);
    expect(blueshiftPriorChi2(5500)).toBeCloseTo(4, 12);
  });

  // A quasar whose C IV, Si IV, N V and He II sit at systemic (issue 11, family 4): with only the
  // fixed 2500 km/s pattern the fit is pulled high; with the fitted blueshift it lands on z.
  it.each([
    [1.9, 'quasar-blueshift-0', 0],
    [2.4, 'quasar-blueshift-1000', 1000],
    [1.7, 'quasar-blueshift-4000', 4000],
  ])('quasar at z = %s drawn with %s is found within 300 km/s and near its blueshift', (z, template, v) => {
    const spectrum = generateSyntheticSpectrum({ class: 'quasar', template, z, snr: 15, seed: 11, pixels: 4000, wavelengthMin: 3700, wavelengthMax: 9200 });
    const top = scanSpectrum(spectrum).solutions[0]!;
    expect(top.class).toBe('quasar');
    expect(Math.abs(dv(top.z, z))).toBeLessThan(300);
    expect(Math.abs(quasarBlueshiftOf(top.template)! - v)).toBeLessThanOrEqual(1000);
  });

  it('keeps refined solutions inside the redshift range the scan was asked for', () => {
    const spectrum = generateSyntheticSpectrum({ class: 'quasar', template: 'quasar-blueshift-0', z: 1.9, snr: 15, seed: 11, pixels: 4000, wavelengthMin: 3700, wavelengthMax: 9200 });
    const solutions = scanSpectrum(spectrum, { zMin: 1.905, zMax: 3 }).solutions;
    expect(solutions.length).toBeGreaterThan(0);
    for (const s of solutions) expect(s.z).toBeGreaterThanOrEqual(1.905 - 1e-9);
  });
});
