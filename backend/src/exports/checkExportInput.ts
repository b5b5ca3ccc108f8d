import type { ConfirmedRow, ExportAssumptions } from './types';

const CLASSES = new Set(['galaxy', 'quasar', 'star', 'lyman-break', 'unknown']);
const HOW = new Set(['agreement', 'settlement', 'correction']);
/** As contracts/grades.ts allows: a word, so it stays one token in every format. */
const GRADE_CODE = /^[A-Za-z0-9][A-Za-z0-9_.+-]{0,15}$/;

/**
 * Checks the rows and assumptions once at the entry of every writer, so the writers can trust
 * them. Throws a RangeError sentence naming the record at fault.
 */
export function checkExportInput(rows: readonly ConfirmedRow[], assumptions: ExportAssumptions): void {
  const { cosmology, tolerance, gradeScheme } = assumptions;
  if (assumptions.wavelengths !== 'vacuum') {
    throw new RangeError(`Exports state vacuum wavelengths; got '${String(assumptions.wavelengths)}'.`);
  }
  if (!(cosmology.h0 > 0) || !(cosmology.omegaM > 0 && cosmology.omegaM <= 1)) {
    throw new RangeError(`Cosmology needs H0 > 0 and 0 < Ω_m ≤ 1, got H0=${cosmology.h0}, Ω_m=${cosmology.omegaM}.`);
  }
  // The derived columns come from a flat-space integral, so a non-flat Ω_Λ would be silently ignored.
  if (cosmology.flat !== true || !(Math.abs(cosmology.omegaM + cosmology.omegaLambda - 1) <= 1e-6)) {
    throw new RangeError(`The cosmology must be flat (Ω_m + Ω_Λ = 1), got Ω_m=${cosmology.omegaM}, Ω_Λ=${cosmology.omegaLambda}.`);
  }
  if (!(tolerance >= 0) || !Number.isFinite(tolerance)) throw new RangeError(`The agreement tolerance must be a finite number ≥ 0, got ${tolerance}.`);
  const codes = new Set<string>();
  for (const g of gradeScheme) {
    if (!GRADE_CODE.test(g.code) || codes.has(g.code)) throw new RangeError(`Grade codes must be distinct words without spaces; '${g.label}' has code '${g.code}'.`);
    codes.add(g.code);
  }
  if (Number.isNaN(Date.parse(assumptions.exportedAt))) throw new RangeError(`exportedAt '${assumptions.exportedAt}' is not an ISO-8601 time.`);
  for (const r of rows) checkRow(r);
}

function checkRow(r: ConfirmedRow): void {
  const at = `Confirmed record ${r.id}`;
  for (const [name, v] of [['id', r.id], ['spectrumId', r.spectrumId]] as const) {
    if (!Number.isSafeInteger(v)) throw new RangeError(`${at}: ${name} must be an integer, got ${v}.`);
  }
  if (!GRADE_CODE.test(r.gradeCode)) throw new RangeError(`${at}: grade code '${r.gradeCode}' is not a word without spaces.`);
  if (r.supersedes !== null && !Number.isSafeInteger(r.supersedes)) throw new RangeError(`${at}: supersedes must be an integer or null, got ${r.supersedes}.`);
  if (!Number.isFinite(r.z)) throw new RangeError(`${at}: z must be a finite number, got ${r.z}.`);
  const optional = { ra: r.ra, dec: r.dec, zErr: r.zErr, zErrFloor: r.zErrFloor, photoZ: r.photoZ, photoZLow: r.photoZLow, photoZHigh: r.photoZHigh, interloperZ: r.interloperZ, interloperDeltaChi2: r.interloperDeltaChi2, starDeltaChi2: r.starDeltaChi2, zPhot: r.zPhot ?? null, zPhotLow: r.zPhotLow ?? null, zPhotHigh: r.zPhotHigh ?? null, zPhotPLowZ: r.zPhotPLowZ ?? null };
  for (const [name, v] of Object.entries(optional)) {
    if (v !== null && !Number.isFinite(v)) throw new RangeError(`${at}: ${name} must be a finite number or null, got ${v}.`);
  }
  if (!CLASSES.has(r.spectrumClass)) throw new RangeError(`${at}: class '${r.spectrumClass}' is not one of ${[...CLASSES].join(', ')}.`);
  if (!HOW.has(r.confirmedBy)) throw new RangeError(`${at}: confirmedBy '${r.confirmedBy}' is not one of ${[...HOW].join(', ')}.`);
}
