import { calzettiTransmission } from './dust';
import { C_ANGSTROM_PER_S } from './photometry';

/** Where a template came from and how the fit treats it. */
export type TemplateKind = 'lyman-break' | 'low-z' | 'star';
export type PhotoZClass = 'galaxy' | 'star';

/** A uniform ln λ grid in the rest frame: λ_i = exp(lnMin + i·dln) Å. */
export interface RestGrid {
  lnMin: number;
  dln: number;
  n: number;
}

/**
 * The rest-frame grid of the shipped template file: 250 Å (912 Å seen by F435W's blue edge up to
 * z ≈ 12 needs ≈ 280 Å) to 6 µm (IRAC 4.5 µm at z = 0), 0.2 % steps (≈ 0.002 dex: the 4000 Å and
 * Lyman breaks are resolved far below any broad band's width).
 */
export const REST_GRID: RestGrid = { lnMin: Math.log(250), dln: 0.0046, n: Math.ceil(Math.log(60000 / 250) / 0.0046) + 1 };

/** A rest-frame template: f_ν on REST_GRID (arbitrary scale), plus what the fit needs to know. */
export interface RestTemplate {
  id: string;
  kind: TemplateKind;
  class: PhotoZClass;
  /** Rest wavelengths (Å) the real data cover; outside it the values are the stated extension. */
  coverage: [number, number];
  /** One sentence: the data file or formula the template came from. */
  source: string;
  fnu: Float64Array;
}

export const LY_ALPHA_A = 1215.67;
export const LYMAN_LIMIT_A = 911.75;

export function gridWavelengths(grid: RestGrid): Float64Array {
  const w = new Float64Array(grid.n);
  for (let i = 0; i < grid.n; i++) w[i] = Math.exp(grid.lnMin + i * grid.dln);
  return w;
}

/**
 * A Lyman-break galaxy: f_λ ∝ λ^β redward of the Lyman limit, nothing blueward (no ionising
 * escape), plus Lyα emission of rest equivalent width `ewLyaA` as a Gaussian of σ = 3 Å (common
 * practice: the line is unresolved in broad bands, only its flux matters). The IGM is applied later,
 * per redshift, in the observed frame.
 */
export function lymanBreakTemplate(beta: number, ewLyaA: number, grid: RestGrid = REST_GRID): RestTemplate {
  const lam = gridWavelengths(grid);
  const flam = new Float64Array(grid.n);
  const sigma = 3;
  const lineFlux = ewLyaA * Math.pow(LY_ALPHA_A, beta);
  for (let i = 0; i < grid.n; i++) {
    const l = lam[i]!;
    if (l < LYMAN_LIMIT_A) continue;
    flam[i] = Math.pow(l, beta);
    if (ewLyaA > 0) {
      // Mean of the Gaussian over the cell, so a line narrower than a cell keeps its flux.
      const lo = l * Math.exp(-grid.dln / 2);
      const hi = l * Math.exp(grid.dln / 2);
      flam[i] = flam[i]! + (lineFlux * (normalCdf((hi - LY_ALPHA_A) / sigma) - normalCdf((lo - LY_ALPHA_A) / sigma))) / (hi - lo);
    }
  }
  const id = `lbg-beta${beta.toFixed(1)}${ewLyaA > 0 ? `-lya${ewLyaA}` : ''}`;
  return {
    id, kind: 'lyman-break', class: 'galaxy', coverage: [LYMAN_LIMIT_A, lam[grid.n - 1]!],
    source: `power law f_λ ∝ λ^${beta.toFixed(1)} above 912 Å${ewLyaA > 0 ? `, Lyα rest EW ${ewLyaA} Å` : ', no Lyα'}`,
    fnu: toFnu(lam, flam, true),
  };
}

/** How an observed spectrum is continued beyond the wavelengths it covers. */
export interface ExtensionRule {
  /** 'flat-to-lyman-limit': f_λ held at the mean of the first 5 % (in ln λ) down to 912 Å, zero below; 'zero': nothing. */
  blue: 'flat-to-lyman-limit' | 'zero';
  /** 'blackbody': a Planck f_λ whose temperature matches the mean slope of the last 15 % (ln λ); 'rayleigh-jeans': f_λ ∝ λ⁻⁴. Both start at the mean level of the last 2 %. */
  red: 'blackbody' | 'rayleigh-jeans';
}

/**
 * Puts a measured rest-frame spectrum (f_λ, any unit) on the grid: each grid cell inside the data
 * takes the mean of the finite samples in it (linear interpolation where a cell holds none), then
 * the rule continues it outside; returns f_ν normalised to a peak of 1.
 *
 * @param wavelengthA rest wavelengths, Å, increasing
 * @param flambda f_λ (NaN for bad samples)
 */
export function restSedOnGrid(wavelengthA: Float64Array, flambda: Float64Array, rule: ExtensionRule, grid: RestGrid = REST_GRID): { fnu: Float64Array; coverage: [number, number]; blackbodyK?: number } {
  const xs: number[] = [];
  const ys: number[] = [];
  for (let i = 0; i < wavelengthA.length; i++) {
    if (Number.isFinite(flambda[i]!) && Number.isFinite(wavelengthA[i]!) && wavelengthA[i]! > 0) {
      xs.push(wavelengthA[i]!);
      ys.push(flambda[i]!);
    }
  }
  if (xs.length < 10) throw new RangeError(`a template needs at least 10 good samples, got ${xs.length}`);
  const lam = gridWavelengths(grid);
  const flam = new Float64Array(grid.n);
  const first = xs[0]!;
  const last = xs[xs.length - 1]!;
  const sum = new Float64Array(grid.n);
  const count = new Uint32Array(grid.n);
  for (let k = 0; k < xs.length; k++) {
    const i = Math.round((Math.log(xs[k]!) - grid.lnMin) / grid.dln);
    if (i >= 0 && i < grid.n) {
      sum[i]! += ys[k]!;
      count[i]!++;
    }
  }
  let j = 0;
  for (let i = 0; i < grid.n; i++) {
    const l = lam[i]!;
    if (l < first || l > last) continue;
    if (count[i]! > 0) flam[i] = sum[i]! / count[i]!;
    else {
      while (j < xs.length - 2 && xs[j + 1]! < l) j++;
      flam[i] = ys[j]! + ((ys[j + 1]! - ys[j]!) * (l - xs[j]!)) / (xs[j + 1]! - xs[j]!);
    }
  }
  const span = Math.log(last / first);
  const meanIn = (lo: number, hi: number) => {
    let s = 0;
    let n = 0;
    for (let k = 0; k < xs.length; k++) if (xs[k]! >= lo && xs[k]! <= hi) { s += ys[k]!; n++; }
    return s / n;
  };
  if (rule.blue === 'flat-to-lyman-limit') {
    const level = meanIn(first, first * Math.exp(0.05 * span));
    for (let i = 0; i < grid.n; i++) if (lam[i]! < first && lam[i]! >= LYMAN_LIMIT_A) flam[i] = level;
  }
  const endLo = last * Math.exp(-0.02 * span);
  const level = meanIn(endLo, last);
  const joinA = Math.sqrt(endLo * last);
  let blackbodyK: number | undefined;
  let shape: (l: number) => number = (l) => Math.pow(l / joinA, -4);
  if (rule.red === 'blackbody') {
    // Slope of ln f_λ against ln λ over the last 15 %, from the means of its two halves.
    const a = last * Math.exp(-0.15 * span);
    const m = last * Math.exp(-0.075 * span);
    const slope = Math.log(meanIn(m, last) / meanIn(a, m)) / Math.log(Math.sqrt(m * last) / Math.sqrt(a * m));
    blackbodyK = blackbodyTemperatureForSlope(slope, joinA);
    const t = blackbodyK;
    shape = (l) => planckFlambda(l, t) / planckFlambda(joinA, t);
  }
  for (let i = 0; i < grid.n; i++) if (lam[i]! > last) flam[i] = level * shape(lam[i]!);
  return { fnu: toFnu(lam, flam, true), coverage: [first, last], blackbodyK };
}

/** Applies a Calzetti et al. (2000) screen of E_s(B−V) = ebv to a rest-frame f_ν template. */
export function redden(fnu: Float64Array, ebv: number, grid: RestGrid = REST_GRID): Float64Array {
  const lam = gridWavelengths(grid);
  const out = new Float64Array(fnu.length);
  for (let i = 0; i < fnu.length; i++) out[i] = fnu[i]! * calzettiTransmission(lam[i]!, ebv);
  return normalisePeak(out);
}

/** Planck B_λ up to a constant: λ⁻⁵ / (exp(hc/λkT) − 1), λ in Å, T in K. */
export function planckFlambda(wavelengthA: number, temperatureK: number): number {
  const x = HC_OVER_K_ANGSTROM_K / (wavelengthA * temperatureK);
  return Math.pow(wavelengthA, -5) / Math.expm1(x);
}

const HC_OVER_K_ANGSTROM_K = 1.438777e8;

/**
 * The temperature at which a Planck f_λ has logarithmic slope `slope` at λ: d ln B_λ/d ln λ =
 * −5 + x eˣ/(eˣ − 1), x = hc/λkT. Slopes at or below the Rayleigh–Jeans −4 give the coolest
 * allowed temperature; the result is held to 1500…15000 K (common practice: stellar photospheres).
 */
export function blackbodyTemperatureForSlope(slope: number, wavelengthA: number): number {
  const g = (x: number) => -5 + (x * Math.exp(x)) / Math.expm1(x);
  let lo = 1e-4;
  let hi = 60;
  if (slope <= g(lo)) return 1500;
  for (let k = 0; k < 80; k++) {
    const mid = 0.5 * (lo + hi);
    if (g(mid) < slope) lo = mid;
    else hi = mid;
  }
  const t = HC_OVER_K_ANGSTROM_K / (wavelengthA * 0.5 * (lo + hi));
  return Math.min(15000, Math.max(1500, t));
}

function toFnu(lam: Float64Array, flam: Float64Array, normalise: boolean): Float64Array {
  const fnu = new Float64Array(lam.length);
  for (let i = 0; i < lam.length; i++) fnu[i] = Math.max(0, (flam[i]! * lam[i]! * lam[i]!) / C_ANGSTROM_PER_S);
  return normalise ? normalisePeak(fnu) : fnu;
}

function normalisePeak(v: Float64Array): Float64Array {
  let max = 0;
  for (const x of v) if (x > max) max = x;
  if (max > 0) for (let i = 0; i < v.length; i++) v[i] = v[i]! / max;
  return v;
}

/** Standard normal cumulative distribution (Abramowitz & Stegun 7.1.26 erf, |error| < 1.5e-7; from memory). */
function normalCdf(x: number): number {
  const z = Math.abs(x) / Math.SQRT2;
  const t = 1 / (1 + 0.3275911 * z);
  const erf = 1 - (((((1.061405429 * t - 1.453152027) * t) + 1.421413741) * t - 0.284496736) * t + 0.254829592) * t * Math.exp(-z * z);
  return x >= 0 ? 0.5 * (1 + erf) : 0.5 * (1 - erf);
}
