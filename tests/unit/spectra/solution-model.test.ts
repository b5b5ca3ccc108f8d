import { describe, expect, it } from 'vitest';
import { generateSyntheticSpectrum } from '../../../backend/src/spectra/generateSyntheticSpectrum';
import { scanSpectrum } from '../../../backend/src/spectra/scanSpectrum';
import { solutionFit, solutionModel } from '../../../backend/src/spectra/solutionModel';
import type { Spectrum } from '../../../backend/src/spectra/types';

/** Σ ivar (f − m)² / N over unmasked pixels where the model is defined, on the input grid. */
function chi2PerPixel(s: Spectrum, model: Float64Array, lo = 0, hi = Infinity): number {
  let sum = 0;
  let n = 0;
  for (let i = 0; i < s.flux.length; i++) {
    const lam = s.wavelength[i]!;
    if (s.mask[i] || !(s.ivar[i]! > 0) || !Number.isFinite(model[i]!) || lam < lo || lam > hi) continue;
    sum += s.ivar[i]! * (s.flux[i]! - model[i]!) ** 2;
    n++;
  }
  return sum / n;
}

describe('solutionModel: the best-fit model of a solution on the spectrum’s own grid', () => {
  const z = 0.3;
  const s = generateSyntheticSpectrum({ class: 'galaxy', z, snr: 10, seed: 31, maskedFraction: 0 });

  it('at the true z: χ² per pixel ≈ 1 on the input grid, one value per input pixel, NaN only outside coverage', () => {
    const top = scanSpectrum(s).solutions[0]!;
    expect(Math.abs(top.z - z)).toBeLessThan(0.001);
    const model = solutionModel(s, top);
    expect(model).toBeInstanceOf(Float64Array);
    expect(model.length).toBe(s.wavelength.length);
    // The sky-line pixels carry 4× the noise of the rest (their ivar says so): included, weighted.
    const c = chi2PerPixel(s, model);
    expect(c).toBeGreaterThan(0.85);
    expect(c).toBeLessThan(1.2);
    const defined = Array.from(model).filter(Number.isFinite).length;
    expect(defined).toBeGreaterThan(0.99 * model.length);
  });

  it('follows the lines: the model rises at Hα and [O III] 5008 as the data do, and not between lines', () => {
    const fit = solutionFit(s, { z, template: 'galaxy-emission' });
    const at = (rest: number) => {
      const lam = rest * (1 + z);
      let best = 0;
      for (let i = 0; i < s.wavelength.length; i++) if (Math.abs(s.wavelength[i]! - lam) < Math.abs(s.wavelength[best]! - lam)) best = i;
      return best;
    };
    for (const rest of [6564.607, 5008.24]) {
      const i = at(rest);
      const sigma = 1 / Math.sqrt(s.ivar[i]!);
      // The peak stands many σ above the continuum, and the line flux over ±4 pixels agrees with
      // the data's within 3σ of that sum.
      expect(fit.model[i]! - fit.continuum[i]!).toBeGreaterThan(5 * sigma);
      let model = 0, data = 0, variance = 0;
      for (let k = i - 4; k <= i + 4; k++) {
        model += fit.model[k]! - fit.continuum[k]!;
        data += s.flux[k]! - fit.continuum[k]!;
        variance += 1 / s.ivar[k]!;
      }
      expect(Math.abs(model - data)).toBeLessThan(3 * Math.sqrt(variance));
    }
    // 6000 Å rest: no line of the recipe nearby, the model stays on the continuum (within 1σ; the
    // fitted lines' share of the running mean is all that separates them).
    const q = at(6000);
    expect(Math.abs(fit.model[q]! - fit.continuum[q]!)).toBeLessThan(1 / Math.sqrt(s.ivar[q]!));
    expect(fit.amplitudes.some((a) => a > 0)).toBe(true);
    expect(fit.chi2 / fit.pixels).toBeGreaterThan(0.8);
    expect(fit.chi2 / fit.pixels).toBeLessThan(1.25);
  });

  it('a wrong redshift fits worse than the right one, and NaN appears outside the data range', () => {
    const good = chi2PerPixel(s, solutionModel(s, { z, template: 'galaxy-emission' }));
    const bad = chi2PerPixel(s, solutionModel(s, { z: 0.45, template: 'galaxy-emission' }));
    // ≈ 4,000 pixels: 0.05 per pixel is a χ² rise of ≈ 200 (the lines cover a few % of the pixels).
    expect(bad).toBeGreaterThan(good + 0.05);
    const wider: Spectrum = { ...s, wavelength: Float64Array.from(s.wavelength, (l, i) => (i === 0 ? 3000 : l)) };
    expect(Number.isNaN(solutionModel(wider, { z, template: 'galaxy-emission' })[0]!)).toBe(false);
    const shifted: Spectrum = { ...s, ivar: Float64Array.from(s.ivar, (v, i) => (i < 200 ? 0 : v)) };
    const m = solutionModel(shifted, { z, template: 'galaxy-emission' });
    expect(Number.isNaN(m[10]!)).toBe(true);
    expect(Number.isFinite(m[1000]!)).toBe(true);
  });

  it('refuses an unknown template or a z outside the template’s range, with a sentence', () => {
    expect(() => solutionModel(s, { z, template: 'nope' })).toThrowError(/No template "nope"/);
    expect(() => solutionModel(s, { z: 3, template: 'star-warm' })).toThrowError(RangeError);
  });
});
