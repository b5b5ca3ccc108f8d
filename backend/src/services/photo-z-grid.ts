import { photoZTemplates } from '../photoz/analyticTemplates';
import type { FilterCurve } from '../photoz/filterCurve';
import { fitPhotoZ, fitScratch, type PhotoZFit } from '../photoz/fitPhotoZ';
import { PHOTOZ_IGM_MODEL } from '../photoz/igm';
import { buildModelGrid, redshiftGrid, type ModelGrid } from '../photoz/modelGrid';
import { effectiveWavelength } from '../photoz/photometry';

/*
 * The product's photo-z grid and fit, free of the database so a worker thread can run them
 * (jobs/photoz-fit-task.ts) as well as a request.
 */

/** The fit's redshift grid: 0 ≤ z ≤ 12 in steps of 0.006 in ln(1 + z) (the photo-z core's default). */
export const PHOTOZ_Z_MAX = 12;
export const PHOTOZ_STEP = 0.006;

/** The template set in one line, stored with each fit and stated in exports. */
export function templateSetDescription(): string {
  const set = photoZTemplates();
  const count = (kind: string) => set.templates.filter((t) => t.kind === kind).length;
  return `Redward photo-z templates: ${count('lyman-break')} Lyman-break (UV slope -2.6 to -1.4, with and without Lya), ${count('low-z')} low-z 4000 A-break mixes with Calzetti dust, ${count('star')} cool dwarfs and carbon stars; mean IGM ${PHOTOZ_IGM_MODEL}`;
}

const grids = new Map<string, ModelGrid>();
const MAX_GRIDS = 8;

/** A model grid per filter set, built once (≈ 0.7 s for ten bands) and kept for the process. */
export function modelGridFor(curves: FilterCurve[]): ModelGrid {
  // A campaign's own curve may share a name with another campaign's: the key carries its shape.
  const key = curves.map((c) => `${c.name}:${c.wavelength.length}:${effectiveWavelength(c).toFixed(3)}`).join('|');
  let grid = grids.get(key);
  if (!grid) {
    grid = buildModelGrid(photoZTemplates(), curves, redshiftGrid(PHOTOZ_Z_MAX, PHOTOZ_STEP));
    if (grids.size >= MAX_GRIDS) grids.delete(grids.keys().next().value!);
    grids.set(key, grid);
  }
  return grid;
}

/** One source's fit as stored: the core's answer with its P(z) in float32. */
export type SourceFit = Omit<PhotoZFit, 'posterior' | 'profile' | 'galaxyMix'> & { posterior: Float32Array };

/**
 * Fits sources given row-major fluxes and errors (nJy, one row of `curves.length` bands per
 * source; NaN for a band not observed) on the product grid, with P(z).
 */
export function fitSources(curves: FilterCurve[], flux: Float64Array, err: Float64Array): SourceFit[] {
  const grid = modelGridFor(curves);
  const scratch = fitScratch(grid);
  const nb = curves.length;
  const n = nb === 0 ? 0 : flux.length / nb;
  const out: SourceFit[] = [];
  for (let i = 0; i < n; i++) {
    const fit = fitPhotoZ(grid, flux.subarray(i * nb, (i + 1) * nb), err.subarray(i * nb, (i + 1) * nb), { withPosterior: true }, scratch);
    out.push({
      z: fit.z,
      z68: fit.z68,
      z95: fit.z95,
      pLowZ: fit.pLowZ,
      class: fit.class,
      starChi2: fit.starChi2,
      galaxyChi2: fit.galaxyChi2,
      galaxyTemplate: fit.galaxyTemplate,
      starTemplate: fit.starTemplate,
      bands: fit.bands,
      posterior: Float32Array.from(fit.posterior!),
    });
  }
  return out;
}
