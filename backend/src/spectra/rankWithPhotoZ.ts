import type { Solution } from './scanSpectrum';

/** A target's photometric redshift: value and 68 % range. */
export interface PhotoZPrior {
  z: number;
  lo: number;
  hi: number;
}

/**
 * Re-ranks solutions with a photometric-redshift prior and never drops any: the score is
 * χ² − 2 ln w, with w = 1 inside the 68 % range and a Gaussian fall-off outside it whose σ is
 * the half-width of that range (in 1+z). Δχ² is recomputed on the new order from the scores.
 */
export function rankWithPhotoZ<S extends Solution>(solutions: readonly S[], prior: PhotoZPrior): Array<S & { priorWeight: number }> {
  const halfWidth = Math.max(0.02, (prior.hi - prior.lo) / 2);
  const scored = solutions.map((s) => {
    const outside = s.z < prior.lo ? prior.lo - s.z : s.z > prior.hi ? s.z - prior.hi : 0;
    const sigma = halfWidth * 1; // in z; the range already scales with (1+z) in photo-z catalogues
    const weight = Math.exp(-0.5 * (outside / sigma) ** 2);
    const score = s.chi2 + (outside / sigma) ** 2;
    return { s: { ...s, priorWeight: weight }, score };
  });
  scored.sort((a, b) => a.score - b.score);
  return scored.map(({ s }, k) => ({ ...s, deltaChi2: k + 1 < scored.length ? scored[k + 1]!.score - scored[k]!.score : null }));
}
