import type { GradeScheme } from '../contracts/grades';

export interface ReadingValues {
  z: number;
  zErr: number | null;
  grade: string;
  spectrumClass: string;
  lines: string[];
}

export type DisagreementReason = 'z' | 'grade' | 'class';

/** Position of a grade in the scheme, 0 = most confident (schemes are listed highest first). */
function rank(scheme: GradeScheme, code: string): number {
  const i = scheme.findIndex((g) => g.code === code);
  if (i < 0) throw new RangeError(`Grade ${code} is not in the campaign's scheme.`);
  return i;
}

/**
 * Whether two independent readings agree: |z₁ − z₂| / (1 + z̄) within the campaign tolerance,
 * grades at most one step apart in the scheme, and the same class (PRODUCT.md, "disagreement").
 *
 * @example compareReadings({z: 1.0, …grade 4}, {z: 1.004, …grade 3}, scheme, 0.003).agree // true (Δ = 0.002)
 */
export function compareReadings(a: ReadingValues, b: ReadingValues, scheme: GradeScheme, tolerance: number) {
  const zMean = (a.z + b.z) / 2;
  const dzOver1pz = Math.abs(a.z - b.z) / (1 + zMean);
  const gradeSteps = Math.abs(rank(scheme, a.grade) - rank(scheme, b.grade));
  const reasons: DisagreementReason[] = [];
  if (dzOver1pz > tolerance) reasons.push('z');
  if (gradeSteps > 1) reasons.push('grade');
  if (a.spectrumClass !== b.spectrumClass) reasons.push('class');
  return { agree: reasons.length === 0, reasons, dzOver1pz, gradeSteps };
}

/**
 * The confirmed value of two agreeing readings: z is the inverse-variance mean when both give an
 * error (its error 1/√Σw), otherwise the z of the more confident reading (the plain mean when
 * both have the same grade); the grade is the less confident of the two; the lines are the union.
 */
export function combineReadings(a: ReadingValues, b: ReadingValues, scheme: GradeScheme): ReadingValues {
  const rankA = rank(scheme, a.grade);
  const rankB = rank(scheme, b.grade);
  let z: number;
  let zErr: number | null;
  if (a.zErr !== null && b.zErr !== null && a.zErr > 0 && b.zErr > 0) {
    const wa = 1 / a.zErr ** 2;
    const wb = 1 / b.zErr ** 2;
    z = (wa * a.z + wb * b.z) / (wa + wb);
    zErr = 1 / Math.sqrt(wa + wb);
  } else if (rankA !== rankB) {
    const better = rankA < rankB ? a : b;
    z = better.z;
    zErr = better.zErr;
  } else {
    z = (a.z + b.z) / 2;
    zErr = a.zErr ?? b.zErr;
  }
  return {
    z,
    zErr,
    grade: rankA >= rankB ? a.grade : b.grade,
    spectrumClass: a.spectrumClass,
    lines: [...new Set([...a.lines, ...b.lines])],
  };
}
