import type { FineGrid } from './fineGrid';
import { FINE_STEP } from './fineGrid';
import { C_KMS, hubble } from './physics';
import type { Random } from './random';
import { REST } from './restLines';

/**
 * Mean effective Lyα optical depth of the forest at absorber redshift z. Becker et al. (2013,
 * MNRAS 430, 2067; from memory) τ_eff = 0.751·((1 + z)/4.5)^2.90 − 0.132 for 2 ≤ z ≤ 5, kept
 * ≥ 0.01 below; above z = 5.5 steepened by e^{0.9(z − 5.5)} so the mean transmission falls to
 * ≈ 2 % at z = 6 and < 0.1 % by 6.5, the order of the measured values (Bosman et al. 2022; from
 * memory, not fitted).
 */
export function meanLyaDepth(z: number): number {
  const becker = Math.max(0.01, 0.751 * ((1 + z) / 4.5) ** 2.9 - 0.132);
  return z > 5.5 ? becker * Math.exp(0.9 * (z - 5.5)) : becker;
}

/**
 * Optical depths of the higher Lyman-series lines relative to Lyα for the same gas, f_n λ_n/(f_α λ_α)
 * (oscillator strengths from memory: 0.4164, 0.07912, 0.02901, 0.01394, 0.007799). Exact for
 * optically thin gas; saturated absorbers make the real ratios larger, so the Lyβ region is, if
 * anything, slightly too transparent here.
 */
const SERIES: Array<[number, number]> = [
  [REST.lyAlpha, 1],
  [REST.lyBeta, 0.160],
  [REST.lyGamma, 0.0557],
  [REST.lyDelta, 0.0262],
  [REST.lyEpsilon, 0.01445],
];

/** Options of one sight line. */
export interface SightLine {
  /** Source redshift. */
  z: number;
  /** Proper radius (Mpc) of a quasar's proximity zone, where its own light thins the forest. */
  proximityMpc?: number;
  /** Transmission left in a Gunn–Peterson trough (absorber z > 5.7), e.g. 0.001. */
  troughFloor?: number;
}

/**
 * Multiplies the fine grid by one stochastic realisation of intergalactic absorption toward a
 * source at z (observed vacuum wavelengths):
 * - Lyα forest as a log-normal optical-depth field τ = τ₀·e^{1.6δ}, δ a unit Gaussian field
 *   smoothed over ≈ 40 km/s (common practice for forest mocks), with τ₀ solved per Δz = 0.1
 *   block so that the block's mean transmission is e^{−τ_eff}, τ_eff = meanLyaDepth × a
 *   log-normal line-of-sight factor (σ = 0.15 dex, 0.3 dex above z = 5: measured scatter grows
 *   toward reionisation; from memory);
 * - Lyβ … Lyε from the same gas (SERIES), so the Lyβ step appears where Lyβ absorption adds in;
 * - the Lyman continuum: Lyman-limit systems drawn as a Poisson process with dN/dz =
 *   1.9((1 + z)/4.7)^1.7 (after Prochaska et al. 2010; from memory), log N_HI uniform in
 *   17.2–19, τ = N σ₀ (λ/912)³ with σ₀ = 6.30·10⁻¹⁸ cm², plus a diffuse forest term
 *   dτ/dz = 0.15((1 + z)/4)^2.5 (λ/912)³ (common practice, not fitted);
 * - for a quasar: a Gunn–Peterson trough above absorber z = 5.7 (transmission floored at
 *   troughFloor) and a proximity zone in which τ grows as (r/R)² up to the quasar's radius R.
 */
export function applyIgm(g: FineGrid, sight: SightLine, random: Random): void {
  const zs = sight.z;
  const n = g.lambda.length;
  // Absorber grid: the fine grid's own steps in log(1 + z_abs) up to the source.
  const xMin = Math.log10(Math.max(1, g.lambda[0]! / REST.lyAlpha));
  const xMax = Math.log10(1 + zs);
  if (xMax <= xMin) return;
  const m = Math.ceil((xMax - xMin) / FINE_STEP) + 1;
  const white = new Float64Array(m);
  for (let i = 0; i < m; i++) white[i] = random.gauss();
  const delta = smooth(white, 40 / (C_KMS * Math.LN10 * FINE_STEP));
  const tau = new Float64Array(m);
  const blockZ = 0.1;
  let start = 0;
  while (start < m) {
    const z0 = 10 ** (xMin + start * FINE_STEP) - 1;
    let end = start;
    while (end < m && 10 ** (xMin + end * FINE_STEP) - 1 < z0 + blockZ) end++;
    const zc = z0 + blockZ / 2;
    const scatter = zc > 5 ? 0.3 : 0.15;
    const target = Math.exp(-meanLyaDepth(zc) * 10 ** (scatter * random.gauss()));
    const t0 = solveTau0(delta, start, end, target);
    for (let i = start; i < end; i++) tau[i] = t0 * Math.exp(1.6 * delta[i]!);
    start = end;
  }
  if (sight.troughFloor !== undefined) {
    const floorTau = -Math.log(sight.troughFloor);
    for (let i = 0; i < m; i++) if (10 ** (xMin + i * FINE_STEP) - 1 > 5.7) tau[i] = Math.max(tau[i]!, floorTau * (0.7 + 0.6 * random.next()));
  }
  if (sight.proximityMpc) {
    const hz = hubble(zs);
    for (let i = 0; i < m; i++) {
      const za = 10 ** (xMin + i * FINE_STEP) - 1;
      const r = (C_KMS * (zs - za)) / ((1 + zs) * hz);
      if (r < sight.proximityMpc) tau[i]! *= (r / sight.proximityMpc) ** 2;
    }
  }
  const tauAt = (zAbs: number) => {
    const x = (Math.log10(1 + zAbs) - xMin) / FINE_STEP;
    const i = Math.round(x);
    return i >= 0 && i < m ? tau[i]! : 0;
  };
  // Lyman-limit systems and the diffuse Lyman-continuum depth, both as functions of absorber z.
  const lls: Array<{ z: number; tau: number }> = [];
  const zLo = Math.max(0, g.lambda[0]! / REST.lyLimit - 1);
  for (let z = zLo; z < zs; z += 0.05) {
    const count = random.poisson(0.05 * 1.9 * ((1 + z) / 4.7) ** 1.7);
    for (let k = 0; k < count; k++) lls.push({ z: z + 0.05 * random.next(), tau: 10 ** random.uniform(17.2, 19) * 6.3e-18 });
  }
  for (let j = 0; j < n; j++) {
    const lam = g.lambda[j]!;
    if (lam >= REST.lyAlpha * (1 + zs)) continue;
    let t = 0;
    for (const [rest, ratio] of SERIES) {
      const za = lam / rest - 1;
      if (za < zs && za > 0) t += ratio * tauAt(za);
    }
    if (lam < REST.lyLimit * (1 + zs)) {
      for (const a of lls) {
        const r = lam / (REST.lyLimit * (1 + a.z));
        if (a.z < zs && r < 1) t += a.tau * r ** 3;
      }
      // Diffuse term: ∫ from the absorber that sees λ at its limit up to the source, coarse steps.
      const zFrom = Math.max(0, lam / REST.lyLimit - 1);
      for (let z = zFrom; z < zs; z += 0.05) t += 0.05 * 0.15 * ((1 + z) / 4) ** 2.5 * (lam / (REST.lyLimit * (1 + z))) ** 3;
    }
    g.flux[j]! *= Math.exp(-t);
  }
}

/** Gaussian smoothing (σ in samples), renormalised to unit variance. */
function smooth(x: Float64Array, sigma: number): Float64Array {
  const half = Math.max(1, Math.ceil(3 * sigma));
  const k = new Float64Array(2 * half + 1);
  for (let i = -half; i <= half; i++) k[i + half] = Math.exp(-0.5 * (i / sigma) ** 2);
  const out = new Float64Array(x.length);
  let s2 = 0;
  for (let i = 0; i < x.length; i++) {
    let v = 0;
    for (let j = -half; j <= half; j++) {
      const t = i + j;
      if (t >= 0 && t < x.length) v += k[j + half]! * x[t]!;
    }
    out[i] = v;
    s2 += v * v;
  }
  const rms = Math.sqrt(s2 / Math.max(1, x.length)) || 1;
  for (let i = 0; i < out.length; i++) out[i]! /= rms;
  return out;
}

/** τ₀ with mean over the block of exp(−τ₀ e^{1.6δ}) equal to `target` (bisection in log τ₀). */
function solveTau0(delta: Float64Array, a: number, b: number, target: number): number {
  let lo = -12;
  let hi = 8;
  for (let it = 0; it < 40; it++) {
    const mid = 0.5 * (lo + hi);
    const t0 = Math.exp(mid);
    let mean = 0;
    for (let i = a; i < b; i++) mean += Math.exp(-t0 * Math.exp(1.6 * delta[i]!));
    mean /= Math.max(1, b - a);
    if (mean > target) lo = mid;
    else hi = mid;
  }
  return Math.exp(0.5 * (lo + hi));
}
