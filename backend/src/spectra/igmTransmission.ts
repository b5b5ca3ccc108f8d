import { inoue2014Transmission } from './igmInoue2014';

/** Lyman-series wavelengths (Å) and coefficients A_j of Madau (1995, ApJ 441, 18), eq. 12 and Table. */
const SERIES: ReadonlyArray<readonly [number, number]> = [
  [1216, 3.6e-3],
  [1026, 1.7e-3],
  [973, 1.2e-3],
  [950, 9.3e-4],
];
const LYMAN_LIMIT = 912;

/**
 * Mean intergalactic transmission exp(−τ_eff) towards a source at redshift zSource, seen at an
 * observed wavelength, after Madau (1995): Lyman-series line blanketing
 * τ = Σ A_j (λ_obs/λ_j)^3.46 for λ_obs < λ_j(1+z), plus the photoelectric term of the paper's
 * footnote for λ_obs ≤ 912(1+z). The paper's rounded wavelengths (1216, 1026, 973, 950, 912 Å)
 * are kept on purpose so the published check values reproduce.
 *
 * @param observedAngstrom observed wavelength, Å
 * @param zSource source redshift
 * @returns transmission between 0 and 1
 * @example igmTransmission(4500, 3) // ≈ 0.7167
 */
export function igmTransmission(observedAngstrom: number, zSource: number): number {
  const xEm = 1 + zSource;
  let tau = 0;
  for (const [lambdaJ, a] of SERIES) {
    if (observedAngstrom < lambdaJ * xEm) tau += a * Math.pow(observedAngstrom / lambdaJ, 3.46);
  }
  if (observedAngstrom <= LYMAN_LIMIT * xEm) {
    const xc = observedAngstrom / LYMAN_LIMIT;
    tau +=
      0.25 * xc ** 3 * (xEm ** 0.46 - xc ** 0.46) +
      9.4 * xc ** 1.5 * (xEm ** 0.18 - xc ** 0.18) -
      0.7 * xc ** 3 * (xc ** -1.32 - xEm ** -1.32) -
      0.023 * (xEm ** 1.68 - xc ** 1.68);
  }
  return Math.exp(-Math.max(0, tau));
}

/** Which mean IGM transmission model a template uses. */
export type IgmModel = 'inoue2014' | 'madau1995';

/**
 * Inoue et al. (2014) by default: it is fitted to later absorber statistics than Madau (1995) and
 * carries the Lyman series to j = 40 and DLAs (see igmInoue2014.ts).
 */
export const DEFAULT_IGM_MODEL: IgmModel = 'inoue2014';

/**
 * Mean intergalactic transmission under the chosen model.
 *
 * @param observedAngstrom observed wavelength, Å
 * @param zSource source redshift
 * @param model 'inoue2014' (Inoue et al. 2014, MNRAS 442, 1805) or 'madau1995' (igmTransmission)
 * @returns transmission between 0 and 1
 * @throws RangeError for a model name outside IgmModel (e.g. from stored settings)
 * @example meanIgmTransmission(4500, 3, 'madau1995') // ≈ 0.7167
 */
export function meanIgmTransmission(observedAngstrom: number, zSource: number, model: IgmModel = DEFAULT_IGM_MODEL): number {
  if (model === 'inoue2014') return inoue2014Transmission(observedAngstrom, zSource);
  if (model === 'madau1995') return igmTransmission(observedAngstrom, zSource);
  throw new RangeError(`Unknown IGM model '${String(model)}': expected 'inoue2014' or 'madau1995'.`);
}
