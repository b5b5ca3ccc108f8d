import type { ExportColumn } from './confirmedColumns';
import type { ExportAssumptions } from './types';

/** A named statement about the export, written as a header line, an INFO element or a meta key. */
export type Entry = [key: string, value: string];

export const DERIVED_NOTE =
  'lookback_time and luminosity_distance: flat LCDM without radiation (Hogg 1999, astro-ph/9905116); for z <= 0 lookback_time is 0 and luminosity_distance is null';
export const INTERLOPER_NOTE =
  "interloper_z, interloper_dchi2, star_dchi2: the engine's interloper check of a Lyman-break solution within 0.01 in |dz|/(1+z) of z (4000 A/Balmer-break galaxy at (1+z)*1215.67/3934.78 ... (1+z)*1215.67/3646 - 1; stars at z = 0); chi2 includes the continuum-shape check; null for other classes or when no such solution was scanned";
export const ROUNDING_NOTE =
  'z is rounded to the decimal place of the second significant digit of z_err, and z_err to two significant digits rounded up; z_err is the engine error widened in quadrature by z_err_floor, the sigma of the resolution element (2 pixels FWHM from the pixel scale of the data), and never below it';
export const LINES_NOTE =
  "lines_measured: each line used, measured by Redward in the data at the reading's z: emission flux above a sideband continuum (detected at flux/sigma >= 3), absorption rest-frame EW in A, negative for absorption (detected at EW/sigma >= 3), breaks as mean f_nu red/blue (detected when the step is >= 3 sigma); dv is the centroid offset from z in km/s; blends are written once joined by '+'; records confirmed before lines were measured have none";
export const LYA_NOTE =
  'z_caveat: set where z rests on Lya alone (a Lyman-break source, or Lya the only detected line): Lya emission is typically offset redward of systemic by a few hundred km/s (Shapley et al. 2003, from memory)';
export const NULL_NOTE = 'an empty field is null (no value); empty text and empty lists are exported as null';

/**
 * The assumptions as ordered key/value statements shared by the CSV comment header and the
 * VOTable INFO elements, so both say the same thing in the same words.
 */
export function assumptionEntries(a: ExportAssumptions): Entry[] {
  const c = a.cosmology;
  return [
    ['campaign', a.campaign],
    ['wavelengths', a.wavelengths],
    ['cosmology', `${c.name}: flat LCDM, H0 = ${c.h0} km/s/Mpc, Omega_m = ${c.omegaM}, Omega_Lambda = ${c.omegaLambda}`],
    ['cosmology_name', c.name],
    ['cosmology_h0', String(c.h0)],
    ['cosmology_omega_m', String(c.omegaM)],
    ['cosmology_omega_lambda', String(c.omegaLambda)],
    ['agreement_tolerance', `${a.tolerance} in |dz|/(1+z)`],
    ['exported_at', a.exportedAt],
    ['software', a.software],
    ['derived_columns', DERIVED_NOTE],
    ['interloper_columns', INTERLOPER_NOTE],
    ['z_rounding', ROUNDING_NOTE],
    ['lines_measured', LINES_NOTE],
    ['lya_caveat', LYA_NOTE],
    ['nulls', NULL_NOTE],
    ...photometricRedshiftEntries(a),
    ...photoZPriorEntries(a),
  ];
}

/** The photo-z prior statement and its counts, e.g. "typed 3, computed P(z) 2, none 1 (of 6 current confirmed records, at export)". */
export function photoZPriorEntries(a: ExportAssumptions): Entry[] {
  const p = a.photoZPrior;
  if (!p) return [];
  const { typed, computed, none } = p.records;
  return [
    ['photo_z_prior', p.convention],
    ['photo_z_prior_records', `typed ${typed}, computed P(z) ${computed}, none ${none} (of ${typed + computed + none} current confirmed records in the campaign, at export)`],
  ];
}

/** One statement per grade of the scheme: `grade.4` → `firm: two or more clear features …`. */
export function gradeEntries(a: ExportAssumptions): Entry[] {
  return a.gradeScheme.map((g) => [`grade.${g.code}`, `${g.label}: ${g.meaning}`]);
}

/** One statement per column: its meaning and unit. */
export function columnEntries(columns: readonly ExportColumn[]): Entry[] {
  return columns.map((col) => [`column.${col.name}`, col.unit ? `${col.description} [${col.unit}]` : col.description]);
}

/** What the z_phot columns assumed, when the export carries computed photometric redshifts. */
function photometricRedshiftEntries(a: ExportAssumptions): Entry[] {
  const p = a.photometricRedshift;
  if (!p) return [];
  return [
    ['photometric_redshift_filters', p.filters],
    ['photometric_redshift_templates', p.templates],
    ['photometric_redshift_method', p.method],
  ];
}
