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
 * wavelengths, sorts by wavelength (some files run red to blue), converts error/variance to ivar,
 * marks unusable pixels in the mask (ivar = 0 there) and estimates uncertainties when none exist.
 * The unit text the reader found (meta.fluxUnit) becomes the normalised `fluxUnit`; text it
 * cannot read leaves the flux 'arbitrary' with a warning that quotes it.
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
  for (let k = 0; k < m; k++) {
    const i = keep[k]!;
    wavelength[k] = raw.wavelength[i]!;
    const f = raw.flux[i]!;
    let iv = 1;
    if (raw.ivar) iv = raw.ivar[i]!;
    else if (raw.variance) iv = 1 / raw.variance[i]!;
    else if (raw.error) iv = 1 / (raw.error[i]! * raw.error[i]!);
    const bad = !Number.isFinite(f) || !Number.isFinite(iv) || iv <= 0 || (maskColumn !== undefined && maskColumn[i]! !== 0 && !Number.isNaN(maskColumn[i]!));
    flux[k] = Number.isFinite(f) ? f : 0;
    ivar[k] = bad ? 0 : iv;
    mask[k] = bad ? 1 : 0;
    if (sky) {
      const s = raw.sky![i]!;
      sky[k] = Number.isFinite(s) ? s : 0;
    }
  }
  let errorsEstimated = false;
  if (!hasErrors) {
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
    for (let k = 0; k < m; k++) {
      ivar[k] = est[k]!;
      if (ivar[k] === 0) mask[k] = 1;
    }
    errorsEstimated = true;
  }
  const unitText = meta.fluxUnit;
  let fluxUnit = unitText === undefined ? arbitraryFluxUnit() : parseFluxUnit(unitText);
  if (!fluxUnit) {
    warnings.push(`The flux unit "${unitText}" is not one Redward reads; the flux is shown in arbitrary units.`);
    fluxUnit = arbitraryFluxUnit(unitText ?? null);
  }
  const spectrum: Spectrum = { wavelength, flux, ivar, mask, fluxUnit, meta: { ...meta, warnings, errorsEstimated } };
  if (sky) spectrum.sky = sky;
  return spectrum;
}

function isBitmask(mask: ArrayLike<number>, n: number): boolean {
  for (let i = 0; i < n; i++) if (mask[i]! > 1) return true;
  return false;
}
