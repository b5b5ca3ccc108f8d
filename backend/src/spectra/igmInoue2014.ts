/**
 * Mean intergalactic H I transmission of Inoue, Shimizu, Iwata & Tanaka (2014, MNRAS 442, 1805):
 * the analytic fit to their Monte-Carlo mean over absorbers drawn from a column-density and redshift
 * distribution fitted to Lyα-forest (LAF) and damped-Lyα (DLA) statistics. Four terms add:
 * Lyman-series LAF and DLA line blanketing (lines j = 2…40) and Lyman-continuum LAF and DLA
 * absorption, each piecewise in λ_obs and, for the continuum, in the source redshift.
 *
 * Table 2 (λ_j and A_j,i) below was transcribed from the copy of Table 2 in
 * TommasoRonconi/galapy_database, IGM/Inoue+2014.txt (commit 813aea86). Status C2: secondary copy.
 * Cross-checks of that transcription:
 * - all 234 values equal the arrays in brantr/igm-absorption, igm-absorption.c ("table 2 of inoue
 *   et al. 2014"), a second, independent copy (C2);
 * - λ_j = 911.7535 n²/(n² − 1) Å to ≤ 0.02 Å for n = j (reference-values.md §1, D);
 * - each row is continuous at its piece joins (2.2λ_j, 5.7λ_j for the LAF, 3λ_j for the DLA) to
 *   ≤ 0.07 %, as a fit must be (D);
 * - the Lyα row agrees with reference-values.md §3 for A_LAF (1.68976e-2, 2.35379e-3, 1.02611e-4
 *   round to these) and A_DLA,1 (1.61698e-4); the sheet's A_DLA,2 = 1.54539e-4 is the Lyβ row's
 *   A_DLA,1 (1.545e-4), while both copies give 5.390e-5, the only value continuous at 3λ_α.
 * Whether the printed table carries more than four significant figures is M.
 *
 * The continuum coefficients (0.325, 2.55e-2, …) are those of the same two copies, which agree;
 * status C2. Equation numbers (25–29) are M.
 */

/** Lyman limit used by the paper's continuum fits, Å (C2, both copies). */
const LYMAN_LIMIT_A = 911.8;

/** Table 2, one row per Lyman-series line j = 2…40: λ_j (Å), A_LAF,1..3, A_DLA,1..2. */
const TABLE_2: ReadonlyArray<readonly [number, number, number, number, number, number]> = [
  [1215.67, 1.69e-2, 2.354e-3, 1.026e-4, 1.617e-4, 5.39e-5],
  [1025.72, 4.692e-3, 6.536e-4, 2.849e-5, 1.545e-4, 5.151e-5],
  [972.537, 2.239e-3, 3.119e-4, 1.36e-5, 1.498e-4, 4.992e-5],
  [949.743, 1.319e-3, 1.837e-4, 8.01e-6, 1.46e-4, 4.868e-5],
  [937.803, 8.707e-4, 1.213e-4, 5.287e-6, 1.429e-4, 4.763e-5],
  [930.748, 6.178e-4, 8.606e-5, 3.752e-6, 1.402e-4, 4.672e-5],
  [926.226, 4.609e-4, 6.421e-5, 2.799e-6, 1.377e-4, 4.59e-5],
  [923.15, 3.569e-4, 4.971e-5, 2.167e-6, 1.355e-4, 4.516e-5],
  [920.963, 2.843e-4, 3.96e-5, 1.726e-6, 1.335e-4, 4.448e-5],
  [919.352, 2.318e-4, 3.229e-5, 1.407e-6, 1.316e-4, 4.385e-5],
  [918.129, 1.923e-4, 2.679e-5, 1.168e-6, 1.298e-4, 4.326e-5],
  [917.181, 1.622e-4, 2.259e-5, 9.847e-7, 1.281e-4, 4.271e-5],
  [916.429, 1.385e-4, 1.929e-5, 8.41e-7, 1.265e-4, 4.218e-5],
  [915.824, 1.196e-4, 1.666e-5, 7.263e-7, 1.25e-4, 4.168e-5],
  [915.329, 1.043e-4, 1.453e-5, 6.334e-7, 1.236e-4, 4.12e-5],
  [914.919, 9.174e-5, 1.278e-5, 5.571e-7, 1.222e-4, 4.075e-5],
  [914.576, 8.128e-5, 1.132e-5, 4.936e-7, 1.209e-4, 4.031e-5],
  [914.286, 7.251e-5, 1.01e-5, 4.403e-7, 1.197e-4, 3.989e-5],
  [914.039, 6.505e-5, 9.062e-6, 3.95e-7, 1.185e-4, 3.949e-5],
  [913.826, 5.868e-5, 8.174e-6, 3.563e-7, 1.173e-4, 3.91e-5],
  [913.641, 5.319e-5, 7.409e-6, 3.23e-7, 1.162e-4, 3.872e-5],
  [913.48, 4.843e-5, 6.746e-6, 2.941e-7, 1.151e-4, 3.836e-5],
  [913.339, 4.427e-5, 6.167e-6, 2.689e-7, 1.14e-4, 3.8e-5],
  [913.215, 4.063e-5, 5.66e-6, 2.467e-7, 1.13e-4, 3.766e-5],
  [913.104, 3.738e-5, 5.207e-6, 2.27e-7, 1.12e-4, 3.732e-5],
  [913.006, 3.454e-5, 4.811e-6, 2.097e-7, 1.11e-4, 3.7e-5],
  [912.918, 3.199e-5, 4.456e-6, 1.943e-7, 1.101e-4, 3.668e-5],
  [912.839, 2.971e-5, 4.139e-6, 1.804e-7, 1.091e-4, 3.637e-5],
  [912.768, 2.766e-5, 3.853e-6, 1.68e-7, 1.082e-4, 3.607e-5],
  [912.703, 2.582e-5, 3.596e-6, 1.568e-7, 1.073e-4, 3.578e-5],
  [912.645, 2.415e-5, 3.364e-6, 1.466e-7, 1.065e-4, 3.549e-5],
  [912.592, 2.263e-5, 3.153e-6, 1.375e-7, 1.056e-4, 3.521e-5],
  [912.543, 2.126e-5, 2.961e-6, 1.291e-7, 1.048e-4, 3.493e-5],
  [912.499, 2.0e-5, 2.785e-6, 1.214e-7, 1.04e-4, 3.466e-5],
  [912.458, 1.885e-5, 2.625e-6, 1.145e-7, 1.032e-4, 3.44e-5],
  [912.42, 1.779e-5, 2.479e-6, 1.08e-7, 1.024e-4, 3.414e-5],
  [912.385, 1.682e-5, 2.343e-6, 1.022e-7, 1.017e-4, 3.389e-5],
  [912.353, 1.593e-5, 2.219e-6, 9.673e-8, 1.009e-4, 3.364e-5],
  [912.324, 1.51e-5, 2.103e-6, 9.169e-8, 1.002e-4, 3.339e-5],
];

// Each series term is A_j,i (λ_obs/λ_j)^p = [A_j,i λ_j^−p] λ_obs^p. Folding λ_j^−p into the
// coefficient once leaves one power of λ_obs per exponent per call instead of one per line, and
// the per-pixel loop reads typed arrays built here without allocating.
const N_LINES = TABLE_2.length;
const LAMBDA_J = Float64Array.from(TABLE_2, (r) => r[0]);
const LAF_BREAK_1 = Float64Array.from(TABLE_2, (r) => 2.2 * r[0]);
const LAF_BREAK_2 = Float64Array.from(TABLE_2, (r) => 5.7 * r[0]);
const DLA_BREAK = Float64Array.from(TABLE_2, (r) => 3 * r[0]);
const LAF_1 = Float64Array.from(TABLE_2, (r) => r[1] * r[0] ** -1.2);
const LAF_2 = Float64Array.from(TABLE_2, (r) => r[2] * r[0] ** -3.7);
const LAF_3 = Float64Array.from(TABLE_2, (r) => r[3] * r[0] ** -5.5);
const DLA_1 = Float64Array.from(TABLE_2, (r) => r[4] * r[0] ** -2);
const DLA_2 = Float64Array.from(TABLE_2, (r) => r[5] * r[0] ** -3);

/**
 * Lyman-series optical depth, LAF + DLA, summed over j = 2…40. Line j absorbs at
 * λ_j < λ_obs < λ_j(1+z_s); with r = λ_obs/λ_j the LAF term is A_j1 r^1.2 (r < 2.2),
 * A_j2 r^3.7 (2.2 ≤ r < 5.7), A_j3 r^5.5 (r ≥ 5.7), and the DLA term A_j1 r² (r < 3), A_j2 r³.
 */
function lymanSeriesDepth(observedAngstrom: number, onePlusZ: number): number {
  let laf1 = 0;
  let laf2 = 0;
  let laf3 = 0;
  let dla1 = 0;
  let dla2 = 0;
  for (let j = 0; j < N_LINES; j++) {
    const lambdaJ = LAMBDA_J[j]!;
    // λ_j falls with j, so once λ_obs is past line j's reach it is past every later line's.
    if (observedAngstrom >= lambdaJ * onePlusZ) break;
    if (observedAngstrom <= lambdaJ) continue;
    if (observedAngstrom < LAF_BREAK_1[j]!) laf1 += LAF_1[j]!;
    else if (observedAngstrom < LAF_BREAK_2[j]!) laf2 += LAF_2[j]!;
    else laf3 += LAF_3[j]!;
    if (observedAngstrom < DLA_BREAK[j]!) dla1 += DLA_1[j]!;
    else dla2 += DLA_2[j]!;
  }
  const l = observedAngstrom;
  let tau = (dla1 + dla2 * l) * l * l;
  if (laf1 > 0) tau += laf1 * l ** 1.2;
  if (laf2 > 0) tau += laf2 * l ** 3.7;
  if (laf3 > 0) tau += laf3 * l ** 5.5;
  return tau;
}

/**
 * Powers of (1 + z_s) in the continuum fits. A template is built pixel by pixel at one z_s, so
 * they are kept for the last z_s seen (one object, updated in place) rather than recomputed.
 */
const zPowers = { onePlusZ: NaN, m09: 0, p16: 0, p34: 0, p2: 0, p23: 0, p3: 0, p33: 0 };

function powersFor(onePlusZ: number): typeof zPowers {
  if (zPowers.onePlusZ !== onePlusZ) {
    zPowers.onePlusZ = onePlusZ;
    zPowers.m09 = onePlusZ ** -0.9;
    zPowers.p16 = onePlusZ ** 1.6;
    zPowers.p34 = onePlusZ ** 3.4;
    zPowers.p2 = onePlusZ * onePlusZ;
    zPowers.p23 = onePlusZ ** 2.3;
    zPowers.p3 = zPowers.p2 * onePlusZ;
    zPowers.p33 = onePlusZ ** 3.3;
  }
  return zPowers;
}

/** Lyman-continuum optical depth of the Lyα forest for x = λ_obs/λ_L < 1 + z_s. */
function lafContinuumDepth(x: number, zSource: number, zp: typeof zPowers): number {
  const x21 = x ** 2.1;
  if (zSource < 1.2) return 0.325 * (x ** 1.2 - zp.m09 * x21);
  if (zSource < 4.7) {
    if (x < 2.2) return 2.55e-2 * zp.p16 * x21 + 0.325 * x ** 1.2 - 0.25 * x21;
    return 2.55e-2 * (zp.p16 * x21 - x ** 3.7);
  }
  if (x < 2.2) return 5.22e-4 * zp.p34 * x21 + 0.325 * x ** 1.2 - 3.14e-2 * x21;
  if (x < 5.7) return 5.22e-4 * zp.p34 * x21 + 0.218 * x21 - 2.55e-2 * x ** 3.7;
  return 5.22e-4 * (zp.p34 * x21 - x ** 5.5);
}

/** Lyman-continuum optical depth of DLAs for x = λ_obs/λ_L < 1 + z_s. */
function dlaContinuumDepth(x: number, zSource: number, zp: typeof zPowers): number {
  const xm03 = x ** -0.3;
  if (zSource < 2) return 0.211 * zp.p2 - 7.66e-2 * zp.p23 * xm03 - 0.135 * x * x;
  const common = 4.7e-2 * zp.p3 - 1.78e-2 * zp.p33 * xm03;
  if (x < 3) return common + 0.634 - 0.135 * x * x - 0.291 * xm03;
  return common - 2.92e-2 * x * x * x;
}

/**
 * Mean IGM optical depth of Inoue et al. (2014) towards a source at zSource, at one observed
 * wavelength: Lyman-series LAF + DLA plus Lyman-continuum LAF + DLA.
 *
 * Two choices the paper does not make: each continuum term is floored at 0, because the
 * three-figure coefficients leave the DLA term at −6e-4 (1+z)² just below λ_L(1+z_s) for
 * z_s < 2; and below the observed Lyman limit (λ_obs < 911.8 Å, where the fits are not given and
 * no ground-based spectrum reaches) the continuum depth is held at its value at 911.8 Å.
 *
 * @param observedAngstrom observed (vacuum) wavelength, Å
 * @param zSource source redshift; 0 or below means no intervening gas (τ = 0)
 * @returns optical depth ≥ 0 (NaN if an input is NaN)
 * @example inoue2014OpticalDepth(4500, 3) // ≈ 0.3012 (Lyα only)
 */
export function inoue2014OpticalDepth(observedAngstrom: number, zSource: number): number {
  if (Number.isNaN(observedAngstrom) || Number.isNaN(zSource)) return NaN;
  if (!(zSource > 0)) return 0;
  const onePlusZ = 1 + zSource;
  let tau = lymanSeriesDepth(observedAngstrom, onePlusZ);
  if (observedAngstrom < LYMAN_LIMIT_A * onePlusZ) {
    const x = Math.max(observedAngstrom, LYMAN_LIMIT_A) / LYMAN_LIMIT_A;
    const zp = powersFor(onePlusZ);
    tau += Math.max(0, lafContinuumDepth(x, zSource, zp)) + Math.max(0, dlaContinuumDepth(x, zSource, zp));
  }
  return tau;
}

/**
 * Mean IGM transmission exp(−τ) of Inoue et al. (2014, MNRAS 442, 1805).
 *
 * @param observedAngstrom observed (vacuum) wavelength, Å
 * @param zSource source redshift
 * @returns transmission in [0, 1]; exactly 1 at λ_obs ≥ 1215.67 (1 + zSource)
 * @example inoue2014Transmission(4500, 3) // ≈ 0.7400
 */
export function inoue2014Transmission(observedAngstrom: number, zSource: number): number {
  return Math.exp(-inoue2014OpticalDepth(observedAngstrom, zSource));
}
