import { describe, expect, it } from 'vitest';
import { templateSetFor } from '../../../backend/src/spectra/buildTemplates';
import { LINES, TEMPLATE_LINES } from '../../../backend/src/spectra/lineList';

const STEP = 1e-4;
const set = templateSetFor(STEP, 1, 301);
const at = (rest: number) => Math.round(Math.log10(rest) / STEP) - set.h0;

describe('template recipes as built', () => {
  it('the Lyman-break source without Lyα emission draws Lyα in absorption; the Lyα emitter does not', () => {
    const plain = set.templates.find((t) => t.id === 'lyman-break')!;
    const emitter = set.templates.find((t) => t.id === 'lyman-break-lya')!;
    // Bin 0 (z < 2.2) is unattenuated above Lyα; compare Lyα with the continuum 40 Å redward.
    const depth = (values: Float64Array) => 1 - values[at(1215.67)]! / values[at(1255)]!;
    const plainShape = plain.basis[plain.bins[0]!.basis[0]!]!.unfiltered;
    const emitterShape = emitter.basis[emitter.bins[0]!.basis[0]!]!.unfiltered;
    // Depth 0.5 of a Gaussian of FWHM 15 Å, smoothed only by the 69 km/s instrument here.
    expect(depth(plainShape)).toBeGreaterThan(0.4);
    expect(depth(plainShape)).toBeLessThan(0.55);
    expect(emitterShape[at(1215.67)]!).toBeGreaterThan(emitterShape[at(1255)]!);
    expect(plain.lines.map((l) => l.name)).toContain('Ly-alpha absorption');
    expect(emitter.lines.map((l) => l.name)).not.toContain('Ly-alpha absorption');
  });

  it('template-only profiles stay off the comb: each feature is offered to readers once', () => {
    expect(TEMPLATE_LINES.some((l) => l.name === 'Ly-alpha absorption')).toBe(true);
    expect(LINES.some((l) => l.name === 'Ly-alpha absorption')).toBe(false);
    expect(LINES.filter((l) => Math.abs(l.rest - 1215.67) < 0.01).map((l) => l.name)).toEqual(['Ly-alpha']);
  });

  it('the broad Balmer component of the emission-line galaxy is fitted only at z ≤ 0.5', () => {
    const g = set.templates.find((t) => t.id === 'galaxy-emission')!;
    const broad = g.basis.findIndex((b) => b.label === 'broad Balmer');
    expect(broad).toBeGreaterThanOrEqual(0);
    expect(g.basis[broad]!.synthetic).toBe(false);
    // Hγ and Hδ ride with broad Hα and Hβ (engine 0.6.5): a lone broad Hβ is no Seyfert.
    const v = g.basis[broad]!.unfiltered;
    const peakNear = (rest: number) => Math.max(...Array.from({ length: 21 }, (_, k) => v[at(rest) - 10 + k]!));
    const between = v[at(4600)]!;
    expect(peakNear(4341.68)).toBeGreaterThan(10 * Math.abs(between));
    expect(peakNear(4341.68) / peakNear(4862.68)).toBeGreaterThan(0.3);
    expect(peakNear(4341.68) / peakNear(4862.68)).toBeLessThan(0.6);
    expect(g.bins.map((b) => [b.zLo, b.zHi, b.basis.includes(broad)])).toEqual([
      [0, 0.5, true],
      [0.5, 9, false],
    ]);
  });

  it('the quasar steps move C IV with the step and C III] with 0.4 of it (templates.json, templateRecipes.ts)', () => {
    // Peak of the quasar's line vector within ±60 Å of a rest wavelength, as a velocity (km/s).
    const peakKms = (id: string, rest: number) => {
      const t = set.templates.find((x) => x.id === id)!;
      const v = t.basis[0]!.unfiltered;
      let best = at(rest - 60);
      for (let j = at(rest - 60); j <= at(rest + 60); j++) if (v[j]! > v[best]!) best = j;
      return (10 ** ((best + set.h0) * STEP) / rest - 1) * 299_792.458;
    };
    const kmsPerPixel = (10 ** STEP - 1) * 299_792.458; // ≈ 69 km/s
    const shift = (rest: number) => peakKms('quasar-strong-outflow', rest) - peakKms('quasar-blueshift-0', rest);
    expect(Math.abs(shift(1549.06) + 5000)).toBeLessThan(1.5 * kmsPerPixel);
    expect(Math.abs(shift(1908.73) + 2000)).toBeLessThan(1.5 * kmsPerPixel);
    // Mg II is a low-ionisation line: it stays at systemic in every step.
    expect(Math.abs(shift(2798.75))).toBeLessThan(1.5 * kmsPerPixel);
    expect(Math.abs(peakKms('quasar-blueshift-1000', 1908.73) - peakKms('quasar-blueshift-0', 1908.73) + 400)).toBeLessThan(1.5 * kmsPerPixel);
  });
});
