import type { FilterCurve } from './filterCurve';

/** Speed of light in Å/s, for f_λ ↔ f_ν. */
export const C_ANGSTROM_PER_S = 2.99792458e18;
/** The AB zero point: 3631 Jy (Oke & Gunn 1983, ApJ 266, 713), in nJy. */
export const AB_ZERO_POINT_NJY = 3631e9;

/**
 * The effective wavelength as the shipped filter README defines it (after Fukugita et al. 1996,
 * AJ 111, 1748): λ_eff = exp( ∫ T ln λ d(ln λ) / ∫ T d(ln λ) ), trapezoid rule over the curve's
 * own samples.
 *
 * @returns λ_eff in Å
 */
export function effectiveWavelength(curve: FilterCurve): number {
  const { wavelength: w, transmission: t } = curve;
  let num = 0;
  let den = 0;
  for (let i = 1; i < w.length; i++) {
    const l0 = Math.log(w[i - 1]!);
    const l1 = Math.log(w[i]!);
    const d = l1 - l0;
    num += 0.5 * d * (t[i - 1]! * l0 + t[i]! * l1);
    den += 0.5 * d * (t[i - 1]! + t[i]!);
  }
  return Math.exp(num / den);
}

/**
 * Photon-counting band average of f_ν over a curve's own samples:
 *   ⟨f_ν⟩ = ∫ f_ν T dλ/λ / ∫ T dλ/λ
 * (a photon counter collects ∫ f_λ T λ/(hc) dλ = (c/h) ∫ f_ν T dλ/λ; normalising by the same
 * integral of a flat f_ν makes the AB magnitude of the average exact; Fukugita et al. 1996, AJ 111,
 * 1748, and Bessell & Murphy 2012, PASP 124, 140 — from memory). The spectrum is interpolated
 * linearly at the curve's samples and taken as zero outside its range.
 *
 * @param wavelengthA spectrum wavelengths, Å, increasing
 * @param fnu f_ν at those wavelengths (any unit; the average is in the same unit)
 * @returns ⟨f_ν⟩ and the fraction of the band's weight ∫T dλ/λ the spectrum covers (0…1)
 */
export function bandAverageFnu(curve: FilterCurve, wavelengthA: Float64Array, fnu: Float64Array): { fnu: number; covered: number } {
  const { wavelength: w, transmission: t } = curve;
  let num = 0;
  let den = 0;
  let cov = 0;
  let j = 0;
  const n = wavelengthA.length;
  const at = (lam: number): number => {
    if (n === 0 || lam < wavelengthA[0]! || lam > wavelengthA[n - 1]!) return NaN;
    while (j < n - 2 && wavelengthA[j + 1]! < lam) j++;
    const x0 = wavelengthA[j]!;
    const x1 = wavelengthA[j + 1] ?? x0;
    if (x1 === x0) return fnu[j]!;
    return fnu[j]! + ((fnu[j + 1]! - fnu[j]!) * (lam - x0)) / (x1 - x0);
  };
  let prev = at(w[0]!);
  for (let i = 1; i < w.length; i++) {
    const cur = at(w[i]!);
    const d = Math.log(w[i]! / w[i - 1]!);
    const wt = 0.5 * d * (t[i - 1]! + t[i]!);
    den += wt;
    if (Number.isFinite(prev) && Number.isFinite(cur)) {
      num += 0.5 * d * (t[i - 1]! * prev + t[i]! * cur);
      cov += wt;
    }
    prev = cur;
  }
  return { fnu: num / den, covered: cov / den };
}

/** f_λ (per Å) → f_ν (per Hz) at wavelength λ Å: f_ν = f_λ λ² / c. */
export function fnuFromFlambda(flambda: number, wavelengthA: number): number {
  return (flambda * wavelengthA * wavelengthA) / C_ANGSTROM_PER_S;
}

/**
 * AB magnitude of a band-averaged flux density (Oke & Gunn 1983): m = −2.5 log10(f_ν / 3631 Jy).
 *
 * @param fnuNJy ⟨f_ν⟩ in nJy
 * @returns magnitude; +Infinity for zero flux, NaN for negative flux
 */
export function abMagnitude(fnuNJy: number): number {
  return -2.5 * Math.log10(fnuNJy / AB_ZERO_POINT_NJY);
}

/** nJy from an AB magnitude (inverse of abMagnitude). */
export function nJyFromAb(magnitude: number): number {
  return AB_ZERO_POINT_NJY * Math.pow(10, -0.4 * magnitude);
}

/**
 * A band resampled for fast synthetic photometry: the curve's transmission on a uniform ln λ grid
 * (step `dlnLambda`) over its non-zero range, with trapezoid weights T d(ln λ) normalised to sum
 * to 1, so ⟨f_ν⟩ = Σ weight_i f_ν(λ_i).
 */
export interface BandSampler {
  name: string;
  /** Observed-frame sample wavelengths, Å. */
  wavelength: Float64Array;
  /** Σ weight = 1. */
  weight: Float64Array;
}

/**
 * Resamples a curve for `BandSampler` use, over the range where T > 1e-4 of its peak. 1e-3 in
 * ln λ (0.1 %) is 4.6× finer than the template grid, so the resampling changes a band average by
 * far less than photometric errors (the reference tests compare it with the curve's own samples).
 */
export function bandSampler(curve: FilterCurve, dlnLambda = 1e-3): BandSampler {
  const { wavelength: w, transmission: t } = curve;
  // The band's extent: where T exceeds 1e-4 of its peak. Some curves carry tails of 1e-30 over
  // thousands of Å; they weigh nothing and would only make every band average slower.
  let peak = 0;
  for (const v of t) if (v > peak) peak = v;
  const cut = 1e-4 * peak;
  let lo = 0;
  while (lo < w.length - 2 && t[lo + 1]! <= cut) lo++;
  let hi = w.length - 1;
  while (hi > lo + 1 && t[hi - 1]! <= cut) hi--;
  const l0 = Math.log(w[lo]!);
  const l1 = Math.log(w[hi]!);
  const n = Math.max(2, Math.ceil((l1 - l0) / dlnLambda) + 1);
  const step = (l1 - l0) / (n - 1);
  const lam = new Float64Array(n);
  const wt = new Float64Array(n);
  let j = lo;
  let sum = 0;
  for (let i = 0; i < n; i++) {
    const x = Math.exp(l0 + i * step);
    lam[i] = x;
    while (j < hi - 1 && w[j + 1]! < x) j++;
    const x0 = w[j]!;
    const x1 = w[j + 1]!;
    const f = Math.min(1, Math.max(0, (x - x0) / (x1 - x0)));
    const ti = t[j]! + (t[j + 1]! - t[j]!) * f;
    wt[i] = ti * (i === 0 || i === n - 1 ? 0.5 : 1);
    sum += wt[i]!;
  }
  for (let i = 0; i < n; i++) wt[i] = wt[i]! / sum;
  return { name: curve.name, wavelength: lam, weight: wt };
}
