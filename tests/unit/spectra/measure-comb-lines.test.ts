import { describe, expect, it } from 'vitest';
import { lineByName } from '../../../backend/src/spectra/lineList';
import { C_KMS } from '../../../backend/src/spectra/logGrid';
import { measureCombLines, type MeasureInput } from '../../../backend/src/spectra/measureCombLines';
import { gaussianFrom, mulberry32 } from '../../../backend/src/spectra/seededRandom';

/** Seeded Gaussian noise, so every figure below reproduces. */
const noise = (seed: number) => gaussianFrom(mulberry32(seed));

interface Feature {
  /** Observed centre, Å. */
  at: number;
  /** Integrated flux (file unit × Å): positive emission, negative absorption. */
  flux: number;
  /** Gaussian σ, Å. */
  sigma: number;
}

/** 1 Å pixels over [from, to] Å, a continuum (flat or a step at `stepAt`), Gaussian features and noise σ. */
function synthetic(o: { from?: number; to?: number; continuum?: number; sigma?: number; features?: Feature[]; seed?: number; stepAt?: number; redContinuum?: number }): MeasureInput {
  const from = o.from ?? 4000;
  const to = o.to ?? 8000;
  const n = to - from + 1;
  const sigma = o.sigma ?? 1;
  const g = noise(o.seed ?? 1);
  const wavelength = Float64Array.from({ length: n }, (_, i) => from + i);
  const flux = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const l = wavelength[i]!;
    let f = o.stepAt !== undefined && l >= o.stepAt ? o.redContinuum! : (o.continuum ?? 10);
    for (const feature of o.features ?? []) f += (feature.flux / (feature.sigma * Math.sqrt(2 * Math.PI))) * Math.exp(-0.5 * ((l - feature.at) / feature.sigma) ** 2);
    flux[i] = f + sigma * g();
  }
  return { wavelength, flux, ivar: new Float64Array(n).fill(1 / sigma ** 2), mask: new Uint8Array(n) };
}

const HALPHA = lineByName('H-alpha');
const Z = 0.1;
const AT = HALPHA.rest * (1 + Z);

describe('measureCombLines: emission lines', () => {
  it('recovers a known line flux within its error, with EW and S/N', () => {
    const data = synthetic({ features: [{ at: AT, flux: 50, sigma: 3 }] });
    const [m] = measureCombLines(data, { z: Z, lines: [HALPHA] });
    expect(m!.name).toBe('H-alpha');
    expect(m!.measured).toBe(true);
    expect(m!.flux!).toBeGreaterThan(50 - 3 * m!.fluxErr!);
    expect(m!.flux!).toBeLessThan(50 + 3 * m!.fluxErr!);
    // ±1.5 effective FWHM of a 300 km/s line at 7221 Å: ≈ 23 pixels of σ = 1 plus the continuum's error.
    expect(m!.fluxErr!).toBeGreaterThan(4.5);
    expect(m!.fluxErr!).toBeLessThan(6);
    expect(m!.snr!).toBeGreaterThan(7);
    expect(m!.detected).toBe(true);
    // EW = 50 / 10 Å observed → 5 / 1.1 = 4.55 Å rest.
    expect(m!.ewRest!).toBeCloseTo(50 / 10 / 1.1, 0);
    expect(Math.abs(m!.offsetKms!)).toBeLessThan(3 * m!.offsetErrKms!);
    expect(m!.offsetErrKms!).toBeLessThan(60);
  });

  it('states an error that matches the scatter of the flux over 200 noise draws', () => {
    const fluxes: number[] = [];
    const errors: number[] = [];
    for (let seed = 1; seed <= 200; seed++) {
      const [m] = measureCombLines(synthetic({ features: [{ at: AT, flux: 30, sigma: 3 }], seed, from: 7000, to: 7500 }), { z: Z, lines: [HALPHA] });
      fluxes.push(m!.flux!);
      errors.push(m!.fluxErr!);
    }
    const mean = fluxes.reduce((s, f) => s + f, 0) / fluxes.length;
    const sd = Math.sqrt(fluxes.reduce((s, f) => s + (f - mean) ** 2, 0) / (fluxes.length - 1));
    const stated = errors.reduce((s, e) => s + e, 0) / errors.length;
    expect(Math.abs(mean - 30)).toBeLessThan((3 * sd) / Math.sqrt(200) + 0.6);
    expect(sd / stated).toBeGreaterThan(0.8);
    expect(sd / stated).toBeLessThan(1.2);
  });

  it('S/N scales with the line flux and with 1/σ', () => {
    const measure = (flux: number, sigma: number) => measureCombLines(synthetic({ features: [{ at: AT, flux, sigma: 3 }], sigma, seed: 3 }), { z: Z, lines: [HALPHA] })[0]!;
    const base = measure(40, 1);
    // Same noise draw (same seed), twice the flux: the noise is identical, so S/N roughly doubles.
    expect(measure(80, 1).snr! / base.snr!).toBeGreaterThan(1.8);
    expect(measure(80, 1).snr! / base.snr!).toBeLessThan(2.2);
    // Half the noise, same flux: the stated error halves exactly.
    expect(measure(40, 0.5).fluxErr! / base.fluxErr!).toBeCloseTo(0.5, 6);
  });

  it('a line below 3σ is measured but not detected, and no offset is claimed', () => {
    const [m] = measureCombLines(synthetic({ features: [{ at: AT, flux: 6, sigma: 3 }], seed: 5 }), { z: Z, lines: [HALPHA] });
    expect(m!.measured).toBe(true);
    expect(m!.snr!).toBeLessThan(3);
    expect(m!.detected).toBe(false);
    expect(m!.offsetKms).toBeNull();
  });

  it('pure noise gives few false detections (3σ one-sided: ≈ 0.13 % expected)', () => {
    let detections = 0;
    for (let seed = 1; seed <= 300; seed++) if (measureCombLines(synthetic({ seed, from: 7000, to: 7500 }), { z: Z, lines: [HALPHA] })[0]!.detected) detections++;
    expect(detections).toBeLessThanOrEqual(3);
  });

  it('measures the velocity offset of the centroid from the comb', () => {
    const shifted = AT * (1 + 200 / C_KMS);
    const [m] = measureCombLines(synthetic({ features: [{ at: shifted, flux: 200, sigma: 3 }], seed: 9 }), { z: Z, lines: [HALPHA] });
    expect(Math.abs(m!.offsetKms! - 200)).toBeLessThan(3 * m!.offsetErrKms!);
    expect(m!.offsetErrKms!).toBeLessThan(15);
  });

  it('never returns a comb line outside the data range, and measures those inside', () => {
    const data = synthetic({ features: [{ at: AT, flux: 50, sigma: 3 }] });
    const all = measureCombLines(data, { z: Z });
    expect(all.length).toBeGreaterThan(10);
    for (const m of all) {
      expect(m.observed).toBeGreaterThanOrEqual(4000);
      expect(m.observed).toBeLessThanOrEqual(8000);
    }
    const names = all.map((m) => m.name);
    expect(names).not.toContain('Ly-alpha');
    expect(names).not.toContain('Pa-alpha');
    expect(names).toContain('H-alpha');
    // Only Hα was put in the data: of all the comb's lines, it is the one emission line detected.
    expect(all.filter((m) => m.kind === 'emission' && m.detected).map((m) => m.name)).toEqual(['H-alpha']);
  });

  it('a masked line core is not measured and says why; masking a wing pixel still measures it', () => {
    const data = synthetic({ features: [{ at: AT, flux: 50, sigma: 3 }] });
    const centre = Math.round(AT - 4000);
    const wing = { ...data, mask: new Uint8Array(data.mask) };
    wing.mask[centre + 9] = 1;
    expect(measureCombLines(wing, { z: Z, lines: [HALPHA] })[0]!.measured).toBe(true);
    const core = { ...data, mask: new Uint8Array(data.mask) };
    core.mask[centre] = 1;
    const [m] = measureCombLines(core, { z: Z, lines: [HALPHA] });
    expect(m!.measured).toBe(false);
    expect(m!.detected).toBe(false);
    expect(m!.note).toMatch(/core of the line is masked/);
    // A window mostly off the data (masked wings on both sides) is refused by its coverage.
    const wings = { ...data, mask: new Uint8Array(data.mask) };
    for (let i = centre - 11; i <= centre + 11; i++) if (Math.abs(i - centre) > 4) wings.mask[i] = 1;
    expect(measureCombLines(wings, { z: Z, lines: [HALPHA] })[0]!.note).toMatch(/usable pixels/);
  });

  it('measures a doublet closer than the resolution as one blend, and resolves it at high resolution', () => {
    const a = lineByName('[O II] 3727');
    const b = lineByName('[O II] 3730');
    const z = 0.5;
    const features = [
      { at: a.rest * (1 + z), flux: 40, sigma: 2 },
      { at: b.rest * (1 + z), flux: 40, sigma: 2 },
    ];
    const data = synthetic({ features, seed: 2 });
    const low = measureCombLines(data, { z, lines: [a, b], resolutionFwhmKms: 600 });
    expect(low.map((m) => m.blendedWith)).toEqual([['[O II] 3730'], ['[O II] 3727']]);
    expect(low[0]!.flux).toBe(low[1]!.flux);
    expect(low[0]!.flux!).toBeGreaterThan(80 - 3 * low[0]!.fluxErr!);
    expect(low[0]!.flux!).toBeLessThan(80 + 3 * low[0]!.fluxErr!);
    const high = measureCombLines(data, { z, lines: [a, b], resolutionFwhmKms: 20, lineFwhmKms: 20 });
    expect(high.every((m) => m.blendedWith.length === 0)).toBe(true);
  });
});

describe('measureCombLines: absorption and breaks', () => {
  it('recovers an absorption equivalent width (negative: absorption) within its error', () => {
    const k = lineByName('Ca II K');
    const z = 0.3;
    // Depth: flux −33 on a continuum of 10 → observed EW 3.3 Å, rest 2.54 Å.
    const data = synthetic({ features: [{ at: k.rest * (1 + z), flux: -33, sigma: 3 }], sigma: 0.5, seed: 4 });
    const [m] = measureCombLines(data, { z, lines: [k] });
    expect(m!.measure).toBe('ew');
    expect(m!.ewRest!).toBeLessThan(0);
    expect(Math.abs(m!.ewRest! + 3.3 / 1.3)).toBeLessThan(3 * m!.ewRestErr!);
    expect(m!.snr!).toBeGreaterThan(5);
    expect(m!.detected).toBe(true);
    // An emission bump is no absorption: not detected by this measure.
    const bump = measureCombLines(synthetic({ features: [{ at: k.rest * (1 + z), flux: 33, sigma: 3 }], sigma: 0.5, seed: 4 }), { z, lines: [k] })[0]!;
    expect(bump.detected).toBe(false);
  });

  it('measures the 4000 Å break as a ratio of mean f_ν with its error', () => {
    const brk = lineByName('4000 Å break');
    const z = 0.2;
    const data = synthetic({ continuum: 10, stepAt: 3975 * (1 + z), redContinuum: 18, sigma: 1, seed: 6 });
    const [m] = measureCombLines(data, { z, lines: [brk] });
    expect(m!.measure).toBe('break');
    // f_ν ∝ f_λ λ²: 1.8 × the mean of λ² over 4000–4100 Å over that over 3850–3950 Å (1.0766).
    const expected = 1.8 * ((4050.0 ** 2 + 100 ** 2 / 12) / (3900.0 ** 2 + 100 ** 2 / 12));
    expect(Math.abs(m!.breakRatio! - expected)).toBeLessThan(3 * m!.breakRatioErr!);
    expect(m!.breakRatioErr!).toBeLessThan(0.03);
    expect(m!.detected).toBe(true);
    const flat = measureCombLines(synthetic({ continuum: 10, sigma: 1, seed: 6 }), { z, lines: [brk] })[0]!;
    // A flat f_λ is a gentle rise in f_ν (ratio ≈ 1.08) at high S/N: still a step, but a small one.
    expect(flat.breakRatio!).toBeCloseTo(1.077, 1);
    expect(flat.snr!).toBeGreaterThan(3);
    expect(flat.detected).toBe(false);
  });

  it('counts Lyα as detected by its forest decrement when there is no emission line', () => {
    const lya = lineByName('Ly-alpha');
    const z = 3.5;
    const data = synthetic({ from: 4600, to: 7000, continuum: 1, stepAt: 1215.67 * (1 + z), redContinuum: 10, sigma: 2, seed: 8 });
    const [m] = measureCombLines(data, { z, lines: [lya] });
    expect(m!.measure).toBe('break');
    expect(m!.detected).toBe(true);
    expect(m!.snr!).toBeGreaterThan(10);
  });
});

describe('linesForClass', () => {
  it("keeps the lines a class's templates draw", async () => {
    const { linesForClass } = await import('../../../backend/src/spectra/linesForClass');
    const star = linesForClass('star').map((l) => l.name);
    expect(star).toContain('Na D1');
    expect(star).toContain('TiO 7056');
    expect(star).not.toContain('[S II] 6718');
    const galaxy = linesForClass('galaxy').map((l) => l.name);
    expect(galaxy).toContain('H-alpha');
    expect(galaxy).not.toContain('C2 5165');
    expect(linesForClass('lyman-break').map((l) => l.name)).toContain('Ly-alpha');
    expect(linesForClass('unknown').length).toBeGreaterThan(galaxy.length);
  });
});
