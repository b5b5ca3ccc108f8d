import type { ScanResult } from './scanSpectrum';

/** A scan that finished but produced numbers no one may act on (NaN or infinite χ², z, errors). */
export class NonFiniteScanError extends Error {
  readonly code = 'non-finite-result';
  constructor(message: string) {
    super(message);
    this.name = 'NonFiniteScanError';
  }
}

/**
 * The first non-finite number among what a scan reports to people — each solution's z, its error,
 * χ², χ²/dof, Δχ² and detection χ², the zero model's χ², the covered range and the median S/N, the
 * χ²(z) curves — described in words, or undefined when every one is finite. A NaN serialises to
 * null in JSON and an infinite χ² wins or loses every comparison, so either would pass for a result.
 */
export function nonFiniteInScan(result: ScanResult): string | undefined {
  if (!Number.isFinite(result.chi2Null)) return `the zero model's χ² is ${result.chi2Null}`;
  const { meta } = result;
  for (const key of ['wavelengthMin', 'wavelengthMax', 'snrMedian'] as const) {
    if (!Number.isFinite(meta[key])) return `meta.${key} is ${meta[key]} (no usable pixel on the grid)`;
  }
  for (const [k, s] of result.solutions.entries()) {
    for (const key of ['z', 'zErr', 'chi2', 'reducedChi2', 'detectionChi2'] as const) {
      if (!Number.isFinite(s[key])) return `solution ${k + 1} (${s.template}) has ${key} = ${s[key]}`;
    }
    if (s.deltaChi2 !== null && !Number.isFinite(s.deltaChi2)) return `solution ${k + 1} (${s.template}) has deltaChi2 = ${s.deltaChi2}`;
  }
  for (const c of result.curves) {
    for (let i = 0; i < c.chi2.length; i++) {
      if (!Number.isFinite(c.chi2[i]!) || !Number.isFinite(c.z[i]!)) return `the χ²(z) curve of ${c.template} holds ${c.chi2[i]} at z = ${c.z[i]}`;
    }
  }
  return undefined;
}

/**
 * The last guard before a scan is stored or printed: returns the result when every reported number
 * is finite, else throws NonFiniteScanError with a sentence saying which one is not.
 */
export function assertFiniteScan(result: ScanResult): ScanResult {
  const problem = nonFiniteInScan(result);
  if (problem) {
    throw new NonFiniteScanError(`The scan produced a non-finite number (${problem}): some values in the file are outside the range the engine can compute with, so no solution is reported.`);
  }
  return result;
}
