/**
 * Physical constants and conversions of the independent sky, written here on purpose (not imported
 * from the engine), so a shared mistake cannot hide in both.
 */

/** Speed of light, km/s. */
export const C_KMS = 299_792.458;

/**
 * Vacuum → standard-air wavelength with Edlén's (1966, Metrologia 2, 71) dispersion formula, from
 * memory: (n − 1)·10⁸ = 8342.13 + 2 406 030/(130 − σ²) + 15 997/(38.9 − σ²), σ = 10⁴/λ in µm⁻¹.
 * Below 2000 Å wavelengths are quoted in vacuum by convention and returned unchanged.
 *
 * @param vacuum Å
 * @returns Å in standard air
 * @example vacuumToAir(6564.61) // ≈ 6562.80 (Hα)
 */
export function vacuumToAir(vacuum: number): number {
  if (vacuum < 2000) return vacuum;
  const s2 = (1e4 / vacuum) ** 2;
  const n = 1 + (8342.13 + 2_406_030 / (130 - s2) + 15_997 / (38.9 - s2)) * 1e-8;
  return vacuum / n;
}

/** Standard air → vacuum, Å: vacuumToAir inverted by fixed-point iteration (converges to 1e-9 Å in three steps). */
export function airToVacuum(air: number): number {
  if (air < 2000) return air;
  let v = air * 1.00028;
  for (let k = 0; k < 4; k++) v += air - vacuumToAir(v);
  return v;
}

/**
 * Hubble rate H(z) in km/s/Mpc for flat ΛCDM with the Planck 2018 values (H0 = 67.4, Ωm = 0.315;
 * Planck Collaboration 2020, A&A 641, A6, abstract; radiation neglected).
 */
export function hubble(z: number): number {
  return 67.4 * Math.sqrt(0.315 * (1 + z) ** 3 + 0.685);
}

/** Planck function B_λ(T) up to a constant, for λ in Å and T in K (shape only). */
export function planckShape(lambda: number, temperatureK: number): number {
  const x = 1.438_777e8 / (lambda * temperatureK); // hc/(λ k T) with hc/k = 1.438777e8 Å·K
  return x > 700 ? 0 : 1 / (lambda ** 5 * Math.expm1(x));
}
