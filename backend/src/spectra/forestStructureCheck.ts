import { tabulatedTransmission } from './lymanBreakCheck';
import { DEFAULT_IGM_MODEL, type IgmModel } from './igmTransmission';
import type { PreparedSpectrum } from './prepareSpectrum';

/**
 * The Lyα forest is not only darker than the continuum on average (lymanBreakCheck.ts): it is
 * ragged. Between Lyβ and Lyα a source at z ≳ 2 is crossed by hundreds of absorbers, and the flux
 * scatters about its mean far beyond the noise. A smooth stretch of continuum there says that the
 * solution has put Lyα on some other line: a quasar's Mg II read as Lyα at (1 + z)·2.30, its C IV
 * at (1 + z)·1.27, an old galaxy's 4000 Å break read as a Lyman break. The mean-level test cannot
 * see those at z ≈ 2–4, where the forest still lets 50–85 % of the light through.
 *
 * Statistic: in the rest window BLUE (1050–1170 Å) and the forest-free window RED (1270–1450 Å),
 * X = ⟨(f − f̄_local)²·ivar⟩ with f̄_local a running mean over ±0.004 dex (±2800 km/s, longer than
 * forest lines, shorter than the continuum's curvature). Noise alone gives the same X in both;
 * V = (X_blue − X_red) / (⟨f⟩²_blue·⟨ivar⟩_blue) is the blue window's excess variance as a fraction
 * of its mean flux squared. A forest of mean transmission T has V ≳ k·(1 − T)/T: on the tuning
 * seed 31 of the independent sky (89 quasars and Lyman-break sources, T ≥ 0.3, R 1000–5000) the
 * smallest k was 0.042 and the median 0.19, while smooth spectra read at a wrong z gave V ≈ 0.000–
 * 0.001. The floor is k = 0.02, half the smallest seen (chosen on that seed).
 *
 *   χ²_forest = max(0, V_floor − V)² / σ_V²,  V_floor = 0.02·(1 − T)/T
 *
 * with σ_V the noise of V alone: the floor already sits below every forest seen, and with a 10 %
 * allowance on it the term stayed ≤ 100, too weak to move the Mg II/C IV-as-Lyα readings of the
 * tuning seeds.
 *
 * Only where it can be judged: T ≥ 0.3 (z ≲ 4.7; darker forests are the mean-level test's), a blue
 * window with mean S/N ≥ 1 per pixel, ≥ 30 usable pixels in each window, and errors that came with
 * the file (estimated errors follow the local scatter, forest included).
 */
const BLUE_REST: readonly [number, number] = [1050, 1170];
const RED_REST: readonly [number, number] = [1270, 1450];
/** Half width of the running mean, dex. */
const LOCAL_MEAN_DEX = 0.004;
const MIN_PIXELS = 30;
const MIN_TRANSMISSION = 0.3;
const MIN_BLUE_SNR = 1;
/** Forest excess variance floor per unit (1 − T)/T (see the module comment). */
const FLOOR_PER_OPACITY = 0.02;

/** Running-mean prefix sums of one prepared spectrum, built once per scan. */
export interface ForestSums {
  prepared: PreparedSpectrum;
  /** Prefix sums of usable flux and usable-pixel counts. */
  flux: Float64Array;
  count: Float64Array;
  half: number;
}

export function forestSums(prepared: PreparedSpectrum): ForestSums {
  const n = prepared.n;
  const flux = new Float64Array(n + 1);
  const count = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) {
    const ok = prepared.ivar[i]! > 0 && Number.isFinite(prepared.gridFlux[i]!);
    flux[i + 1] = flux[i]! + (ok ? prepared.gridFlux[i]! : 0);
    count[i + 1] = count[i]! + (ok ? 1 : 0);
  }
  return { prepared, flux, count, half: Math.max(3, Math.round(LOCAL_MEAN_DEX / prepared.step)) };
}

interface WindowStat {
  x: number;
  mean: number;
  ivar: number;
  n: number;
}

function windowStat(sums: ForestSums, z: number, rest: readonly [number, number]): WindowStat | undefined {
  const { prepared, half } = sums;
  const at = (restA: number) => Math.round(Math.log10(restA * (1 + z)) / prepared.step) - prepared.g0;
  const i0 = Math.max(half, at(rest[0]));
  const i1 = Math.min(prepared.n - 1 - half, at(rest[1]));
  let sx = 0;
  let sf = 0;
  let sw = 0;
  let n = 0;
  for (let i = i0; i <= i1; i++) {
    const iv = prepared.ivar[i]!;
    const f = prepared.gridFlux[i]!;
    if (!(iv > 0) || !Number.isFinite(f)) continue;
    const k = sums.count[i + half + 1]! - sums.count[i - half]!;
    const local = (sums.flux[i + half + 1]! - sums.flux[i - half]!) / k;
    const d = f - local;
    sx += d * d * iv;
    sf += f;
    sw += iv;
    n++;
  }
  return n >= MIN_PIXELS ? { x: sx / n, mean: sf / n, ivar: sw / n, n } : undefined;
}

/** The forest's measured excess variance at z, its floor and error (undefined where it cannot be judged). */
export function forestStructure(sums: ForestSums, z: number, model: IgmModel = DEFAULT_IGM_MODEL): { v: number; floor: number; sigma: number } | undefined {
  const t = tabulatedTransmission(z, model);
  if (t < MIN_TRANSMISSION) return undefined;
  const blue = windowStat(sums, z, BLUE_REST);
  const red = windowStat(sums, z, RED_REST);
  if (!blue || !red || !(blue.mean > 0) || blue.mean * Math.sqrt(blue.ivar) < MIN_BLUE_SNR) return undefined;
  const scale = blue.mean * blue.mean * blue.ivar;
  return {
    v: (blue.x - red.x) / scale,
    floor: (FLOOR_PER_OPACITY * (1 - t)) / t,
    sigma: (Math.sqrt(2 / blue.n + 2 / red.n) * red.x) / scale,
  };
}

/**
 * χ²_forest of a source with a Lyα forest at z (0 where it cannot be judged or the forest is
 * ragged enough).
 *
 * @example forestChi2(forestSums(prepared), 3.3) // ≈ 80 for a smooth quasar continuum read at z = 3.3
 */
export function forestChi2(sums: ForestSums, z: number, model: IgmModel = DEFAULT_IGM_MODEL): number {
  const s = forestStructure(sums, z, model);
  if (!s || s.v >= s.floor) return 0;
  const shortfall = s.floor - s.v;
  return (shortfall * shortfall) / (s.sigma * s.sigma);
}
