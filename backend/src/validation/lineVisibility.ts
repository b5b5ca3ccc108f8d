import { C_KMS } from '../spectra/logGrid';
import type { PreparedSpectrum } from '../spectra/prepareSpectrum';
import { REST } from './independentSky/restLines';

/**
 * How visible a galaxy's nebular lines are in a spectrum at its true redshift: the largest
 * matched-filter S/N among the strong lines ([O II], [Ne III], Hβ, [O III] 5008, Hα, [N II] 6585,
 * [S II]) for Gaussian widths of 150 and 300 km/s (with the instrument in quadrature), on the
 * continuum-removed flux. A spectrum whose best line is below 5σ carries no line a reader or an
 * engine could claim (common practice: 5σ for a line detection), whatever its continuum S/N: the
 * accuracy report counts such galaxies apart, since "unknown" is then the honest answer.
 * Validation only — the engine never sees the truth.
 */

const STRONG_LINES_A = [REST.oII3727, REST.oII3730, REST.neIII, REST.hBeta, REST.oIII5008, REST.hAlpha, REST.nII6585, REST.sII6718, REST.sII6733];
const WIDTHS_KMS = [150, 300];
/** Share of a line window's pixels that must be usable for the line to count as measured. */
const MIN_COVERAGE = 0.8;
/** The line S/N below which a galaxy counts as showing no line. */
export const LINE_DETECTION_SIGMA = 5;

/** Largest matched-filter S/N of the strong nebular lines at redshift z (0 when none is on usable data). */
export function bestLineSnr(prepared: PreparedSpectrum, z: number): number {
  let best = 0;
  for (const widthKms of WIDTHS_KMS) {
    const sigmaPx = Math.hypot(widthKms / C_KMS / Math.LN10 / prepared.step, prepared.instrumentSigmaPx);
    for (const rest of STRONG_LINES_A) best = Math.max(best, matchedSnr(prepared, rest * (1 + z), sigmaPx));
  }
  return best;
}

/** S/N of a Gaussian of σ pixels at the observed wavelength: Σwfg / √Σwg² over ±3σ. */
function matchedSnr(prepared: PreparedSpectrum, observedA: number, sigmaPx: number): number {
  const centre = Math.log10(observedA) / prepared.step - prepared.g0;
  const half = Math.max(2, Math.ceil(3 * sigmaPx));
  const lo = Math.round(centre) - half;
  const hi = Math.round(centre) + half;
  if (lo < 0 || hi >= prepared.n) return 0;
  let usable = 0;
  let signal = 0;
  let norm = 0;
  for (let i = lo; i <= hi; i++) {
    const w = prepared.ivar[i]!;
    if (!(w > 0)) continue;
    usable++;
    const g = Math.exp(-0.5 * ((i - centre) / sigmaPx) ** 2);
    signal += w * prepared.flux[i]! * g;
    norm += w * g * g;
  }
  return usable >= MIN_COVERAGE * (hi - lo + 1) && norm > 0 ? signal / Math.sqrt(norm) : 0;
}
