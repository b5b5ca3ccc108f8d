/**
 * The Calzetti et al. (2000, ApJ 533, 682, eq. 4) starburst attenuation curve k'(λ), with
 * R'_V = 4.05 (their eq. 5), from memory:
 *   k' = 2.659 (−2.156 + 1.509/λ − 0.198/λ² + 0.011/λ³) + R'_V   for 0.12 ≤ λ < 0.63 µm
 *   k' = 2.659 (−1.857 + 1.040/λ) + R'_V                           for 0.63 ≤ λ ≤ 2.20 µm
 * Outside 0.12–2.2 µm the two pieces are extrapolated (common practice) and k' is kept ≥ 0, so the
 * near-infrared tail never brightens.
 *
 * @param wavelengthA rest-frame wavelength, Å
 */
export function calzetti2000K(wavelengthA: number): number {
  const x = wavelengthA / 1e4;
  const k = x >= 0.63
    ? 2.659 * (-1.857 + 1.04 / x) + CALZETTI_RV
    : 2.659 * (-2.156 + 1.509 / x - 0.198 / (x * x) + 0.011 / (x * x * x)) + CALZETTI_RV;
  return Math.max(0, k);
}

/** R'_V of Calzetti et al. (2000), eq. 5. */
export const CALZETTI_RV = 4.05;

/**
 * Fraction of the light left after a Calzetti (2000) screen of stellar-continuum colour excess
 * E_s(B−V): F_obs/F_int = 10^(−0.4 E_s(B−V) k'(λ)) (their eq. 2).
 */
export function calzettiTransmission(wavelengthA: number, ebv: number): number {
  return Math.pow(10, -0.4 * ebv * calzetti2000K(wavelengthA));
}
