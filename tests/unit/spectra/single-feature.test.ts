import { describe, expect, it } from 'vitest';
import { generateSyntheticSpectrum } from '../../../backend/src/spectra/generateSyntheticSpectrum';
import { zToShift } from '../../../backend/src/spectra/logGrid';
import { prepareSpectrum } from '../../../backend/src/spectra/prepareSpectrum';
import { scanSpectrum, templatesFor } from '../../../backend/src/spectra/scanSpectrum';
import { scanData, scanTemplate } from '../../../backend/src/spectra/scanTemplate';
import { featureShare, SHARE_CAP } from '../../../backend/src/spectra/singleFeatureCheck';
import type { Spectrum } from '../../../backend/src/spectra/types';

/** Share and penalty of the absorption-line galaxy's fit at the χ² minimum nearest z. */
function shareAt(s: Spectrum, z: number) {
  const prepared = prepareSpectrum(s);
  const set = templatesFor(prepared);
  const data = scanData(prepared);
  const template = set.templates.find((t) => t.id === 'galaxy-absorption')!;
  const curve = scanTemplate(data, set, template, z - 0.02, z + 0.02, 'fft')!;
  let k = 0;
  for (let i = 0; i < curve.chi2.length; i++) if (curve.chi2[i]! < curve.chi2[k]!) k = i;
  const amplitudes = curve.amplitudes.subarray(k * curve.maxBasis, (k + 1) * curve.maxBasis);
  return { shift: curve.sMin + k, ...featureShare(data, set, template, curve.sMin + k, amplitudes), chi2: curve.chi2[k]!, null: data.chi2Null };
}

/** A flat, featureless continuum with one deep absorption trough (σ = 10 Å) at `at` Å. */
function loneAbsorber(at: number): Spectrum {
  const n = 4000;
  let seed = 7;
  const random = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);
  const gauss = () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
  const wavelength = Float64Array.from({ length: n }, (_, i) => 3600 * (9800 / 3600) ** (i / (n - 1)));
  const sigma = 0.02;
  const flux = Float64Array.from(wavelength, (l) => 1 - 0.7 * Math.exp(-0.5 * ((l - at) / 10) ** 2) + sigma * gauss());
  return {
    wavelength, flux, ivar: new Float64Array(n).fill(1 / sigma ** 2), mask: new Uint8Array(n),
    fluxUnit: { quantity: 'arbitrary', scale: 1, unit: 'arbitrary', raw: null },
    meta: { source: 'test: lone absorber', medium: 'vacuum', mediumFrom: 'header', errorsEstimated: false, columns: {}, warnings: [] },
  };
}

describe('single-feature check: one dip does not make an absorption-line galaxy', () => {
  it('a lone absorption trough fitted as A-star Hα carries > 90 % of the gain in one window and is capped', () => {
    const z = 0.3;
    const r = shareAt(loneAbsorber(6564.61 * (1 + z)), z);
    expect(r.gain).toBeGreaterThan(100);
    expect(r.window / r.gain).toBeGreaterThan(SHARE_CAP);
    // Capped: what is left of the gain is at most 10× the gain outside the window.
    const rest = r.gain - r.window;
    expect(r.penalty).toBeCloseTo(r.window - (SHARE_CAP / (1 - SHARE_CAP)) * Math.max(0, rest), 6);
    expect(r.penalty).toBeGreaterThan(0.5 * r.gain);
  });

  it('a synthetic absorption-line galaxy spreads its gain over many features and is not touched', () => {
    const z = 0.3;
    const s = generateSyntheticSpectrum({ class: 'galaxy', template: 'galaxy-absorption', z, snr: 8, seed: 5 });
    const r = shareAt(s, z);
    expect(Math.abs(r.shift - zToShift(z, 1e-4))).toBeLessThanOrEqual(2);
    expect(r.window / r.gain).toBeLessThan(0.6);
    expect(r.penalty).toBe(0);
    const top = scanSpectrum(s).solutions[0]!;
    expect(top.template).toBe('galaxy-absorption');
    expect(top.singleFeaturePenalty).toBeUndefined();
    expect(top.featureShare).toBeLessThan(0.6);
  });

  it('the scan ranks a capped solution by its capped χ²: the lone trough is no longer the best galaxy', () => {
    const s = loneAbsorber(6564.61 * 1.3);
    const off = scanSpectrum(s, { singleFeatureCheck: false });
    const on = scanSpectrum(s);
    // Without the check the lone trough is the best "absorption-line galaxy" (it reads as a G band).
    const best = off.solutions[0]!;
    expect(best.template).toBe('galaxy-absorption');
    expect(best.featureShare).toBeUndefined();
    const same = (x: { z: number; template: string }) => x.template === best.template && Math.abs(x.z - best.z) < 0.002;
    expect(same(on.solutions[0]!)).toBe(false);
    // The capped solution fell below others that fitted worse before the cap.
    expect(on.solutions[0]!.chi2).toBeGreaterThan(best.chi2);
    for (const x of on.solutions.filter(same)) expect(x.singleFeaturePenalty).toBeGreaterThan(0);
  });
});
