import { describe, expect, it } from 'vitest';
import { continuumSupport } from '../../../backend/src/spectra/continuumSupport';
import { highPass } from '../../../backend/src/spectra/highPass';
import { breakChi2, windowSums } from '../../../backend/src/spectra/lymanBreakCheck';
import { continuumWidthFor, prepareSpectrum } from '../../../backend/src/spectra/prepareSpectrum';
import { resampleToLogGrid } from '../../../backend/src/spectra/resampleToLogGrid';
import { EDGE_WEIGHT, edgeTaper } from '../../../backend/src/spectra/scanTemplate';
import type { Spectrum } from '../../../backend/src/spectra/types';

/** A spectrum on a linear grid with flux f(λ) and constant σ, vacuum wavelengths. */
function spectrumOf(lo: number, hi: number, pixels: number, flux: (lambda: number) => number, sigma: number): Spectrum {
  const wavelength = Float64Array.from({ length: pixels }, (_, i) => lo + ((hi - lo) * i) / (pixels - 1));
  return {
    wavelength,
    flux: Float64Array.from(wavelength, flux),
    ivar: new Float64Array(pixels).fill(1 / sigma ** 2),
    mask: new Uint8Array(pixels),
    meta: { medium: 'vacuum', mediumFrom: 'default', warnings: [], errorsEstimated: false },
  } as unknown as Spectrum;
}

describe('resampling weights native pixels by their inverse variance', () => {
  it('one native pixel with a huge σ does not spoil the grid pixel it shares with good pixels', () => {
    // Native pixels of 0.5 Å: about two per 1e-4 dex (≈ 1.15 Å at 5000 Å) grid pixel.
    const n = 400;
    const wavelength = Float64Array.from({ length: n }, (_, i) => 5000 + 0.5 * i);
    const flux = new Float64Array(n).fill(1);
    const ivar = new Float64Array(n).fill(1e4);
    flux[200] = -500;
    ivar[200] = 1e-4; // σ = 100: honest, and 10⁴ × the others
    const grid = resampleToLogGrid(wavelength, flux, ivar, 1e-4);
    for (let k = 0; k < grid.flux.length; k++) if (grid.ivar[k]! > 0) expect(Math.abs(grid.flux[k]! - 1)).toBeLessThan(0.05);
  });

  it('equal errors give the plain overlap mean (flux conserved)', () => {
    const n = 2000;
    const wavelength = Float64Array.from({ length: n }, (_, i) => 4000 + 0.7 * i);
    const flux = Float64Array.from(wavelength, (l) => 1 + 0.001 * (l - 4000));
    const grid = resampleToLogGrid(wavelength, flux, new Float64Array(n).fill(4), 1e-4);
    let inside = 0;
    let outside = 0;
    for (let k = 1; k < grid.flux.length - 1; k++) {
      const a = 10 ** ((grid.g0 + k - 0.5) * 1e-4);
      const b = 10 ** ((grid.g0 + k + 0.5) * 1e-4);
      inside += grid.flux[k]! * (b - a);
      outside += (b - a) * (1 + 0.001 * ((a + b) / 2 - 4000));
    }
    expect(inside / outside).toBeCloseTo(1, 4);
  });
});

describe('continuumSupport', () => {
  it('drops pixels whose σ is far above the local typical σ, keeps a band that is noisy throughout', () => {
    const ivar = new Float64Array(4000).fill(100);
    for (let i = 2000; i < 3000; i++) ivar[i] = 1; // a whole band 10× noisier: kept
    ivar[500] = 100 / 2000 ** 2; // a water-band residual, σ 2000× typical: dropped
    ivar[2500] = 1 / 1000 ** 2; // the same inside the noisy band: dropped
    ivar[700] = 100 / 8 ** 2; // a sky line, σ 8× typical: kept
    ivar[900] = 0; // masked stays out
    const ok = continuumSupport(ivar);
    expect([ok[500], ok[2500], ok[700], ok[900], ok[2200], ok[100]]).toEqual([0, 0, 1, 0, 1, 1]);
  });
});

describe('Lyman-break consistency term', () => {
  const lya = 1215.67;
  it('is large where a source with flux blueward of the break would need a dark forest', () => {
    const flat = prepareSpectrum(spectrumOf(3600, 10000, 4000, () => 1, 0.1));
    // At z = 6.6 the blue window (1050–1170 Å rest) is 7980–8890 Å: flux 1 there, Madau T ≈ 0.02.
    expect(breakChi2(windowSums(flat), 6.6, { slope: -2 })).toBeGreaterThan(500);
    // At z = 2 the window is below the data: nothing to judge.
    expect(breakChi2(windowSums(flat), 2, { slope: -2 })).toBe(0);
  });

  it('is zero for a real break at its redshift and grows when the break is placed too red', () => {
    const z = 5.5;
    const src = prepareSpectrum(spectrumOf(3600, 10000, 4000, (l) => (l < lya * (1 + z) ? 0 : 1), 0.1));
    const sums = windowSums(src);
    expect(breakChi2(sums, z, { slope: -2 })).toBe(0);
    expect(breakChi2(sums, 5.2, { slope: -2 })).toBe(0); // a break placed bluer: the blue window is dark
    expect(breakChi2(sums, 6.3, { slope: -2 })).toBeGreaterThan(100); // placed redder: its blue window (7665–8541 Å) has flux
  });
});

describe('sky-subtraction residuals', () => {
  it('3 % of the sky is added to σ where the file carries a sky spectrum, nowhere else', () => {
    const base = spectrumOf(8000, 9000, 2000, () => 1, 0.1);
    const sky = new Float64Array(2000).fill(0.5);
    for (let i = 990; i <= 1010; i++) sky[i] = 200; // a bright OH line, 10 Å wide: σ² = 0.01 + (0.03·200)² = 36.01
    const withSky = prepareSpectrum({ ...base, sky });
    const without = prepareSpectrum(base);
    const g = Math.round(Math.log10(base.wavelength[1000]!) / withSky.step) - withSky.g0;
    expect(withSky.ivar[g]! / without.ivar[g]!).toBeCloseTo(0.01 / 36.01, 5);
    expect(withSky.ivar[g + 40]! / without.ivar[g + 40]!).toBeCloseTo(1 / (1 + 0.015 ** 2 / 0.01), 3);
    expect(withSky.masks.some((m) => m.startsWith('sky residuals'))).toBe(true);
    expect(without.masks.some((m) => m.startsWith('sky residuals'))).toBe(false);
  });
});

describe('continuum filter width follows the sampling', () => {
  it('is 0.03 dex for optical survey sampling and ≈ 150 native pixels (rounded to a level) for prism spectra', () => {
    expect(continuumWidthFor(1e-4)).toBe(0.03); // SDSS: 69 km/s pixels
    expect(continuumWidthFor(4e-4)).toBe(0.06); // 150 × 4e-4 = 0.06
    expect(continuumWidthFor(1.06e-3)).toBe(0.18); // a near-infrared prism at R ≈ 120: 0.159 → 0.18
  });
});

describe('edge taper of the scan weights', () => {
  it('weights the ends at 0.3 and reach full weight half a filter width inside', () => {
    const p = prepareSpectrum(spectrumOf(4000, 9000, 3000, () => 1, 0.1));
    const taper = edgeTaper(p);
    const half = p.continuumWidthPx / 2;
    let first = 0;
    while (!(p.ivar[first]! > 0)) first++;
    expect(taper(first)).toBeCloseTo(EDGE_WEIGHT, 9);
    expect(taper(first + Math.round(half / 2))).toBeCloseTo(EDGE_WEIGHT + (1 - EDGE_WEIGHT) * (Math.round(half / 2) / half), 9);
    expect(taper(first + Math.ceil(half))).toBe(1);
    expect(taper(p.n >> 1)).toBe(1);
  });
});

describe('continuum filter at the data ends', () => {
  it('removes a straight continuum exactly up to the last usable pixel (point reflection), where a truncated mean would leave a ramp', () => {
    const n = 1200;
    const line = Float64Array.from({ length: n }, (_, i) => 5 + 0.01 * i);
    const valid = new Uint8Array(n).fill(1);
    for (let i = 0; i < 40; i++) valid[i] = 0; // leading padding, as at a detector edge
    const out = highPass(line, 301, valid);
    for (let i = 40; i < n; i++) expect(Math.abs(out[i]!)).toBeLessThan(1e-9);
    // Templates (no validity given) keep the plain truncated mean: its lag at the end is half the
    // change over the half window, 0.01 × 150 / 2.
    expect(highPass(line, 301)[n - 1]).toBeCloseTo(0.75, 9);
  });
});
