import { DEFAULT_IGM_MODEL, meanIgmTransmission, type IgmModel } from './igmTransmission';
import type { PreparedSpectrum } from './prepareSpectrum';

/**
 * The scan compares continuum-removed data with continuum-removed templates, so a Lyman break
 * reaches the χ² only as a local wiggle: the filtered model cannot say that the sky blueward of
 * Lyα must be nearly dark. A red star or an old galaxy whose flux rises towards the red end of the
 * spectrum then fits a "break" at the edge. This term restores what a reader checks first — is
 * there flux blueward of the break? — from the unfiltered data:
 *
 *   χ²_break(z) = max(0, F_blue − R·T(z)·F_red)² / (σ_blue² + (R·T·σ_red)² + σ_sys²)
 *
 * with F the inverse-variance weighted mean flux in the rest windows BLUE (between Lyβ and Lyα,
 * where only the Lyα forest absorbs) and RED (above Lyα and N V, below C IV), T(z) the mean
 * mean IGM transmission across the blue window (Inoue et al. 2014 by default), R the continuum ratio blue/red of the
 * template's power law, and σ_sys a floor for sightline-to-sightline scatter of the forest and for
 * sky-subtraction and flux-calibration errors. Only an excess of blue flux is penalised: a forest
 * darker than the mean (a damped absorber, a dark patch at z > 6) is allowed.
 */
export interface BreakCheckOptions {
  /** f_λ ∝ λ^slope of the template's continuum (sets R). */
  slope: number;
  /** Mean IGM model for T(z) (default Inoue et al. 2014). */
  igmModel?: IgmModel;
  /** Factor on the term (the scan's misfit scale; default 1). */
  weight?: number;
}

/** Rest windows, Å: the classic Lyα-forest band between Lyβ and Lyα, and a line-poor band red of N V (common practice). */
const BLUE_REST: readonly [number, number] = [1050, 1170];
const RED_REST: readonly [number, number] = [1270, 1450];
/** Fewest usable pixels for a window mean to count. */
const MIN_PIXELS = 10;
/** Scatter of the mean forest transmission between sightlines, as a fraction of T (common practice: ~20 %). */
const FOREST_SCATTER = 0.2;
/** Sky-subtraction and flux-calibration floor, as a fraction of the brighter of the two window means (common practice). */
const CALIBRATION_FLOOR = 0.03;

/** Prefix sums of ivar-weighted flux over the prepared spectrum's grid, for O(1) window means. */
export interface WindowSums {
  g0: number;
  step: number;
  w: Float64Array;
  wf: Float64Array;
  count: Uint32Array;
}

export function windowSums(prepared: PreparedSpectrum): WindowSums {
  const n = prepared.n;
  const w = new Float64Array(n + 1);
  const wf = new Float64Array(n + 1);
  const count = new Uint32Array(n + 1);
  for (let i = 0; i < n; i++) {
    const iv = prepared.ivar[i]!;
    const ok = iv > 0 && Number.isFinite(prepared.gridFlux[i]!);
    w[i + 1] = w[i]! + (ok ? iv : 0);
    wf[i + 1] = wf[i]! + (ok ? iv * prepared.gridFlux[i]! : 0);
    count[i + 1] = count[i]! + (ok ? 1 : 0);
  }
  return { g0: prepared.g0, step: prepared.step, w, wf, count };
}

/** Weighted mean and its variance over the grid pixels [a, b), written to `out`; false when too few pixels. */
function windowMean(sums: WindowSums, a: number, b: number, out: Float64Array): boolean {
  const n = sums.w.length - 1;
  if (a < 0) a = 0;
  if (b > n) b = n;
  if (b - a < MIN_PIXELS || sums.count[b]! - sums.count[a]! < MIN_PIXELS) return false;
  const sw = sums.w[b]! - sums.w[a]!;
  if (!(sw > 0)) return false;
  out[0] = (sums.wf[b]! - sums.wf[a]!) / sw;
  out[1] = 1 / sw;
  return true;
}

/** Mean transmission across the blue window for a source at z (exact, 12 samples). */
export function blueTransmission(z: number, model: IgmModel = DEFAULT_IGM_MODEL): number {
  let t = 0;
  const samples = 12;
  for (let k = 0; k < samples; k++) {
    const rest = BLUE_REST[0] + ((k + 0.5) / samples) * (BLUE_REST[1] - BLUE_REST[0]);
    t += meanIgmTransmission(rest * (1 + z), z, model);
  }
  return t / samples;
}

/** blueTransmission tabulated every 0.01 in z up to 12 (smooth in z; linear interpolation is exact to < 1e-4), per model on first use. */
const T_STEP = 0.01;
const tTables = new Map<IgmModel, Float64Array>();

export function tabulatedTransmission(z: number, model: IgmModel): number {
  let table = tTables.get(model);
  if (!table) {
    table = Float64Array.from({ length: Math.round(12 / T_STEP) + 2 }, (_, k) => blueTransmission(k * T_STEP, model));
    tTables.set(model, table);
  }
  const x = Math.min(Math.max(z, 0), 12) / T_STEP;
  const k = Math.floor(x);
  const f = x - k;
  return table[k]! * (1 - f) + table[k + 1]! * f;
}

/** The transmission per integer shift of a grid step, filled once per (step, model) (shifts up to z = 12). */
const byShift = new Map<string, Float64Array>();

function transmissionTable(step: number, model: IgmModel): Float64Array {
  const key = `${step}|${model}`;
  let table = byShift.get(key);
  if (!table) {
    table = Float64Array.from({ length: Math.ceil(Math.log10(13) / step) + 1 }, (_, k) => tabulatedTransmission(10 ** (k * step) - 1, model));
    byShift.set(key, table);
  }
  return table;
}

const blueOut = new Float64Array(2);
const redOut = new Float64Array(2);

/**
 * χ²_break at the integer grid shift s (log10(1+z) = s·step; see the module comment); 0 when the
 * blue window is not covered. Window edges are rest-window grid positions plus s, so no logarithm
 * is taken per shift.
 */
function breakChi2AtShift(sums: WindowSums, s: number, ratio: number, edges: WindowEdges, transmission: Float64Array): number {
  const base = s - sums.g0;
  if (!windowMean(sums, Math.ceil(edges.blueLo + base), Math.floor(edges.blueHi + base) + 1, blueOut)) return 0;
  const hasRed = windowMean(sums, Math.ceil(edges.redLo + base), Math.floor(edges.redHi + base) + 1, redOut);
  const t = transmission[Math.min(Math.max(s, 0), transmission.length - 1)]!;
  const blueMean = blueOut[0]!;
  // Without the red window only the blue level is known: the break still says it must be near zero.
  const redMean = hasRed ? Math.max(0, redOut[0]!) : 0;
  const expected = ratio * t * redMean;
  const excess = blueMean - expected;
  if (!(excess > 0)) return 0;
  const redVariance = hasRed ? (ratio * t) ** 2 * redOut[1]! : 0;
  // The calibration floor scales with the brighter side, so it does not vanish (and the term does
  // not jump) where the red window runs off the data.
  const level = Math.max(redMean, Math.abs(blueMean));
  const variance = blueOut[1]! + redVariance + (FOREST_SCATTER * expected) ** 2 + (CALIBRATION_FLOOR * level) ** 2;
  return (excess * excess) / variance;
}

/** Rest-window edges as fractional grid positions (log10 λ / step): add the shift to place them. */
interface WindowEdges {
  blueLo: number;
  blueHi: number;
  redLo: number;
  redHi: number;
}

function windowEdges(step: number): WindowEdges {
  return {
    blueLo: Math.log10(BLUE_REST[0]) / step,
    blueHi: Math.log10(BLUE_REST[1]) / step,
    redLo: Math.log10(RED_REST[0]) / step,
    redHi: Math.log10(RED_REST[1]) / step,
  };
}

function continuumRatio(options: BreakCheckOptions): number {
  return Math.pow((BLUE_REST[0] + BLUE_REST[1]) / (RED_REST[0] + RED_REST[1]), options.slope);
}

/**
 * χ²_break at one redshift, at the nearest grid shift.
 *
 * @example breakChi2(sums, 6.6, { slope: -2 }) // large for a spectrum with flux at 8000–9000 Å
 */
export function breakChi2(sums: WindowSums, z: number, options: BreakCheckOptions): number {
  return breakChi2AtShift(sums, Math.round(Math.log10(1 + z) / sums.step), continuumRatio(options), windowEdges(sums.step), transmissionTable(sums.step, options.igmModel ?? DEFAULT_IGM_MODEL));
}

/** Adds χ²_break to a template's χ²(s) curve (shifts sMin …) in place. */
export function addBreakChi2(chi2: Float64Array, sMin: number, sums: WindowSums, options: BreakCheckOptions): void {
  const ratio = continuumRatio(options);
  const edges = windowEdges(sums.step);
  const transmission = transmissionTable(sums.step, options.igmModel ?? DEFAULT_IGM_MODEL);
  const weight = options.weight ?? 1;
  for (let i = 0; i < chi2.length; i++) chi2[i]! += weight * breakChi2AtShift(sums, sMin + i, ratio, edges, transmission);
}
