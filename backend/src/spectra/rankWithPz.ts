import type { Solution } from './scanSpectrum';

/** A computed photo-z posterior tabulated on an increasing redshift grid. */
export interface TabulatedPz {
  z: ArrayLike<number>;
  p: ArrayLike<number>;
}

/** P is floored at this fraction of its peak so a strong spectral solution can still win (common practice). */
export const PZ_FLOOR_FRACTION = 1e-6;

/** P(z)/peak by linear interpolation, floored at PZ_FLOOR_FRACTION; outside the grid it is the floor. */
export function pzWeight(pz: TabulatedPz, z: number): number {
  const n = pz.z.length;
  if (n === 0 || n !== pz.p.length) throw new RangeError('P(z) grid and values must be non-empty and of equal length');
  let peak = 0;
  for (let i = 0; i < n; i++) if (pz.p[i]! > peak) peak = pz.p[i]!;
  if (!(peak > 0)) throw new RangeError('P(z) has no positive value');
  let value = 0;
  if (z >= pz.z[0]! && z <= pz.z[n - 1]!) {
    let lo = 0;
    let hi = n - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (pz.z[mid]! <= z) lo = mid;
      else hi = mid;
    }
    const z0 = pz.z[lo]!;
    const z1 = pz.z[hi]!;
    const t = z1 > z0 ? (z - z0) / (z1 - z0) : 0;
    value = pz.p[lo]! + t * (pz.p[hi]! - pz.p[lo]!);
  }
  return Math.max(PZ_FLOOR_FRACTION, Math.max(0, value) / peak);
}

/**
 * Re-ranks solutions with a tabulated P(z) and never drops any. Score = χ² − 2 ln w with
 * w = P(z_sol)/max P floored at 1e-6 (common practice: the prior enters as −2 ln P added to χ²;
 * dividing by the peak only shifts all scores equally). The floor caps the penalty at
 * 2 ln 1e6 ≈ 27.6, so a solution better by more than that in χ² still wins.
 * Δχ² is recomputed on the new order from the scores; priorWeight carries w.
 */
export function rankWithPz<S extends Solution>(solutions: readonly S[], pz: TabulatedPz): Array<S & { priorWeight: number }> {
  const scored = solutions.map((s) => {
    const weight = pzWeight(pz, s.z);
    return { s: { ...s, priorWeight: weight }, score: s.chi2 - 2 * Math.log(weight) };
  });
  scored.sort((a, b) => a.score - b.score);
  return scored.map(({ s }, k) => ({ ...s, deltaChi2: k + 1 < scored.length ? scored[k + 1]!.score - scored[k]!.score : null }));
}
