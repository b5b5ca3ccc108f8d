/**
 * Air → vacuum wavelength, IAU convention: the inverse of Morton (2000, ApJS 130, 403) as fitted by
 * N. Piskunov (VALD), n = 1 + 8.336624212083e-5 + 2.408926869968e-2/(130.1065924522 − s²)
 * + 1.599740894897e-4/(38.92568793293 − s²), s = 10⁴/λ_air.
 * Below 2000 Å wavelengths are by convention already vacuum and are returned unchanged.
 *
 * @param airAngstrom wavelength in standard air, Å
 * @returns vacuum wavelength, Å
 * @example toVacuum(5006.843) // ≈ 5008.2397
 */
export function toVacuum(airAngstrom: number): number {
  if (!(airAngstrom >= 2000)) return airAngstrom;
  const s2 = (1e4 / airAngstrom) ** 2;
  const n =
    1 + 8.336624212083e-5 + 2.408926869968e-2 / (130.1065924522 - s2) + 1.599740894897e-4 / (38.92568793293 - s2);
  return airAngstrom * n;
}

/** Converts a whole wavelength array in place-free fashion (returns a new array), Å → Å. */
export function toVacuumArray(airAngstrom: Float64Array): Float64Array {
  const out = new Float64Array(airAngstrom.length);
  for (let i = 0; i < out.length; i++) out[i] = toVacuum(airAngstrom[i]!);
  return out;
}
