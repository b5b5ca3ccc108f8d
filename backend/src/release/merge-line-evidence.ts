import type { StoredLineMeasurements } from '../contracts/line-measurements';

/**
 * The measurements behind a confirmed value's lines: each line from the first reading that
 * measured it, else from the second. Null when neither reading carries measurements (readings
 * saved before lines were measured).
 */
export function mergeLineEvidence(lines: string[], a: StoredLineMeasurements | null, b: StoredLineMeasurements | null): StoredLineMeasurements | null {
  const base = a ?? b;
  if (!base) return null;
  const pick = (name: string) => a?.lines.find((m) => m.name === name) ?? b?.lines.find((m) => m.name === name);
  return {
    ...base,
    zErrFloor: Math.max(a?.zErrFloor ?? 0, b?.zErrFloor ?? 0),
    lines: lines.map(pick).filter((m) => m !== undefined),
  };
}

/**
 * A confirmed error is never below the resolution floor: two readings of the same pixels are not
 * independent at that level, so their inverse-variance mean (1/√Σw) may not shrink it further.
 */
export function atLeastFloor(zErr: number | null, evidence: StoredLineMeasurements | null): number | null {
  if (!evidence) return zErr;
  return zErr === null ? evidence.zErrFloor : Math.max(zErr, evidence.zErrFloor);
}
