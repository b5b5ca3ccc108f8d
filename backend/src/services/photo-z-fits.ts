import { eq, inArray } from 'drizzle-orm';
import type { PhotoZSummary } from '../contracts/targets';
import type { Db } from '../db/client';
import { photoZFits, targetPhotometry, targets } from '../db/schema';
import type { FilterCurve } from '../photoz/filterCurve';
import { DEFAULT_FIT_OPTIONS } from '../photoz/fitPhotoZ';
import { redshiftGrid } from '../photoz/modelGrid';
import { filterCurves } from './photo-z-filters';
import { fitSources, PHOTOZ_STEP, PHOTOZ_Z_MAX, templateSetDescription, type SourceFit } from './photo-z-grid';

export { modelGridFor, PHOTOZ_STEP, PHOTOZ_Z_MAX, templateSetDescription } from './photo-z-grid';

type Tx = Pick<Db, 'select' | 'insert' | 'delete'>;

/** What every computed photo-z assumed, for the SED panel and exports. */
export function photoZAssumptions(): string[] {
  return [
    templateSetDescription(),
    `P(z) on 0 <= z <= ${PHOTOZ_Z_MAX} (step ${PHOTOZ_STEP} in ln(1+z)) with a flat prior; intervals are equal-tail 68 % and 95 %; pLowZ = P(z < ${DEFAULT_FIT_OPTIONS.lowZ})`,
    `errors floored at ${Math.round(DEFAULT_FIT_OPTIONS.errorFloor * 100)} % of each flux in quadrature; non-detections fitted as measured fluxes; one non-negative amplitude per template`,
  ];
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

/** What a photo-z fit of some targets needs, read from the database: curves, fluxes in band order. */
export interface PhotoZFitInput {
  filters: string[];
  curves: FilterCurve[];
  targetIds: number[];
  /** Row-major, targetIds.length × filters.length; NaN where a band was not observed. */
  flux: Float64Array;
  err: Float64Array;
}

/** The stored photometry of these targets as fit input; null when none of them has any. */
export function photoZFitInput(db: Pick<Db, 'select'>, campaignId: number, targetIds: readonly number[]): PhotoZFitInput | null {
  const { filters, byTarget } = photometryOf(db, targetIds);
  if (byTarget.size === 0) return null;
  const ids = [...byTarget.keys()];
  const nb = filters.length;
  const flux = new Float64Array(ids.length * nb);
  const err = new Float64Array(ids.length * nb);
  ids.forEach((id, i) => {
    flux.set(byTarget.get(id)!.flux, i * nb);
    err.set(byTarget.get(id)!.err, i * nb);
  });
  return { filters, curves: filterCurves(db, campaignId, filters), targetIds: ids, flux, err };
}

/** The fits as rows to store, one per target with a usable fit (a source without bands gets none). */
export function photoZFitRows(input: PhotoZFitInput, fits: readonly SourceFit[], now: string): NewFitRow[] {
  const templateSet = templateSetDescription();
  const nb = input.filters.length;
  const out: NewFitRow[] = [];
  fits.forEach((fit, i) => {
    if (fit.bands === 0 || !Number.isFinite(fit.pLowZ)) return;
    const flux = input.flux.subarray(i * nb, (i + 1) * nb);
    const err = input.err.subarray(i * nb, (i + 1) * nb);
    out.push({
      targetId: input.targetIds[i]!,
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
      filters: input.filters.filter((_, b) => Number.isFinite(flux[b]!) && err[b]! > 0),
      templateSet,
      gridZMax: PHOTOZ_Z_MAX,
      gridStep: PHOTOZ_STEP,
      posterior: Buffer.from(fit.posterior.buffer, fit.posterior.byteOffset, fit.posterior.byteLength),
      computedAt: now,
    });
  });
  return out;
}

/**
 * Fits the photometric redshifts of these targets from their stored photometry on this thread,
 * without writing: one row per target with photometry and a usable fit.
 */
export function computePhotoZFits(db: Pick<Db, 'select'>, campaignId: number, targetIds: readonly number[], now: string): NewFitRow[] {
  const input = photoZFitInput(db, campaignId, targetIds);
  return input ? photoZFitRows(input, fitSources(input.curves, input.flux, input.err), now) : [];
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
