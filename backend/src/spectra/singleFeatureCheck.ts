import { binAt, type BuiltTemplate, type TemplateSet } from './buildTemplates';
import { shiftToZ } from './logGrid';
import type { ScanData } from './scanTemplate';

/**
 * An absorption-line galaxy or a star is recognised by many features at once: the Balmer series,
 * Ca H&K, the G band, Mg b, Na D; molecular bands and alkali lines. When nearly all of a solution's
 * χ² gain sits in one narrow window, the "galaxy" is a single dip the template happens to own —
 * a saturated intervening absorber or a broad absorption trough in a quasar spectrum, read as an
 * A-star Hα at z ≈ 0.8–0.9 (the near-infrared arms of PSOJ065-26 and PSOJ231-20: 97 and 99 % of
 * the gain in one 0.006 dex window), or a damped absorber read as a 4000 Å break. Correctly
 * identified absorption-line galaxies of the real-spectra set keep ≤ 47 % of their gain in one
 * window above z = 0.05 and ≤ 81 % at z ≈ 0 (where Na D and Hα absorption can dominate).
 *
 * Such a solution keeps its gain outside the window in full, and at most SHARE_CAP/(1 − SHARE_CAP)
 * times that inside it: the evidence of one feature is capped by what the rest of the spectrum says.
 * The cap is common practice in spirit (a redshift from one feature is not secure), its numbers
 * chosen on the real-spectra set.
 */

/** Width of the feature window, dex (≈ 1400 km/s: a saturated absorber or a stellar Balmer line's core). */
export const FEATURE_WINDOW_DEX = 0.006;
/** Largest share of the gain one window may carry before it is capped. */
export const SHARE_CAP = 0.9;

/** Templates whose evidence is absorption features seen together (emission-line redshifts from one line are legitimate and named as ambiguous elsewhere). */
export function checksSingleFeature(template: BuiltTemplate): boolean {
  return template.class === 'star' || template.id === 'galaxy-absorption';
}

export interface FeatureShare {
  /** χ² gain of the fit over a zero model. */
  gain: number;
  /** The largest gain inside one window of FEATURE_WINDOW_DEX. */
  window: number;
  /** χ² added to the solution (0 unless the window's share exceeds SHARE_CAP). */
  penalty: number;
}

/**
 * The gain of one solution per pixel, 2·m·(w f) − w·m², summed over the whole spectrum and over its
 * best window, and the penalty that caps the window's share.
 *
 * @param shift integer grid shift of the solution
 * @param amplitudes the scan's amplitudes at that shift, in the order of the bin's basis vectors
 */
export function featureShare(data: ScanData, set: TemplateSet, template: BuiltTemplate, shift: number, amplitudes: ArrayLike<number>): FeatureShare {
  const bin = binAt(template, shiftToZ(shift, set.step));
  const n = data.prepared.n;
  const prefix = new Float64Array(n + 1);
  const start = data.prepared.g0 - shift - set.h0;
  const vectors = bin.basis.map((b) => template.basis[b]!.values);
  for (let i = 0; i < n; i++) {
    const j = start + i;
    let m = 0;
    if (j >= 0 && j < set.length) for (let c = 0; c < vectors.length; c++) m += amplitudes[c]! * vectors[c]![j]!;
    const wf = data.wf[i]!;
    const w = data.w[i]!;
    prefix[i + 1] = prefix[i]! + 2 * m * wf - w * m * m;
  }
  const gain = prefix[n]!;
  const width = Math.max(1, Math.round(FEATURE_WINDOW_DEX / set.step));
  let window = 0;
  for (let i = 0; i + width <= n; i++) window = Math.max(window, prefix[i + width]! - prefix[i]!);
  if (n < width) window = gain;
  const rest = Math.max(0, gain - window);
  const allowed = (SHARE_CAP / (1 - SHARE_CAP)) * rest;
  return { gain, window, penalty: gain > 0 && window > allowed ? window - allowed : 0 };
}
