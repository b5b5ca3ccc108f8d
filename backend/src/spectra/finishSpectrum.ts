import { SpectrumReadError } from './errors';
import { estimateIvar } from './estimateIvar';
import { arbitraryFluxUnit, parseFluxUnit } from './parseFluxUnit';
import type { Spectrum, SpectrumMeta } from './types';

/** Raw columns as a reader found them, wavelength already in Å. */
export interface RawColumns {
  wavelength: ArrayLike<number>;
  flux: ArrayLike<number>;
  error?: ArrayLike<number>;
  ivar?: ArrayLike<number>;
  variance?: ArrayLike<number>;
  mask?: ArrayLike<number>;
  sky?: ArrayLike<number>;
}

const MIN_PIXELS = 5;

/**
 * Turns raw columns into the engine's columnar spectrum: drops non-finite or non-positive
 * wavelengths (readers have refused them already), sorts by wavelength (some files run red to
 * blue), converts error/variance to ivar, marks unusable pixels in the mask (ivar = 0 there),
 * ignores pixels whose flux or uncertainty is not a number, infinite or absurd (counted in
 * meta.ignoredPixels and a warning), and estimates uncertainties when none exist or none is usable.
 * The unit text the reader found (meta.fluxUnit) becomes the normalised `fluxUnit`; text it
 * cannot read leaves the flux 'arbitrary' with a warning that quotes it.
 * Throws SpectrumReadError when fewer than MIN_PIXELS pixels remain with a weight.
 */
export function finishSpectrum(raw: RawColumns, meta: Omit<SpectrumMeta, 'errorsEstimated'>, where: string): Spectrum {
  const n = Math.min(raw.wavelength.length, raw.flux.length);
  const order: number[] = [];
  for (let i = 0; i < n; i++) {
    const w = raw.wavelength[i]!;
    if (Number.isFinite(w) && w > 0) order.push(i);
  }
  let sorted = true;
  for (let k = 1; k < order.length; k++) if (raw.wavelength[order[k]!]! <= raw.wavelength[order[k - 1]!]!) sorted = false;
  if (!sorted) order.sort((a, b) => raw.wavelength[a]! - raw.wavelength[b]!);
  const keep: number[] = [];
  for (const i of order) {
    if (keep.length === 0 || raw.wavelength[i]! > raw.wavelength[keep[keep.length - 1]!]!) keep.push(i);
  }
  if (keep.length < MIN_PIXELS) {
    throw new SpectrumReadError('no-valid-pixels', `${where}: only ${keep.length} pixels have a usable wavelength (need at least ${MIN_PIXELS}).`);
  }
  const m = keep.length;
  const wavelength = new Float64Array(m);
  const flux = new Float64Array(m);
  const ivar = new Float64Array(m);
  const mask = new Uint8Array(m);
  const sky = raw.sky ? new Float64Array(m) : undefined;
  const hasErrors = raw.error !== undefined || raw.ivar !== undefined || raw.variance !== undefined;
  const warnings = [...meta.warnings];
  let maskColumn = raw.mask;
  // Multi-bit masks (SDSS and_mask, pipeline DQ words) mix harmless flags (e.g. "emission line
  // here") with bad ones; without the pipeline's bit table we rely on its uncertainties, which
  // such pipelines set to zero weight where the data are bad. 0/1 masks are honoured as written.
  if (maskColumn && hasErrors && isBitmask(maskColumn, n)) {
    maskColumn = undefined;
    warnings.push('The mask column holds bit flags; they were not applied, pixels with zero weight are masked instead.');
  }
  const fluxScale = typicalMagnitude(keep.map((i) => Math.abs(raw.flux[i]!)));
  const ivarOf = raw.ivar
    ? (i: number) => raw.ivar![i]!
    : raw.variance
      ? (i: number) => 1 / raw.variance![i]!
      : raw.error
        ? (i: number) => 1 / (raw.error![i]! * raw.error![i]!)
        : () => 1;
  const ivarScale = hasErrors ? typicalMagnitude(keep.map(ivarOf).filter((v) => v > 0 && v < Infinity)) : 1;
  // σ = 0 or ivar = 0 is the usual "no information here" flag and only masks a pixel; a NaN or
  // infinite number, or one far outside the file's own scale, is counted as ignored as well.
  const fluxBad = new Uint8Array(m);
  const errorBad = new Uint8Array(m);
  const maskedByFile = new Uint8Array(m);
  let usable = 0;
  let weighted = 0;
  for (let k = 0; k < m; k++) {
    const i = keep[k]!;
    wavelength[k] = raw.wavelength[i]!;
    const f = raw.flux[i]!;
    const iv = ivarOf(i);
    fluxBad[k] = plausibleFlux(f, fluxScale) ? 0 : 1;
    errorBad[k] = hasErrors && !plausibleUncertainty(raw, i, iv, ivarScale) ? 1 : 0;
    maskedByFile[k] = maskColumn !== undefined && maskColumn[i]! !== 0 && !Number.isNaN(maskColumn[i]!) ? 1 : 0;
    const weight = !errorBad[k] && iv > 0 && iv < Infinity;
    if (weight) weighted++;
    const bad = fluxBad[k] || !weight || maskedByFile[k];
    flux[k] = fluxBad[k] ? 0 : f;
    ivar[k] = bad ? 0 : iv;
    mask[k] = bad ? 1 : 0;
    if (!bad) usable++;
    if (sky) {
      const s = raw.sky![i]!;
      sky[k] = Number.isFinite(s) ? s : 0;
    }
  }
  // A file whose uncertainties are zero (or unusable) everywhere has none in fact: they are
  // estimated as for a file without any, instead of leaving no pixel with a weight.
  const fluxUsable = m - fluxBad.reduce((a, b) => a + b, 0);
  const unusableErrors = hasErrors && weighted === 0 && fluxUsable > 0;
  let ignored = 0;
  for (let k = 0; k < m; k++) if (fluxBad[k] || (!unusableErrors && errorBad[k])) ignored++;
  if (unusableErrors) {
    for (let k = 0; k < m; k++) mask[k] = fluxBad[k]! | maskedByFile[k]!;
    warnings.push('The file gives no usable uncertainty at any pixel (all zero, negative or not a number); uncertainties were estimated from the scatter of the flux instead.');
  }
  let errorsEstimated = false;
  if (!hasErrors || unusableErrors) {
    // Without uncertainties nothing marks the zero padding some files carry at their ends; it is
    // not a measurement (and would get the weight of a noise-free stretch), so it is masked.
    let head = 0;
    while (head < m && flux[head] === 0) head++;
    let tail = 0;
    while (tail < m - head && flux[m - 1 - tail] === 0) tail++;
    if (head + tail > 0 && head + tail < m) {
      for (let k = 0; k < head; k++) mask[k] = 1;
      for (let k = m - tail; k < m; k++) mask[k] = 1;
      warnings.push(`${head + tail} pixels of exactly zero flux at the ends were taken as padding and masked.`);
    }
    const valid = new Uint8Array(m);
    for (let k = 0; k < m; k++) valid[k] = mask[k] ? 0 : 1;
    const est = estimateIvar(flux, valid);
    usable = 0;
    for (let k = 0; k < m; k++) {
      ivar[k] = est[k]!;
      if (ivar[k] === 0) mask[k] = 1;
      else usable++;
    }
    errorsEstimated = true;
  }
  // Whatever their source, weights beyond these bounds overflow the χ² sums (squares of sums of
  // f²·ivar and t²·ivar) long before they could mean a measurement.
  for (let k = 0; k < m; k++) {
    if (mask[k] || (ivar[k]! <= MAX_IVAR && Math.abs(flux[k]!) * Math.sqrt(ivar[k]!) <= MAX_PIXEL_SNR)) continue;
    mask[k] = 1;
    ivar[k] = 0;
    usable--;
    ignored++;
  }
  if (ignored > 0) warnings.push(`${ignored} pixel${ignored === 1 ? '' : 's'} with non-finite or absurd values ignored.`);
  if (usable < MIN_PIXELS) {
    const why = errorsEstimated && fluxUsable >= MIN_PIXELS
      ? ': the file gives no uncertainties and the flux has no pixel-to-pixel scatter to estimate them from (a noise-free model?); add an error column'
      : '';
    throw new SpectrumReadError('no-valid-pixels', `${where}: only ${usable} of ${m} pixels have a finite flux and a usable uncertainty (need at least ${MIN_PIXELS})${why}.`);
  }
  const unitText = meta.fluxUnit;
  let fluxUnit = unitText === undefined ? arbitraryFluxUnit() : parseFluxUnit(unitText);
  if (!fluxUnit) {
    warnings.push(`The flux unit "${unitText}" is not one Redward reads; the flux is shown in arbitrary units.`);
    fluxUnit = arbitraryFluxUnit(unitText ?? null);
  }
  const spectrum: Spectrum = { wavelength, flux, ivar, mask, fluxUnit, meta: { ...meta, warnings, errorsEstimated, ignoredPixels: ignored } };
  if (sky) spectrum.sky = sky;
  return spectrum;
}

function isBitmask(mask: ArrayLike<number>, n: number): boolean {
  for (let i = 0; i < n; i++) if (mask[i]! > 1) return true;
  return false;
}

/**
 * |flux| beyond which no unit system in use gives a measurement, and beyond which squares and
 * sums of squares approach the double-precision range (≈ 1.8e308): common practice, no source.
 */
const MAX_ABS_FLUX = 1e100;
/** A flux this many times the file's typical |flux|, or an ivar this many times its typical ivar, is absurd. */
const MAX_FLUX_RATIO = 1e12;
const MAX_IVAR_RATIO = 1e24;
/** ivar above this (σ below 1e-50 in any unit) overflows χ² sums against unit-scale templates. */
const MAX_IVAR = 1e100;
/** |flux|/σ of one pixel above this is no measurement (a composite of thousands of spectra reaches 10³–10⁴). */
const MAX_PIXEL_SNR = 1e12;

function plausibleFlux(f: number, scale: number): boolean {
  const a = Math.abs(f);
  return a <= MAX_ABS_FLUX && (scale === 0 || a <= MAX_FLUX_RATIO * scale);
}

/** The uncertainty as written is a number (0 is the usual flag for "no data") and its ivar is within range. */
function plausibleUncertainty(raw: RawColumns, i: number, iv: number, scale: number): boolean {
  const written = raw.ivar?.[i] ?? raw.variance?.[i] ?? raw.error![i]!;
  if (Number.isNaN(written)) return false;
  // An infinite σ or variance is zero weight, written the other way round (Kesseli et al. 2017 do).
  if (written === Infinity) return raw.ivar === undefined;
  if (!Number.isFinite(written)) return false;
  if (written === 0 || iv <= 0) return true;
  return scale === 0 || iv <= MAX_IVAR_RATIO * scale;
}

/** Median of the positive finite values (a sample of at most 4096 of them), or 0 when there are none. */
function typicalMagnitude(values: number[]): number {
  const stride = Math.max(1, Math.floor(values.length / 4096));
  const sample: number[] = [];
  for (let k = 0; k < values.length; k += stride) {
    const v = values[k]!;
    if (v > 0 && v < Infinity) sample.push(v);
  }
  if (sample.length === 0) return 0;
  sample.sort((a, b) => a - b);
  return sample[sample.length >> 1]!;
}
