import { eq, inArray } from 'drizzle-orm';
import type { PhotoZSummary } from '../contracts/targets';
import type { Db } from '../db/client';
import { photoZFits, targetPhotometry, targets } from '../db/schema';
import { photoZTemplates } from '../photoz/analyticTemplates';
import type { FilterCurve } from '../photoz/filterCurve';
import { DEFAULT_FIT_OPTIONS, fitPhotoZ, fitScratch } from '../photoz/fitPhotoZ';
import { PHOTOZ_IGM_MODEL } from '../photoz/igm';
import { buildModelGrid, redshiftGrid, type ModelGrid } from '../photoz/modelGrid';
import { effectiveWavelength } from '../photoz/photometry';
import { filterCurves } from './photo-z-filters';

type Tx = Pick<Db, 'select' | 'insert' | 'delete'>;

/** The fit's redshift grid: 0 ≤ z ≤ 12 in steps of 0.006 in ln(1 + z) (the photo-z core's default). */
export const PHOTOZ_Z_MAX = 12;
export const PHOTOZ_STEP = 0.006;

/** The template set in one line, stored with each fit and stated in exports. */
export function templateSetDescription(): string {
  const set = photoZTemplates();
  const count = (kind: string) => set.templates.filter((t) => t.kind === kind).length;
  return `Redward photo-z templates: ${count('lyman-break')} Lyman-break (UV slope -2.6 to -1.4, with and without Lya), ${count('low-z')} low-z 4000 A-break mixes with Calzetti dust, ${count('star')} cool dwarfs and carbon stars; mean IGM ${PHOTOZ_IGM_MODEL}`;
}

/** What every computed photo-z assumed, for the SED panel and exports. */
export function photoZAssumptions(): string[] {
  return [
    templateSetDescription(),
    `P(z) on 0 <= z <= ${PHOTOZ_Z_MAX} (step ${PHOTOZ_STEP} in ln(1+z)) with a flat prior; intervals are equal-tail 68 % and 95 %; pLowZ = P(z < ${DEFAULT_FIT_OPTIONS.lowZ})`,
    `errors floored at ${Math.round(DEFAULT_FIT_OPTIONS.errorFloor * 100)} % of each flux in quadrature; non-detections fitted as measured fluxes; one non-negative amplitude per template`,
  ];
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

export interface TargetBands {
  filters: string[];
  flux: Float64Array;
  err: Float64Array;
}

/** Stored photometry of the targets, each as arrays in the order of `filters` (the union of their bands; NaN where not observed). */
export function photometryOf(db: Pick<Db, 'select'>, targetIds: readonly number[]): { filters: string[]; byTarget: Map<number, { flux: Float64Array; err: Float64Array }> } {
  const rows = [];
  for (let i = 0; i < targetIds.length; i += 500) {
    rows.push(...db.select().from(targetPhotometry).where(inArray(targetPhotometry.targetId, targetIds.slice(i, i + 500))).all());
  }
  const filters = [...new Set(rows.map((r) => r.filter))].sort();
  const column = new Map(filters.map((f, i) => [f, i]));
  const byTarget = new Map<number, { flux: Float64Array; err: Float64Array }>();
  for (const r of rows) {
    let t = byTarget.get(r.targetId);
    if (!t) {
      t = { flux: new Float64Array(filters.length).fill(NaN), err: new Float64Array(filters.length).fill(NaN) };
      byTarget.set(r.targetId, t);
    }
    t.flux[column.get(r.filter)!] = r.fluxNjy;
    t.err[column.get(r.filter)!] = r.errNjy;
  }
  return { filters, byTarget };
}

export type NewFitRow = typeof photoZFits.$inferInsert;

/**
 * Fits the photometric redshifts of these targets from their stored photometry, without writing:
 * one row per target with photometry and a usable fit. Reads only, so a job can fit outside its
 * write transaction.
 */
export function computePhotoZFits(db: Pick<Db, 'select'>, campaignId: number, targetIds: readonly number[], now: string): NewFitRow[] {
  const { filters, byTarget } = photometryOf(db, targetIds);
  if (byTarget.size === 0) return [];
  const grid = modelGridFor(filterCurves(db, campaignId, filters));
  const scratch = fitScratch(grid);
  const templateSet = templateSetDescription();
  const out: NewFitRow[] = [];
  for (const [targetId, { flux, err }] of byTarget) {
    const fit = fitPhotoZ(grid, flux, err, { withPosterior: true }, scratch);
    if (fit.bands === 0 || !Number.isFinite(fit.pLowZ)) continue;
    const posterior = Float32Array.from(fit.posterior!);
    out.push({
      targetId,
      z: fit.z,
      z68Low: fit.z68[0],
      z68High: fit.z68[1],
      z95Low: fit.z95[0],
      z95High: fit.z95[1],
      pLowZ: fit.pLowZ,
      fitClass: fit.class,
      starChi2: fit.starChi2,
      galaxyChi2: fit.galaxyChi2,
      galaxyTemplate: fit.galaxyTemplate,
      starTemplate: fit.starTemplate,
      filters: filters.filter((_, b) => Number.isFinite(flux[b]!) && err[b]! > 0),
      templateSet,
      gridZMax: PHOTOZ_Z_MAX,
      gridStep: PHOTOZ_STEP,
      posterior: Buffer.from(posterior.buffer, posterior.byteOffset, posterior.byteLength),
      computedAt: now,
    });
  }
  return out;
}

/** Removes the fits of these targets (their photometry changed, or is about to be refitted). */
export function deletePhotoZFits(tx: Pick<Db, 'delete'>, targetIds: readonly number[]): void {
  for (let i = 0; i < targetIds.length; i += 500) tx.delete(photoZFits).where(inArray(photoZFits.targetId, targetIds.slice(i, i + 500))).run();
}

/**
 * Replaces the fits of `targetIds` by `rows` (a target without a row is left without a fit).
 * Idempotent: storing the same rows twice leaves one fit per target.
 */
export function storePhotoZFits(tx: Pick<Db, 'insert' | 'delete'>, targetIds: readonly number[], rows: readonly NewFitRow[]): number {
  deletePhotoZFits(tx, targetIds);
  for (let i = 0; i < rows.length; i += 100) tx.insert(photoZFits).values(rows.slice(i, i + 100)).run();
  return rows.length;
}

/**
 * Recomputes the photometric redshifts of these targets from their stored photometry, replacing
 * their fits (a target left without photometry loses its fit). Runs inside the caller's
 * transaction. Returns how many fits were stored.
 */
export function refitPhotoZ(tx: Tx, campaignId: number, targetIds: readonly number[], now: string): number {
  return storePhotoZFits(tx, targetIds, computePhotoZFits(tx, campaignId, targetIds, now));
}

type FitRow = typeof photoZFits.$inferSelect;

const r4 = (v: number) => Number(v.toFixed(4));

export function photoZSummaryOf(row: FitRow): PhotoZSummary {
  return {
    z: r4(row.z),
    z68: [r4(row.z68Low), r4(row.z68High)],
    z95: [r4(row.z95Low), r4(row.z95High)],
    pLowZ: r4(row.pLowZ),
    class: row.fitClass === 'star' ? 'star' : 'galaxy',
    // χ² can be large for a bad fit; three decimals are plenty and keep JSON small.
    starChi2: Number.isFinite(row.starChi2) ? Number(row.starChi2.toFixed(3)) : 1e30,
    galaxyChi2: Number(row.galaxyChi2.toFixed(3)),
    galaxyTemplate: row.galaxyTemplate,
    starTemplate: row.starTemplate,
    filters: row.filters,
  };
}

/** P(z) of a stored fit on its grid nodes (density, unit integral). */
export function posteriorOf(row: FitRow): { z: number[]; p: number[] } {
  const grid = redshiftGrid(row.gridZMax, row.gridStep);
  const buf = row.posterior;
  const p = new Float32Array(buf.buffer.slice(buf.byteOffset, buf.byteOffset + buf.byteLength));
  if (p.length !== grid.z.length) throw new Error(`stored P(z) of target ${row.targetId} has ${p.length} values for a grid of ${grid.z.length}`);
  return { z: Array.from(grid.z, (v) => Number(v.toFixed(5))), p: Array.from(p, (v) => Number(v.toPrecision(5))) };
}

/** The fits of these targets by target id. */
export function fitsOf(db: Pick<Db, 'select'>, targetIds: readonly number[]): Map<number, FitRow> {
  const out = new Map<number, FitRow>();
  for (let i = 0; i < targetIds.length; i += 500) {
    for (const r of db.select().from(photoZFits).where(inArray(photoZFits.targetId, targetIds.slice(i, i + 500))).all()) out.set(r.targetId, r);
  }
  return out;
}

/**
 * What a campaign's computed photo-z assumed, for export headers: the filters its fits used (with
 * how many fits used each set when they differ), the template set and the method. Empty when no
 * target of the campaign has a fit.
 */
export function campaignPhotoZProvenance(db: Pick<Db, 'select'>, campaignId: number): { photometricRedshift?: { filters: string; templates: string; method: string } } {
  const rows = db
    .select({ filters: photoZFits.filters, templateSet: photoZFits.templateSet })
    .from(photoZFits)
    .innerJoin(targets, eq(targets.id, photoZFits.targetId))
    .where(eq(targets.campaignId, campaignId))
    .all();
  if (rows.length === 0) return {};
  const sets = new Map<string, number>();
  for (const r of rows) sets.set(r.filters.join(' '), (sets.get(r.filters.join(' ')) ?? 0) + 1);
  const filters = sets.size === 1 ? [...sets.keys()][0]! : [...sets].map(([f, n]) => `${f} (${n} targets)`).join('; ');
  const templates = [...new Set(rows.map((r) => r.templateSet))].join('; ');
  const method = `chi2 fit of each template with one non-negative amplitude on 0 <= z <= ${PHOTOZ_Z_MAX} (step ${PHOTOZ_STEP} in ln(1+z)), flat prior, errors floored at ${Math.round(DEFAULT_FIT_OPTIONS.errorFloor * 100)} % of the flux; z_phot is the chi2 minimum, z_phot_low/high the equal-tail 68 % interval, z_phot_p_low_z = P(z < ${DEFAULT_FIT_OPTIONS.lowZ})`;
  return { photometricRedshift: { filters, templates, method } };
}
