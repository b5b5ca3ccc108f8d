/**
 * Vacuum → air wavelength with Morton (2000, ApJS 130, 403), the IAU standard (Birch & Downs 1994):
 * n = 1 + 8.34254e-5 + 2.406147e-2/(130 − s²) + 1.5998e-4/(38.9 − s²), s = 10⁴/λ_vac.
 * Below 2000 Å the vacuum value is returned (air wavelengths are not quoted there).
 *
 * @param vacuumAngstrom vacuum wavelength, Å
 * @returns wavelength in standard air, Å
 * @example toAir(2000) // ≈ 1999.3520
 */
export function toAir(vacuumAngstrom: number): number {
  if (!(vacuumAngstrom >= 2000)) return vacuumAngstrom;
  const s2 = (1e4 / vacuumAngstrom) ** 2;
  const n = 1 + 8.34254e-5 + 2.406147e-2 / (130 - s2) + 1.5998e-4 / (38.9 - s2);
  return vacuumAngstrom / n;
}
