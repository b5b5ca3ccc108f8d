import { bestAmplitudes } from './bestAmplitudes';
import type { BuiltTemplate, TemplateSet } from './buildTemplates';
import { directCorrelator, fftCorrelator, type ShiftCorrelator } from './correlateShifts';
import { zToShift } from './logGrid';
import type { PreparedSpectrum } from './prepareSpectrum';

/** χ² of one template at every integer shift s = sMin … sMax (log10(1+z) = s·step). */
export interface TemplateCurve {
  template: BuiltTemplate;
  sMin: number;
  chi2: Float64Array;
  /** Best non-negative amplitudes per shift, row-major (shift, basis vector of the bin). */
  amplitudes: Float64Array;
  maxBasis: number;
}

/** Data-side vectors of one spectrum, prepared once per scan. */
export interface ScanData {
  prepared: PreparedSpectrum;
  wf: Float64Array;
  w: Float64Array;
  /** Σ w f², the χ² of a zero model. */
  chi2Null: number;
}

export function scanData(prepared: PreparedSpectrum): ScanData {
  const n = prepared.n;
  // χ² is invariant under f → f/k, w → w·k²; choosing k as the typical σ keeps w and w·f near
  // unity, so FFT round-off (relative to the largest values) stays small for both.
  const positive: number[] = [];
  for (let i = 0; i < n; i++) if (prepared.ivar[i]! > 0) positive.push(prepared.ivar[i]!);
  positive.sort((a, b) => a - b);
  const typicalIvar = positive.length ? positive[positive.length >> 1]! : 1;
  const w = new Float64Array(n);
  const wf = new Float64Array(n);
  let chi2Null = 0;
  for (let i = 0; i < n; i++) {
    w[i] = prepared.ivar[i]! / typicalIvar;
    const f = prepared.flux[i]! * Math.sqrt(typicalIvar);
    wf[i] = w[i]! * f;
    chi2Null += wf[i]! * f;
  }
  return { prepared, wf, w, chi2Null };
}

/**
 * Weighted χ²(s) = Σ w (f − Σ_c a_c T_c(s))² minimised over non-negative amplitudes a_c at every
 * shift at once: Σ w f T_c(s) and Σ w T_a T_b (s) are cross-correlations of the data vectors
 * (w f, w) with the template basis and its pairwise products, computed by FFT (or directly, for
 * the benchmark). Returns undefined when the template's z range misses the requested one.
 */
export function scanTemplate(
  data: ScanData,
  set: TemplateSet,
  template: BuiltTemplate,
  zMin: number,
  zMax: number,
  method: 'fft' | 'direct',
): TemplateCurve | undefined {
  const { prepared } = data;
  const step = set.step;
  const sMin = Math.ceil(zToShift(Math.max(zMin, template.zMin), step));
  const sMax = Math.floor(zToShift(Math.min(zMax, template.zMax), step));
  if (sMax < sMin) return undefined;
  const n = prepared.n;
  const lags = sMax - sMin + 1;
  const len = n + lags - 1;
  // Buffer element j holds the template at global rest index g0 − sMax + j, so lag ℓ = sMax − s.
  const start = prepared.g0 - sMax - set.h0;
  const slice = (values: Float64Array) => {
    const out = new Float64Array(len);
    const a = Math.max(0, -start);
    const b = Math.min(len, values.length - start);
    if (b > a) out.set(values.subarray(start + a, start + b), a);
    return out;
  };
  let size = 1;
  while (size < len) size <<= 1;
  const corr: ShiftCorrelator = method === 'fft' ? fftCorrelator(size, set.fftCache) : directCorrelator();
  const dWf = corr.data(data.wf);
  const dW = corr.data(data.w);
  const layout = `${start}|${len}`;
  const usedBasis = [...new Set(template.bins.flatMap((b) => b.basis))];
  const pairKeys = new Set<string>();
  for (const bin of template.bins) {
    for (let p = 0; p < bin.basis.length; p++) for (let q = p; q < bin.basis.length; q++) pairKeys.add(`${bin.basis[p]},${bin.basis[q]}`);
  }
  const slices = new Map<number, Float64Array>();
  const sliceOf = (b: number) => {
    let s = slices.get(b);
    if (!s) {
      s = slice(template.basis[b]!.values);
      slices.set(b, s);
    }
    return s;
  };
  // Every correlation needed, as (data vector, template vector) jobs processed two at a time.
  type Job = { d: unknown; x: () => unknown; store: (c: Float64Array) => void };
  const proj = new Map<number, Float64Array>();
  const gram = new Map<string, Float64Array>();
  const jobs: Job[] = [];
  for (const b of usedBasis) {
    jobs.push({ d: dWf, x: () => corr.template(sliceOf(b), `${template.id}|${b}|${set.instrumentSigmaPx}|${layout}`), store: (c) => proj.set(b, c) });
  }
  for (const key of pairKeys) {
    const [p, q] = key.split(',').map(Number) as [number, number];
    jobs.push({
      d: dW,
      x: () => {
        const cacheKey = `${template.id}|${key}|${set.instrumentSigmaPx}|${layout}`;
        return corr.template(productSlice(sliceOf(p), sliceOf(q)), cacheKey);
      },
      store: (c) => gram.set(key, c),
    });
  }
  // Jobs are paired only with jobs of the same kind (projection with projection, Gram with Gram):
  // a packed pair shares one inverse FFT and therefore its round-off scale.
  const pairs: Array<[Job, Job | undefined]> = [];
  for (const group of [jobs.slice(0, usedBasis.length), jobs.slice(usedBasis.length)]) {
    for (let k = 0; k < group.length; k += 2) pairs.push([group[k]!, group[k + 1]]);
  }
  for (const [j1, j2] of pairs) {
    const [c1, c2] = corr.pair(j1.d, j1.x(), j2?.d, j2?.x(), lags);
    j1.store(c1);
    if (j2 && c2) j2.store(c2);
  }
  const maxBasis = Math.max(...template.bins.map((b) => b.basis.length));
  const chi2 = new Float64Array(lags).fill(data.chi2Null);
  const amplitudes = new Float64Array(lags * maxBasis);
  const a = new Float64Array(9);
  const r = new Float64Array(3);
  const amp = new Float64Array(3);
  for (const bin of template.bins) {
    const lo = Math.max(sMin, Math.ceil(zToShift(bin.zLo, step)));
    const hi = Math.min(sMax, Math.floor(zToShift(bin.zHi, step)));
    const m = bin.basis.length;
    const projs = bin.basis.map((b) => proj.get(b)!);
    const grams: Float64Array[] = [];
    // A component that barely overlaps the data at a shift gives an unstable amplitude, and FFT
    // round-off leaves tiny non-zero Gram entries where it does not overlap at all: such
    // components are left out below a fraction of their best overlap anywhere in the range.
    // The FFT leaves an absolute error of about ε·‖d‖·‖x‖ on every correlation; a component is
    // used at a shift only where that error moves its χ² reduction r²/A by less than 0.01.
    const floors = bin.basis.map((b) => {
      const g = gram.get(`${b},${b}`)!;
      let max = 0;
      for (let l = 0; l < g.length; l++) if (g[l]! > max) max = g[l]!;
      const rNoise = FFT_EPS * norm(data.wf) * norm(sliceOf(b));
      const aNoise = FFT_EPS * norm(data.w) * norm(productSlice(sliceOf(b), sliceOf(b)));
      return Math.max(1e-3 * max, 1e3 * aNoise, 100 * rNoise * rNoise);
    });
    for (let p = 0; p < m; p++) for (let q = 0; q < m; q++) {
      const [x, y] = bin.basis[p]! <= bin.basis[q]! ? [bin.basis[p]!, bin.basis[q]!] : [bin.basis[q]!, bin.basis[p]!];
      grams.push(gram.get(`${x},${y}`)!);
    }
    for (let s = lo; s <= hi; s++) {
      const l = sMax - s;
      for (let p = 0; p < m; p++) r[p] = projs[p]![l]!;
      for (let e = 0; e < m * m; e++) a[e] = grams[e]![l]!;
      for (let p = 0; p < m; p++) {
        // Cauchy–Schwarz: (Σ w f T)² ≤ Σ w T² · Σ w f². A violation is FFT round-off, not signal.
        const app = a[p * m + p]!;
        if (app < floors[p]! || r[p]! * r[p]! > app * data.chi2Null * (1 + 1e-9)) a[p * m + p] = 0;
      }
      const reduction = Math.min(data.chi2Null, bestAmplitudes(a, r, m, amp));
      const idx = s - sMin;
      chi2[idx] = data.chi2Null - reduction;
      for (let p = 0; p < m; p++) amplitudes[idx * maxBasis + p] = amp[p]!;
    }
  }
  return { template, sMin, chi2, amplitudes, maxBasis };
}

/** Relative round-off of double-precision FFT correlations, with margin (≈ 1e-16 · log₂N · 10). */
const FFT_EPS = 2e-14;

function norm(v: Float64Array): number {
  let s = 0;
  for (let i = 0; i < v.length; i++) s += v[i]! * v[i]!;
  return Math.sqrt(s);
}

function productSlice(a: Float64Array, b: Float64Array): Float64Array {
  const out = new Float64Array(a.length);
  for (let i = 0; i < a.length; i++) out[i] = a[i]! * b[i]!;
  return out;
}
