/** Catastrophic photometric-redshift outliers: |Δz|/(1+z_spec) above this (common convention, reference-values.md §6). */
export const PHOTO_Z_OUTLIER = 0.15;

function median(values: number[]): number {
  const s = [...values].sort((x, y) => x - y);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

/**
 * How well photometric redshifts matched the confirmed spectroscopic ones: the outlier fraction
 * (|Δz|/(1+z_spec) > 0.15) and σ_NMAD = 1.48 × median(|Δz − median(Δz)| / (1+z_spec)), with
 * Δz = z_phot − z_spec (reference-values.md §6: threshold confirmed, σ_NMAD form from memory).
 */
export function photoZQuality(pairs: readonly { zSpec: number; zPhot: number }[]) {
  if (pairs.length === 0) return { n: 0, outlierFraction: null, sigmaNmad: null, outliers: [] as number[] };
  const dz = pairs.map((p) => p.zPhot - p.zSpec);
  const medianDz = median(dz);
  const sigmaNmad = 1.48 * median(pairs.map((p, i) => Math.abs(dz[i]! - medianDz) / (1 + p.zSpec)));
  const outliers = pairs.map((p, i) => (Math.abs(dz[i]!) / (1 + p.zSpec) > PHOTO_Z_OUTLIER ? i : -1)).filter((i) => i >= 0);
  return { n: pairs.length, outlierFraction: outliers.length / pairs.length, sigmaNmad, outliers };
}
