import { describe, expect, it } from 'vitest';
import { generateSyntheticSpectrum } from '../../../backend/src/spectra/generateSyntheticSpectrum';
import { scanSpectrum } from '../../../backend/src/spectra/scanSpectrum';
import { rankWithPhotoZ } from '../../../backend/src/spectra/rankWithPhotoZ';
import { ENGINE_VERSION } from '../../../backend/src/spectra/version';
import { GRID_STEPS, gridStepFor, nativeStepOf } from '../../../backend/src/spectra/prepareSpectrum';

describe('scanSpectrum on seeded synthetic spectra', () => {
  it('FFT and direct evaluation give the same χ² curve', () => {
    const s = generateSyntheticSpectrum({ class: 'galaxy', z: 0.7, snr: 8, seed: 1, pixels: 800 });
    const fft = scanSpectrum(s, { zMax: 1.5, classes: ['galaxy'] });
    const direct = scanSpectrum(s, { zMax: 1.5, classes: ['galaxy'], method: 'direct' });
    expect(fft.solutions[0]!.z).toBeCloseTo(direct.solutions[0]!.z, 6);
    for (let c = 0; c < fft.curves.length; c++) {
      const a = fft.curves[c]!.chi2;
      const b = direct.curves[c]!.chi2;
      for (let i = 0; i < a.length; i += 37) expect(Math.abs(a[i]! - b[i]!)).toBeLessThan(1e-6 * Math.max(1, Math.abs(b[i]!)));
    }
    // The direct loop is the slow reference (≈ 4 s alone); on a shared 2-core machine it needs room.
  }, 30_000);

  it.each([
    ['galaxy', 0.35],
    ['galaxy', 1.2],
    ['quasar', 2.4],
    ['lyman-break', 5.5],
  ] as const)('recovers a %s at z = %s', (cls, z) => {
    const s = generateSyntheticSpectrum({ class: cls, z, snr: 10, seed: 17 });
    const r = scanSpectrum(s);
    expect(r.engineVersion).toBe(ENGINE_VERSION);
    expect(Math.abs(r.solutions[0]!.z - z) / (1 + z)).toBeLessThan(0.002);
    expect(r.solutions[0]!.zErr).toBeGreaterThan(0);
    expect(r.solutions[0]!.zErr).toBeLessThan(0.01);
    expect(r.class).toBe(cls);
    expect(r.solutions.length).toBeGreaterThan(1);
    expect(r.solutions[0]!.deltaChi2).toBeGreaterThan(0);
  });

  it.each([
    ['star-cool', 3600, 9800],
    ['star-ultracool', 6500, 13500],
  ] as const)('a %s dwarf at z = 0 on %s–%s Å is a star, not a Lyman-break source or a galaxy', (template, lo, hi) => {
    const s = generateSyntheticSpectrum({ class: 'star', template, z: 0, snr: 10, seed: 23, wavelengthMin: lo, wavelengthMax: hi });
    const r = scanSpectrum(s);
    expect(r.class).toBe('star');
    expect(r.solutions[0]!.template).toBe(template);
    expect(Math.abs(r.solutions[0]!.z)).toBeLessThanOrEqual(0.002);
    // The best non-star solution is clearly worse: the band heads are not a redshifted galaxy.
    const other = r.solutions.find((x) => x.class !== 'star');
    if (other) expect(other.chi2 - r.solutions[0]!.chi2).toBeGreaterThan(25);
  });

  it('pure noise gives no class decision', () => {
    const s = generateSyntheticSpectrum({ class: 'galaxy', z: 0.5, snr: 1e-6, seed: 4 });
    expect(scanSpectrum(s).class).toBe('unknown');
  });

  it('emission-line pairing finds [O III]/Hβ/Hα at the true redshift', () => {
    const s = generateSyntheticSpectrum({ class: 'galaxy', z: 0.25, snr: 15, seed: 9 });
    const m = scanSpectrum(s).lineMatches;
    expect(m.matches.length).toBeGreaterThan(0);
    expect(Math.abs(m.matches[0]!.z - 0.25)).toBeLessThan(0.001);
  });

  it('a lone line is flagged with the standard alternatives and the lines each one predicts', () => {
    // z = 1.55 puts [O II] at 9508 Å and every other line of the recipe beyond 9800 Å.
    const r = scanSpectrum(generateSyntheticSpectrum({ class: 'galaxy', z: 1.55, snr: 15, seed: 5 }));
    const single = r.lineMatches.singleLine!;
    expect(single).toBeDefined();
    expect(single.wavelength).toBeCloseTo(3728.5 * 2.55, -1);
    const byLine = new Map(single.alternatives.map((a) => [a.line, a]));
    expect([...byLine.keys()]).toEqual(expect.arrayContaining(['[O II] 3727,3730', 'Ly-alpha', 'H-alpha', '[O III] 5008', 'H-beta']));
    expect(byLine.get('[O II] 3727,3730')!.z).toBeCloseTo(1.55, 2);
    expect(byLine.get('[O II] 3727,3730')!.expectedInRange).toEqual([]);
    // Read as Hα (z ≈ 0.448), [N II], [S II], Hβ and [O III] would all fall inside 3600–9800 Å.
    expect(byLine.get('H-alpha')!.z).toBeCloseTo(9508 / 6564.6 - 1, 2);
    expect(byLine.get('H-alpha')!.expectedInRange).toEqual(expect.arrayContaining(['[N II] 6585', 'H-beta', '[O III] 5008']));
    expect(byLine.get('Ly-alpha')!.separator).toMatch(/blueward/);
    expect(r.solutions[0]!.z).toBeCloseTo(1.55, 2);
  });

  it('photo-z prior re-ranks but keeps every solution', () => {
    const sols = [
      { z: 0.5, zErr: 1e-4, reducedChi2: 1, class: 'galaxy' as const, template: 'a', chi2: 100, deltaChi2: 4, detectionChi2: 50, lines: [] },
      { z: 3.1, zErr: 1e-4, reducedChi2: 1, class: 'galaxy' as const, template: 'a', chi2: 104, deltaChi2: null, detectionChi2: 46, lines: [] },
    ];
    const ranked = rankWithPhotoZ(sols, { z: 3.0, lo: 2.8, hi: 3.2 });
    expect(ranked.map((s) => s.z)).toEqual([3.1, 0.5]);
    expect(ranked[0]!.priorWeight).toBe(1);
    expect(ranked[1]!.priorWeight).toBeLessThan(1e-10);
  });
});

describe('shifts where a template has no feature in the observed range', () => {
  it('give the zero model’s χ²: the filter sidelobes of lines past the edge are not evidence', () => {
    const s = generateSyntheticSpectrum({ class: 'galaxy', z: 0.5, snr: 8, seed: 31, wavelengthMin: 3600, wavelengthMax: 9800 });
    const r = scanSpectrum(s);
    const curve = r.curves.find((c) => c.template === 'galaxy-emission')!;
    // The bluest line of the template is [O II] 3727 Å: beyond z ≈ 1.63 every line is redward of 9800 Å.
    const beyond = Array.from(curve.z).map((z, i) => [z, curve.chi2[i]!] as const).filter(([z]) => z > 1.65);
    expect(beyond.length).toBeGreaterThan(100);
    for (const [, chi2] of beyond) expect(chi2).toBe(r.chi2Null);
  });
});

describe("grid step 'native'", () => {
  const logSampled = (step: number, n = 1000) => nativeStepOf(Float64Array.from({ length: n }, (_, i) => 4000 * 10 ** (i * step)));
  it('snaps the median native step to the nearest grid level (factors of two around 1e-4)', () => {
    expect(gridStepFor(logSampled(1e-5), 'native')).toBe(2.5e-5);
    expect(gridStepFor(logSampled(1.9e-4), 'native')).toBe(2e-4);
    expect(gridStepFor(logSampled(3e-4), 'native')).toBe(4e-4);
    expect(gridStepFor(logSampled(5e-3), 'native')).toBe(8e-4);
    // A linear axis: the median of its log steps decides (Δλ = 1 Å from 4000 Å: ≈ 0.9e-4 dex).
    expect(gridStepFor(nativeStepOf(Float64Array.from({ length: 3000 }, (_, i) => 4000 + i)), 'native')).toBe(1e-4);
    expect(gridStepFor(logSampled(1e-5))).toBe(1e-4);
    expect(gridStepFor(logSampled(1e-5), 3e-4)).toBe(3e-4);
    expect(GRID_STEPS).toContain(1e-4);
  });

  it('a spectrum sampled at 4e-4 dex is scanned on a 4e-4 grid and its redshift found', () => {
    const s = generateSyntheticSpectrum({ class: 'galaxy', z: 0.8, snr: 12, seed: 21, pixels: 1088 });
    const r = scanSpectrum(s, { step: 'native' });
    expect(r.meta.step).toBe(4e-4);
    expect(Math.abs(r.solutions[0]!.z - 0.8) / 1.8).toBeLessThan(0.002);
    // Solutions stay ≈ 1000 km/s apart on the coarser grid too.
    const zs = r.solutions.map((x) => Math.log10(1 + x.z));
    for (let i = 0; i < zs.length; i++) for (let j = i + 1; j < zs.length; j++) expect(Math.abs(zs[i]! - zs[j]!)).toBeGreaterThan(14e-4);
  });
});

describe('zErr: the curvature error, scaled by √(χ²/dof) when the errors are understated', () => {
  it('claiming errors half their size leaves zErr where it was and reports χ²/dof ≈ 4', () => {
    const honest = generateSyntheticSpectrum({ class: 'galaxy', z: 0.62, snr: 8, seed: 44 });
    const overstated = { ...honest, ivar: Float64Array.from(honest.ivar, (v) => 4 * v) };
    const a = scanSpectrum(honest).solutions[0]!;
    const b = scanSpectrum(overstated).solutions[0]!;
    expect(b.z).toBeCloseTo(a.z, 6);
    expect(a.reducedChi2).toBeGreaterThan(0.8);
    expect(a.reducedChi2).toBeLessThan(1.3);
    // Not exactly 4: 3 % of the sky is added to σ in quadrature after the file's own errors.
    expect(b.reducedChi2 / a.reducedChi2).toBeGreaterThan(3);
    expect(b.reducedChi2 / a.reducedChi2).toBeLessThanOrEqual(4);
    // The curvature alone would halve zErr (4× the weight); the √(χ²/dof) factor gives it back.
    expect(b.zErr / a.zErr).toBeGreaterThan(0.85);
    expect(b.zErr / a.zErr).toBeLessThan(1.25);
  });
});
