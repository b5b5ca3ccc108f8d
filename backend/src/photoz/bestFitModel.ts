import { DEFAULT_FIT_OPTIONS } from './fitPhotoZ';
import { photoZIgm } from './igm';
import type { ModelGrid } from './modelGrid';
import { LY_ALPHA_A, type RestGrid, type RestTemplate } from './restTemplates';

/** A template through a source's bands: its band fluxes, amplitude and χ² (with the fit's error floor). */
export interface BandModel {
  template: string;
  z: number;
  amplitude: number;
  chi2: number;
  /** Band fluxes in the grid's band order, in the unit of the fluxes given. */
  bandFlux: Float64Array;
}

/** The redshift node of the grid closest to z in ln(1 + z). */
export function nearestNode(grid: ModelGrid, z: number): number {
  const nodes = grid.redshift.z;
  const k = Math.round(Math.log1p(z) / grid.redshift.dlnOnePlusZ);
  return Math.max(0, Math.min(nodes.length - 1, k));
}

/**
 * The best non-negative amplitude of one template (galaxy at the grid node nearest z, or star at
 * z = 0) for these fluxes, with the same weights as fitPhotoZ (1/(σ² + (floor·f)²); bands with a
 * NaN flux or a non-positive error carry none). For drawing, so a star's extrapolated bands get
 * no model error here.
 */
export function bandModel(grid: ModelGrid, templateId: string, z: number, flux: ArrayLike<number>, err: ArrayLike<number>, errorFloor = DEFAULT_FIT_OPTIONS.errorFloor): BandModel {
  const nb = grid.bands.length;
  const g = grid.galaxyIds.indexOf(templateId);
  const s = grid.starIds.indexOf(templateId);
  if (g < 0 && s < 0) throw new RangeError(`no template "${templateId}" in the model grid`);
  const k = g >= 0 ? nearestNode(grid, z) : 0;
  const base = g >= 0 ? (g * grid.redshift.z.length + k) * nb : s * nb;
  const models = g >= 0 ? grid.galaxy : grid.star;
  let sFM = 0;
  let sMM = 0;
  let sFF = 0;
  for (let b = 0; b < nb; b++) {
    const f = flux[b]!;
    const e = err[b]!;
    if (!Number.isFinite(f) || !(e > 0) || !Number.isFinite(e)) continue;
    const floor = errorFloor * f;
    const w = 1 / (e * e + floor * floor);
    const m = models[base + b]!;
    sFM += w * f * m;
    sMM += w * m * m;
    sFF += w * f * f;
  }
  const amplitude = sFM > 0 && sMM > 0 ? sFM / sMM : 0;
  const bandFlux = new Float64Array(nb);
  for (let b = 0; b < nb; b++) bandFlux[b] = amplitude * models[base + b]!;
  return { template: templateId, z: g >= 0 ? grid.redshift.z[k]! : 0, amplitude, chi2: Math.max(0, sFF - amplitude * sFM), bandFlux };
}

/**
 * A rest-frame template seen at z, scaled by `amplitude`: f_ν at `points` observed wavelengths
 * spaced evenly in ln λ over [lo, hi] Å, with the mean IGM applied blueward of Lyα (as the model
 * grid does), for drawing through the bands.
 */
export function observedTemplate(template: RestTemplate, grid: RestGrid, z: number, amplitude: number, lo: number, hi: number, points = 240): { wavelength: Float64Array; fnu: Float64Array } {
  const wavelength = new Float64Array(points);
  const fnu = new Float64Array(points);
  const l0 = Math.log(lo);
  const step = (Math.log(hi) - l0) / (points - 1);
  const shift = Math.log1p(z);
  for (let i = 0; i < points; i++) {
    const ln = l0 + i * step;
    const lam = Math.exp(ln);
    wavelength[i] = lam;
    const u = (ln - shift - grid.lnMin) / grid.dln;
    if (u < 0 || u > grid.n - 1) continue;
    const j = Math.min(grid.n - 2, Math.floor(u));
    const f = u - j;
    const v = template.fnu[j]! * (1 - f) + template.fnu[j + 1]! * f;
    const igm = template.class === 'galaxy' && lam <= LY_ALPHA_A * (1 + z) ? photoZIgm(lam, z) : 1;
    fnu[i] = amplitude * v * igm;
  }
  return { wavelength, fnu };
}
