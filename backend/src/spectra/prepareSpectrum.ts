import { continuumSupport } from './continuumSupport';
import { highPass } from './highPass';
import { DEFAULT_LOG_STEP } from './logGrid';
import { resampleToLogGrid } from './resampleToLogGrid';
import { toVacuum } from './toVacuum';
import type { Medium, Spectrum } from './types';

/** How a spectrum is cleaned and put on the log grid before a scan. */
export interface PrepareOptions {
  /**
   * log10 step of the grid, dex (default 1e-4 ≈ 69 km/s), or 'native': the spectrum's own median
   * pixel, snapped to a level of GRID_STEPS (see gridStepFor).
   */
  step?: number | 'native';
  /** Override of the file's air/vacuum statement. */
  medium?: Medium;
  /** Mask the brightest night-sky lines ([O I] 5577, 6300, 6364; Na D), default true. */
  maskSkyLines?: boolean;
  /** Mask the telluric O₂ A and B bands, default false. */
  maskTelluric?: boolean;
  /**
   * Width of the continuum-removing running mean, dex. Default: 0.03 (≈ 21,000 km/s), widened for
   * coarsely sampled spectra to ≈ 150 native pixels (see continuumWidthFor).
   */
  continuumWidthDex?: number;
  /**
   * Sky-subtraction residuals scale with the sky: when the file carries a sky spectrum, this
   * fraction of it is added in quadrature to each pixel's σ (default 0.03, common practice).
   */
  skyResidualFraction?: number;
}

/** A spectrum ready for the scan: vacuum, masked, on the global log grid, continuum removed. */
export interface PreparedSpectrum {
  step: number;
  /** Global grid index of pixel 0. */
  g0: number;
  n: number;
  /** Continuum-removed flux. */
  flux: Float64Array;
  /** Flux on the grid before continuum removal. */
  gridFlux: Float64Array;
  /** Inverse variance per pixel (0 = unused). */
  ivar: Float64Array;
  /** Width of the continuum filter, pixels. */
  continuumWidthPx: number;
  /** Instrumental Gaussian σ in grid pixels, estimated from the native sampling. */
  instrumentSigmaPx: number;
  medium: Medium;
  /** Vacuum wavelength range covered by usable pixels, Å. */
  wavelengthMin: number;
  wavelengthMax: number;
  /** Median of |flux|·√ivar over usable pixels of the input. */
  snrMedian: number;
  /** Which masks were applied, for display. */
  masks: string[];
}

/** Continuum filter widths the default may take, dex: few levels, so few template sets are built. */
const CONTINUUM_WIDTHS_DEX = [0.03, 0.045, 0.06, 0.09, 0.12, 0.18];

/**
 * The running-mean width for a spectrum whose native pixels are `nativeStepDex` wide: 0.03 dex, or
 * ≈ 150 native pixels when that is wider, rounded to a level of CONTINUUM_WIDTHS_DEX. At R ≈ 100
 * (near-infrared prism spectra, ≈ 0.001 dex per pixel) the features that tell a brown dwarf from a
 * redshifted galaxy — the H₂O and CH₄ troughs between the J, H and K peaks — are 0.05–0.1 dex wide,
 * and a 0.03 dex filter removed most of them. 150 pixels sits in the middle of the range (120–180)
 * that gave the same real-spectra results (chosen on that set).
 */
export function continuumWidthFor(nativeStepDex: number): number {
  return nearestLevel(CONTINUUM_WIDTHS_DEX, Math.max(0.03, 150 * nativeStepDex));
}

/** The level of `levels` nearest `value` in ratio (levels are spaced by factors). */
function nearestLevel(levels: readonly number[], value: number): number {
  return levels.reduce((best, l) => (Math.abs(Math.log(l / value)) < Math.abs(Math.log(best / value)) ? l : best));
}

/**
 * Grid steps 'native' may choose, dex: factors of two around the default, so that few template sets
 * are ever built. 2.5e-5 (17 km/s) is the finest: a grid four times finer than the default makes
 * the transforms four times longer. 8e-4 (550 km/s) is the coarsest: a line must still span pixels.
 */
export const GRID_STEPS = [2.5e-5, 5e-5, 1e-4, 2e-4, 4e-4, 8e-4];

/** The median log10 step between neighbouring pixels (sampled: 512 pairs suffice), dex. */
export function nativeStepOf(wavelength: Float64Array): number {
  const n = wavelength.length;
  const steps: number[] = [];
  for (let i = 1; i < n; i += Math.max(1, Math.floor(n / 512))) steps.push(Math.log10(wavelength[i]! / wavelength[i - 1]!));
  steps.sort((a, b) => a - b);
  return steps[steps.length >> 1] ?? DEFAULT_LOG_STEP;
}

/**
 * The grid step for a spectrum: the number asked for, or for 'native' the GRID_STEPS level nearest
 * its own pixels (`nativeStep`, from nativeStepOf).
 */
export function gridStepFor(nativeStep: number, step: number | 'native' = DEFAULT_LOG_STEP): number {
  if (step !== 'native') return step;
  return nativeStep > 0 ? nearestLevel(GRID_STEPS, nativeStep) : DEFAULT_LOG_STEP;
}

/** Bright night-sky emission, vacuum Å (reference-values.md §6: [O I] 5577.339/6300.304/6363.776 air, Na D). */
const SKY_LINES_VAC = [5578.887, 5891.583, 5897.558, 6302.046, 6365.536];
const SKY_HALF_WIDTH_A = 5;
/** Telluric O₂ bands (commonly masked ranges, reference-values.md §6, M), converted to vacuum. */
const TELLURIC_AIR: ReadonlyArray<readonly [number, number]> = [[6860, 6925], [7590, 7700]];

/**
 * Cleans a spectrum for scanning: converts wavelengths to vacuum (IAU/Morton 2000) unless they
 * already are, masks sky lines and telluric bands on request, resamples to the log10 grid
 * conserving flux, and removes the continuum with a wide running mean.
 */
export function prepareSpectrum(spectrum: Spectrum, options: PrepareOptions = {}): PreparedSpectrum {
  const medium = options.medium ?? spectrum.meta.medium;
  const n = spectrum.wavelength.length;
  const vac = medium === 'air' ? Float64Array.from(spectrum.wavelength, toVacuum) : spectrum.wavelength;
  const nativeStep = nativeStepOf(vac);
  const step = gridStepFor(nativeStep, options.step);
  const ivar = Float64Array.from(spectrum.ivar);
  const masks: string[] = [];
  const maskRange = (lo: number, hi: number) => {
    for (let i = 0; i < n; i++) if (vac[i]! >= lo && vac[i]! <= hi) ivar[i] = 0;
  };
  if (options.maskSkyLines ?? true) {
    for (const l of SKY_LINES_VAC) maskRange(l - SKY_HALF_WIDTH_A, l + SKY_HALF_WIDTH_A);
    masks.push('sky lines');
  }
  if (options.maskTelluric ?? false) {
    for (const [a, b] of TELLURIC_AIR) maskRange(toVacuum(a), toVacuum(b));
    masks.push('telluric O2 bands');
  }
  for (let i = 0; i < n; i++) if (spectrum.mask[i]) ivar[i] = 0;
  const skyFraction = options.skyResidualFraction ?? 0.03;
  if (spectrum.sky && skyFraction > 0) {
    for (let i = 0; i < n; i++) {
      const residual = skyFraction * Math.max(0, spectrum.sky[i]!);
      if (ivar[i]! > 0 && residual > 0) ivar[i] = 1 / (1 / ivar[i]! + residual * residual);
    }
    masks.push(`sky residuals (${Math.round(100 * skyFraction)} % of the sky added to σ)`);
  }
  const grid = resampleToLogGrid(vac, spectrum.flux, ivar, step);
  let first = -1;
  let last = -1;
  for (let i = 0; i < grid.flux.length; i++) {
    if (grid.ivar[i]! > 0) {
      if (first < 0) first = i;
      last = i;
    }
  }
  const nativePx = nativeStep / step;
  const widthPx = Math.max(3, Math.round((options.continuumWidthDex ?? continuumWidthFor(nativeStep)) / step)) | 1;
  const flux = highPass(grid.flux, widthPx, continuumSupport(grid.ivar));
  const snrValues = new Float64Array(n);
  let usable = 0;
  for (let i = 0; i < n; i++) if (ivar[i]! > 0) snrValues[usable++] = Math.abs(spectrum.flux[i]!) * Math.sqrt(ivar[i]!);
  // A typed array sorts numerically without a comparator call per comparison.
  const snr = snrValues.subarray(0, usable).sort();
  return {
    step,
    g0: grid.g0,
    n: grid.flux.length,
    flux,
    gridFlux: grid.flux,
    ivar: grid.ivar,
    continuumWidthPx: widthPx,
    instrumentSigmaPx: Math.max(0.85, nativePx * 0.85),
    medium,
    wavelengthMin: first >= 0 ? 10 ** ((grid.g0 + first) * step) : NaN,
    wavelengthMax: last >= 0 ? 10 ** ((grid.g0 + last) * step) : NaN,
    snrMedian: snr.length ? snr[snr.length >> 1]! : 0,
    masks,
  };
}
