import { binAt } from './buildTemplates';
import { zToShift } from './logGrid';
import { prepareSpectrum } from './prepareSpectrum';
import { scanData, scanTemplate } from './scanTemplate';
import { templatesFor, type ScanOptions } from './scanSpectrum';
import { toVacuum } from './toVacuum';
import type { Spectrum } from './types';

/** The part of a solution the model needs: its redshift and template id (as in `Solution`). */
export interface SolutionRef {
  z: number;
  template: string;
}

/** The best-fit model of one solution, with what it was built from. */
export interface SolutionFit {
  /** Model flux at each input wavelength, flux units of the input; NaN outside coverage. */
  model: Float64Array;
  /** The data's own running-mean continuum under the model (the scan removes it from both sides). */
  continuum: Float64Array;
  /** Integer grid shift the model sits at (the scan's amplitudes are per integer shift). */
  shift: number;
  /** Redshift of that shift. */
  zShift: number;
  /** Non-negative amplitudes of the template's basis vectors in the redshift bin, scan units. */
  amplitudes: number[];
  /** Labels of those basis vectors. */
  basis: string[];
  /** χ² of the fit on the scan's log grid (equals the scan's curve at this shift). */
  chi2: number;
  /** Pixels of the log grid with weight, for χ² per pixel. */
  pixels: number;
}

/**
 * The model of a solution on the spectrum's own wavelengths, for overlays: the same template and
 * non-negative amplitude fit the scan made at the solution's shift (the scan of that template is
 * rerun over the redshift bin that holds z, so the amplitudes are those of the χ²(z) curve), on the
 * same continuum-removed data. The scan compares highPass(data) with Σ a·highPass(template); the
 * model returned is that fitted sum plus the data's own removed running mean, so data − model is
 * exactly the residual whose weighted squares the scan summed. Wavelengths outside the usable
 * data range (or the template's rest coverage) give NaN.
 *
 * @param spectrum the spectrum as read (air or vacuum per its metadata)
 * @param solution a scan solution (z and template id)
 * @param options the options the scan was run with (grid step, masks, medium, z range)
 * @example solutionModel(spectrum, scanSpectrum(spectrum).solutions[0]) // Float64Array, one per pixel
 */
export function solutionModel(spectrum: Spectrum, solution: SolutionRef, options: ScanOptions = {}): Float64Array {
  return solutionFit(spectrum, solution, options).model;
}

/** `solutionModel` with the amplitudes, continuum and χ² it was built from. */
export function solutionFit(spectrum: Spectrum, solution: SolutionRef, options: ScanOptions = {}): SolutionFit {
  const prepared = prepareSpectrum(spectrum, options);
  const set = templatesFor(prepared, options.igmModel);
  const template = set.templates.find((t) => t.id === solution.template);
  if (!template) throw new RangeError(`No template "${solution.template}" in the engine's template set.`);
  const z = solution.z;
  if (!Number.isFinite(z) || z < template.zMin - 1e-9 || z > template.zMax + 1e-9) {
    throw new RangeError(`z = ${z} lies outside the range ${template.zMin} … ${template.zMax} of template "${template.id}".`);
  }
  const step = set.step;
  const bin = binAt(template, z);
  const zLo = Math.max(bin.zLo, options.zMin ?? bin.zLo, template.zMin);
  const zHi = Math.min(bin.zHi, options.zMax ?? bin.zHi, template.zMax);
  const data = scanData(prepared);
  const curve = scanTemplate(data, set, template, Math.min(zLo, z), Math.max(zHi, z), 'fft');
  if (!curve) throw new RangeError(`Template "${template.id}" has no shift at z = ${z} on this grid.`);
  const shift = Math.min(curve.sMin + curve.chi2.length - 1, Math.max(curve.sMin, Math.round(zToShift(z, step))));
  const k = shift - curve.sMin;
  const amplitudes = Array.from(curve.amplitudes.subarray(k * curve.maxBasis, k * curve.maxBasis + bin.basis.length));

  // Model on the log grid, in the input's flux units (the scan rescaled flux by √typicalIvar).
  const n = prepared.n;
  const scale = data.fluxScale;
  const grid = new Float64Array(n).fill(NaN);
  const continuum = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    continuum[i] = prepared.gridFlux[i]! - prepared.flux[i]!;
    const j = prepared.g0 + i - shift - set.h0;
    if (j < 0 || j >= set.length) continue;
    let v = 0;
    bin.basis.forEach((b, c) => (v += amplitudes[c]! * template.basis[b]!.values[j]!));
    grid[i] = continuum[i]! + v / scale;
  }
  let pixels = 0;
  for (let i = 0; i < n; i++) if (prepared.ivar[i]! > 0) pixels++;

  const medium = options.medium ?? spectrum.meta.medium;
  const m = spectrum.wavelength.length;
  const model = new Float64Array(m);
  const cont = new Float64Array(m);
  for (let p = 0; p < m; p++) {
    const lam = medium === 'air' ? toVacuum(spectrum.wavelength[p]!) : spectrum.wavelength[p]!;
    if (!(lam >= prepared.wavelengthMin && lam <= prepared.wavelengthMax)) {
      model[p] = NaN;
      cont[p] = NaN;
      continue;
    }
    const x = Math.log10(lam) / step - prepared.g0;
    const i = Math.min(n - 2, Math.max(0, Math.floor(x)));
    const f = Math.min(1, Math.max(0, x - i));
    model[p] = grid[i]! * (1 - f) + grid[i + 1]! * f;
    cont[p] = continuum[i]! * (1 - f) + continuum[i + 1]! * f;
  }
  return {
    model,
    continuum: cont,
    shift,
    zShift: 10 ** (shift * step) - 1,
    amplitudes,
    basis: bin.basis.map((b) => template.basis[b]!.label),
    chi2: curve.chi2[k]!,
    pixels,
  };
}
