import { bestAmplitudes, MAX_COMPONENTS } from './bestAmplitudes';
import { binAt, type BuiltTemplate, type TemplateSet } from './buildTemplates';
import { shiftToZ } from './logGrid';
import type { PreparedSpectrum } from './prepareSpectrum';

const LY_ALPHA = 1215.67;

/**
 * The scan works on continuum-removed data, so it cannot see the shape of a spectrum on scales
 * longer than its 0.03 dex filter: a blue, falling UV continuum and a red, rising old-star one look
 * alike once filtered, and a break is only a wiggle at its edge. Those are exactly what tells a
 * Lyman break from a 4000 Å break at the mirror redshift ((1 + z) ratio 3.24), a faint Lyman-break
 * source from a lone emission line, or a cool star's band heads from a break. This check, run
 * lazily on the candidates about to be chosen, fits the unfiltered template to the data averaged
 * in coarse bins:
 *
 *   χ²_shape = min over c of Σ_b (F_b − 10^{c·x_b}·Σ_k a_k U_kb)² / (σ_b² + (f_sys·F_b)² + (f_floor·F_typ)²) + (c/σ_c)²
 *
 * with F_b, σ_b the inverse-variance weighted mean flux of bin b and its error, U_kb the bin mean
 * of the template's basis vector k (before continuum removal) at the candidate's shift, a_k ≥ 0,
 * x_b ∈ [−1, 1] the bin's position across the spectrum and 10^{c·x} a flux-calibration tilt with a
 * Gaussian prior. Templates made of emission lines only get one power law λ^α, −3 ≤ α ≤ 3, as their
 * continuum (they say nothing about it, but it must be smooth: no step).
 * f_sys allows the template's idealised continuum to be off by 10 % per bin (common practice for
 * spectrophotometric and template errors); f_floor keeps dark bins from being weighted without
 * limit when the data are very deep.
 */

/** Bin width, dex (≈ 3.5 %). */
export const SHAPE_BIN_DEX = 0.015;
/** Fractional template/calibration error per bin (common practice). */
const F_SYS = 0.1;
/** Floor as a fraction of the typical bin level (common practice). */
const F_FLOOR = 0.02;
/** Prior σ of the tilt c (dex over half the range, within ±0.2: ±26 % at the ends at 1σ; common practice for slit spectrophotometry). */
const TILT_SIGMA = 0.1;
const TILTS = Array.from({ length: 9 }, (_, k) => -0.2 + 0.05 * k);
/** Fewest usable pixels for a bin to count. */
const MIN_PIXELS = 5;

/** Power-law indices α (f_λ ∝ λ^α) tried as the continuum of line-only templates: −3 … 3 spans blue star-forming to red dusty galaxies (common practice). */
const SMOOTH_INDICES = Array.from({ length: 13 }, (_, k) => -3 + 0.5 * k);

export interface ShapeBins {
  /** Local pixel range [start[b], end[b]) of each bin. */
  start: Int32Array;
  end: Int32Array;
  flux: Float64Array;
  variance: Float64Array;
  /** Position across the covered range, −1 … 1. */
  x: Float64Array;
  /** Inverse-variance weights of each pixel (the ones used for the bin means). */
  pixelWeight: Float64Array;
  /** Half the covered range, dex (x = ±1 at its ends). */
  halfRangeDex: number;
}

/** Coarse bins of the prepared spectrum's unfiltered flux (built once per scan). */
export function shapeBins(prepared: PreparedSpectrum): ShapeBins {
  const perBin = Math.max(1, Math.round(SHAPE_BIN_DEX / prepared.step));
  const n = prepared.n;
  const starts: number[] = [];
  const ends: number[] = [];
  const flux: number[] = [];
  const variance: number[] = [];
  const centre: number[] = [];
  const pixelWeight = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const iv = prepared.ivar[i]!;
    pixelWeight[i] = iv > 0 && Number.isFinite(prepared.gridFlux[i]!) ? iv : 0;
  }
  for (let a = 0; a < n; a += perBin) {
    const b = Math.min(n, a + perBin);
    let sw = 0;
    let swf = 0;
    let count = 0;
    for (let i = a; i < b; i++) {
      const w = pixelWeight[i]!;
      if (w > 0) {
        sw += w;
        swf += w * prepared.gridFlux[i]!;
        count++;
      }
    }
    if (count < MIN_PIXELS || !(sw > 0)) continue;
    starts.push(a);
    ends.push(b);
    flux.push(swf / sw);
    variance.push(1 / sw);
    centre.push((a + b) / 2);
  }
  const lo = centre[0] ?? 0;
  const hi = centre[centre.length - 1] ?? 1;
  const x = Float64Array.from(centre, (c) => (hi > lo ? (2 * (c - lo)) / (hi - lo) - 1 : 0));
  const typical = median(flux.map(Math.abs));
  const total = Float64Array.from(variance, (v, b) => v + (F_SYS * flux[b]!) ** 2 + (F_FLOOR * typical) ** 2);
  return { start: Int32Array.from(starts), end: Int32Array.from(ends), flux: Float64Array.from(flux), variance: total, x, pixelWeight, halfRangeDex: ((hi - lo) * prepared.step) / 2 };
}

const gram = new Float64Array(MAX_COMPONENTS * MAX_COMPONENTS);
const proj = new Float64Array(MAX_COMPONENTS);
const amps = new Float64Array(MAX_COMPONENTS);

/**
 * χ²_shape of a template at an integer grid shift (see the module comment); 0 when fewer than
 * four bins are usable (nothing to say about a shape).
 *
 * @param transmission mean IGM transmission at an observed wavelength (Å) for a source at z, applied
 *   to IGM-attenuated vectors at the candidate's own z instead of their bin centre's
 */
export function shapeChi2(bins: ShapeBins, prepared: PreparedSpectrum, set: TemplateSet, template: BuiltTemplate, shift: number, transmission: (observedA: number, z: number) => number): number {
  const nb = bins.flux.length;
  if (nb < 4) return 0;
  const z = shiftToZ(shift, set.step);
  const basis = binAt(template, z).basis.map((k) => template.basis[k]!);
  const hasContinuum = basis.some((b) => b.continuum);
  const m = Math.min(MAX_COMPONENTS - (hasContinuum ? 0 : 1), basis.length);
  const vectors: Float64Array[] = basis.slice(0, m).map(() => new Float64Array(nb));
  const start = prepared.g0 - shift - set.h0;
  const lyAlphaJ = Math.log10(LY_ALPHA) / set.step - set.h0;
  const blue = new Float64Array(m);
  for (let b = 0; b < nb; b++) {
    let sw = 0;
    blue.fill(0);
    for (let i = bins.start[b]!; i < bins.end[b]!; i++) {
      const w = bins.pixelWeight[i]!;
      if (!(w > 0)) continue;
      const j = start + i;
      sw += w;
      if (j < 0 || j >= set.length) continue;
      for (let k = 0; k < m; k++) {
        const v = basis[k]!;
        if (v.igm && j < lyAlphaJ) blue[k]! += w * v.igm.unattenuated[j]!;
        else vectors[k]![b]! += w * v.unfiltered[j]!;
      }
    }
    // The transmission varies little across one bin: it is taken once per bin (not per pixel; the
    // IGM models sum over 4–39 Lyman-series lines), at the centre of the bin's part blueward of Lyα.
    // At the bin's own centre, a bin holding the break would take the blue pixels as unattenuated
    // whenever its centre lies redward of Lyα, and the penalty would jump with the break's place
    // in its bin (at z ≈ 8, by ≈ 900 between shifts 0.4 % apart; independent sky seed 31 #216).
    let t = -1;
    for (let k = 0; k < m; k++) {
      if (blue[k] === 0) continue;
      const blueEnd = Math.min(bins.end[b]!, Math.ceil(lyAlphaJ - start));
      if (t < 0) t = transmission(10 ** ((prepared.g0 + (bins.start[b]! + blueEnd) / 2) * set.step), z);
      vectors[k]![b]! += blue[k]! * t;
    }
    for (const v of vectors) v[b]! /= sw;
  }
  let best = Infinity;
  if (hasContinuum) {
    for (const c of TILTS) best = Math.min(best, fitBins(bins, vectors, m, (x) => 10 ** (c * x)) + (c / TILT_SIGMA) ** 2);
  } else {
    // A line-only template says nothing about the continuum but that it is smooth: one power law.
    const smooth = new Float64Array(nb);
    const all = [...vectors, smooth];
    for (const index of SMOOTH_INDICES) {
      for (let b = 0; b < nb; b++) smooth[b] = 10 ** (index * bins.halfRangeDex * bins.x[b]!);
      best = Math.min(best, fitBins(bins, all, m + 1, () => 1));
    }
  }
  return Math.max(0, best);
}

/** Non-negative least squares of the bin means on m vectors times a factor of x; returns χ². */
function fitBins(bins: ShapeBins, vectors: Float64Array[], m: number, factor: (x: number) => number): number {
  const nb = bins.flux.length;
  gram.fill(0);
  proj.fill(0);
  let chi2Zero = 0;
  for (let b = 0; b < nb; b++) {
    const g = factor(bins.x[b]!);
    const iv = 1 / bins.variance[b]!;
    const f = bins.flux[b]!;
    chi2Zero += iv * f * f;
    for (let p = 0; p < m; p++) {
      const vp = vectors[p]![b]! * g;
      proj[p]! += iv * f * vp;
      for (let q = 0; q <= p; q++) gram[p * m + q]! += iv * vp * vectors[q]![b]! * g;
    }
  }
  for (let p = 0; p < m; p++) for (let q = 0; q < p; q++) gram[q * m + p] = gram[p * m + q]!;
  return chi2Zero - bestAmplitudes(gram, proj, m, amps);
}

function median(values: number[]): number {
  if (values.length === 0) return 0;
  const s = values.slice().sort((a, b) => a - b);
  return s[s.length >> 1]!;
}
