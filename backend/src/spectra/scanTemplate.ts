import { bestAmplitudes, MAX_COMPONENTS } from './bestAmplitudes';
import type { BuiltTemplate, TemplateSet } from './buildTemplates';
import { directCorrelator, fftCorrelator, type LagWindow, type ShiftCorrelator } from './correlateShifts';
import { zToShift } from './logGrid';
import type { PreparedSpectrum } from './prepareSpectrum';

/** χ² of one template at every integer shift s = sMin … sMin + chi2.length − 1 (log10(1+z) = s·step). */
export interface TemplateCurve {
  template: BuiltTemplate;
  sMin: number;
  chi2: Float64Array;
  /** Best non-negative amplitudes per shift, row-major (shift, basis vector of the bin). */
  amplitudes: Float64Array;
  maxBasis: number;
}

/**
 * Data windows start on multiples of this many grid pixels. Every spectrum is a window on the one
 * global log-λ grid; aligning the window's start makes the template buffers (and their FFTs) depend
 * only on the aligned start, the shift range and the transform size, so spectra of one instrument —
 * whose first pixels differ by a few pixels — share them.
 */
const ALIGN = 512;

/** Data-side vectors of one spectrum, prepared once per scan. */
export interface ScanData {
  prepared: PreparedSpectrum;
  /** Global grid index of buffer element 0 (a multiple of ALIGN, ≤ the first data pixel). */
  origin: number;
  /** Buffer length that holds the data (first pixel at origin + offset). */
  span: number;
  offset: number;
  wf: Float64Array;
  w: Float64Array;
  /** Σ w f², the χ² of a zero model. */
  chi2Null: number;
  /** Factor the flux was multiplied by (√ of the median positive ivar): amplitudes are in these units. */
  fluxScale: number;
  normWf: number;
  normW: number;
  /** Padded data buffers (or their FFTs) per transform size and method. */
  buffers: Map<string, { wf: Float64Array; w: Float64Array }>;
}

export function scanData(prepared: PreparedSpectrum): ScanData {
  const n = prepared.n;
  // χ² is invariant under f → f/k, w → w·k²; choosing k as the typical σ keeps w and w·f near
  // unity, so FFT round-off (relative to the largest values) stays small for both.
  const positiveValues: number[] = [];
  for (let i = 0; i < n; i++) if (prepared.ivar[i]! > 0) positiveValues.push(prepared.ivar[i]!);
  const positive = Float64Array.from(positiveValues).sort();
  const typicalIvar = positive.length ? positive[positive.length >> 1]! : 1;
  const w = new Float64Array(n);
  const wf = new Float64Array(n);
  let chi2Null = 0;
  const taper = edgeTaper(prepared);
  for (let i = 0; i < n; i++) {
    w[i] = (prepared.ivar[i]! / typicalIvar) * taper(i);
    const f = prepared.flux[i]! * Math.sqrt(typicalIvar);
    wf[i] = w[i]! * f;
    chi2Null += wf[i]! * f;
  }
  const origin = Math.floor(prepared.g0 / ALIGN) * ALIGN;
  const offset = prepared.g0 - origin;
  return { prepared, origin, offset, span: offset + n, wf, w, chi2Null, fluxScale: Math.sqrt(typicalIvar), normWf: norm(wf), normW: norm(w), buffers: new Map() };
}

/** Weight at the first and last usable pixel, rising linearly to 1 half a filter width inside. */
export const EDGE_WEIGHT = 0.3;

/**
 * Within half a continuum-filter width of the data's ends the running mean sees only one side, while
 * a template is filtered with both: residuals there are partly filter artefacts (a rising red end
 * becomes a bump that an A-star Balmer jump at z ≈ 1 or a line just past the edge will "explain").
 * Their weights are tapered from EDGE_WEIGHT at the ends to 1 half a width inside, rather than
 * dropped: a Lyman break at the red end of a spectrum must still count. 0.3 was chosen on the
 * real-spectra set (0–0.3 give the same tables; it brought the KC96 bulge to z = 0).
 */
export function edgeTaper(prepared: PreparedSpectrum): (i: number) => number {
  const n = prepared.n;
  let first = 0;
  while (first < n && !(prepared.ivar[first]! > 0)) first++;
  let last = n - 1;
  while (last > first && !(prepared.ivar[last]! > 0)) last--;
  const half = prepared.continuumWidthPx / 2;
  return (i) => Math.min(1, EDGE_WEIGHT + ((1 - EDGE_WEIGHT) * Math.max(0, Math.min(i - first, last - i))) / half);
}

function dataBuffers(data: ScanData, corr: ShiftCorrelator): { wf: Float64Array; w: Float64Array } {
  const key = `${corr.method}|${corr.size}`;
  let b = data.buffers.get(key);
  if (!b) {
    const pad = (v: Float64Array) => {
      const out = new Float64Array(corr.size);
      out.set(v, data.offset);
      return corr.prepare(out);
    };
    b = { wf: pad(data.wf), w: pad(data.w) };
    data.buffers.set(key, b);
  }
  return b;
}

/** A template buffer ready for correlation, with its Euclidean norm (for the round-off bound). */
interface PreparedVector {
  spectrum: Float64Array;
  norm: number;
}

/**
 * Template buffers by (set, template, vector, window origin, top shift, size): bounded by bytes, the
 * least recently used are dropped first.
 */
const vectorCache = new Map<string, PreparedVector>();
let vectorCacheBytes = 0;
const VECTOR_CACHE_BYTES = 192 * 1024 * 1024;

function templateVector(set: TemplateSet, template: BuiltTemplate, vector: string, values: () => Float64Array, origin: number, top: number, corr: ShiftCorrelator): PreparedVector {
  const key = `${set.key}|${template.id}|${vector}|${origin}|${top}|${corr.method}|${corr.size}`;
  const hit = vectorCache.get(key);
  if (hit) {
    vectorCache.delete(key);
    vectorCache.set(key, hit);
    return hit;
  }
  // Buffer element j holds the rest-frame template at global index origin − top + j, so the
  // correlation lag ℓ = top − s gives the model at shift s under data buffer element i.
  const full = values();
  const buffer = new Float64Array(corr.size);
  const start = origin - top - set.h0;
  const a = Math.max(0, -start);
  const b = Math.min(corr.size, full.length - start);
  if (b > a) buffer.set(full.subarray(start + a, start + b), a);
  const prepared: PreparedVector = { spectrum: corr.prepare(buffer), norm: norm(buffer) };
  if (corr.method === 'fft') {
    vectorCache.set(key, prepared);
    vectorCacheBytes += prepared.spectrum.byteLength;
    for (const [k, v] of vectorCache) {
      if (vectorCacheBytes <= VECTOR_CACHE_BYTES) break;
      vectorCache.delete(k);
      vectorCacheBytes -= v.spectrum.byteLength;
    }
  }
  return prepared;
}

/** One correlation to compute: data vector against a prepared template vector. */
interface Job {
  data: 'wf' | 'w';
  vector: PreparedVector;
  window: LagWindow;
  corr: ShiftCorrelator;
  /** Highest shift of the window: out[hi − s] is the correlation at shift s. */
  hi: number;
  out?: Float64Array;
}

/** Bins with at most this many shifts are correlated directly even on the FFT path. */
const DIRECT_BELOW = 48;

/** What one template needs computed, and where its χ² goes. */
interface TemplatePlan {
  template: BuiltTemplate;
  sMin: number;
  lags: number;
  maxBasis: number;
  bins: Array<{ lo: number; hi: number; m: number; proj: Job[]; gram: Job[] }>;
}

/** A template and the redshift range to scan it over. */
export interface TemplateRequest {
  template: BuiltTemplate;
  zMin: number;
  zMax: number;
}

/**
 * Weighted χ²(s) = Σ w (f − Σ_c a_c T_c(s))² minimised over non-negative amplitudes a_c at every
 * shift at once, for several templates: Σ w f T_c(s) and Σ w T_a T_b (s) are cross-correlations
 * of the data vectors (w f, w) with the template basis and its pairwise products, computed by FFT
 * (or directly, for the benchmark). Each redshift bin of a template is correlated only over its
 * own shifts, and correlations of all templates are packed two per inverse transform. Templates
 * whose z range misses the requested one give no curve.
 */
export function scanTemplates(data: ScanData, set: TemplateSet, requests: TemplateRequest[], method: 'fft' | 'direct'): TemplateCurve[] {
  const plans: TemplatePlan[] = [];
  for (const req of requests) {
    const plan = planTemplate(data, set, req, method);
    if (plan) plans.push(plan);
  }
  runJobs(data, [...new Set(plans.flatMap((p) => p.bins.flatMap((b) => [...b.proj, ...b.gram])))].filter((j) => j.vector !== ZERO_VECTOR));
  return plans.map((p) => finishTemplate(data, p));
}

/** One template alone (see scanTemplates). */
export function scanTemplate(data: ScanData, set: TemplateSet, template: BuiltTemplate, zMin: number, zMax: number, method: 'fft' | 'direct'): TemplateCurve | undefined {
  return scanTemplates(data, set, [{ template, zMin, zMax }], method)[0];
}

function planTemplate(data: ScanData, set: TemplateSet, req: TemplateRequest, method: 'fft' | 'direct'): TemplatePlan | undefined {
  const { template } = req;
  const step = set.step;
  const sMin = Math.ceil(zToShift(Math.max(req.zMin, template.zMin), step));
  const sMax = Math.floor(zToShift(Math.min(req.zMax, template.zMax), step));
  if (sMax < sMin) return undefined;
  // The shifts each bin covers inside the requested range.
  const ranges = template.bins.map((bin) => ({
    bin,
    lo: Math.max(sMin, Math.ceil(zToShift(bin.zLo, step))),
    hi: Math.min(sMax, Math.floor(zToShift(bin.zHi, step))),
  })).filter((r) => r.hi >= r.lo);
  // A vector several bins use (a component fitted at every z, beside one fitted only at low z) is
  // correlated once over the union of their shifts rather than once per bin.
  const spans = new Map<string, { lo: number; hi: number; zHi: number }>();
  const need = (key: string, r: (typeof ranges)[number]) => {
    const u = spans.get(key);
    if (u) {
      u.lo = Math.min(u.lo, r.lo);
      u.hi = Math.max(u.hi, r.hi);
      u.zHi = Math.max(u.zHi, r.bin.zHi);
    } else spans.set(key, { lo: r.lo, hi: r.hi, zHi: r.bin.zHi });
  };
  const productKey = (p: number, q: number) => (p <= q ? `p${p},${q}` : `p${q},${p}`);
  for (const r of ranges) {
    for (const b of r.bin.basis) need(`b${b}`, r);
    for (const p of r.bin.basis) for (const q of r.bin.basis) if (p <= q) need(productKey(p, q), r);
  }
  const jobs = new Map<string, Job>();
  const jobFor = (key: string, kind: 'wf' | 'w', values: () => Float64Array, zero: boolean): Job => {
    let job = jobs.get(key);
    if (job) return job;
    const { lo, hi, zHi } = spans.get(key)!;
    // The buffer's top shift is the upper shift of the bins' z range rounded up, so it does not
    // depend on the range a caller asked for; lags ℓ = top − s then run from top − hi to top − lo.
    const top = Math.ceil(zToShift(zHi, step) / ALIGN) * ALIGN;
    const window = { l0: top - hi, count: hi - lo + 1 };
    let size = 1;
    while (size < data.span + top - lo) size <<= 1;
    // A handful of shifts (stars near z = 0) is cheaper by the direct sum than by a transform.
    const corr = method === 'fft' && window.count > DIRECT_BELOW ? fftCorrelator(size) : directCorrelator(size);
    job = zero
      ? { data: kind, vector: ZERO_VECTOR, window, corr, hi, out: new Float64Array(window.count) }
      : { data: kind, vector: templateVector(set, template, key, values, data.origin, top, corr), window, corr, hi };
    jobs.set(key, job);
    return job;
  };
  const bins: TemplatePlan['bins'] = [];
  for (const { bin, lo, hi } of ranges) {
    const m = bin.basis.length;
    const proj = bin.basis.map((b) => jobFor(`b${b}`, 'wf', () => template.basis[b]!.values, false));
    const gram: Job[] = [];
    for (let p = 0; p < m; p++) for (let q = 0; q < m; q++) {
      const x = Math.min(bin.basis[p]!, bin.basis[q]!);
      const y = Math.max(bin.basis[p]!, bin.basis[q]!);
      // Components with disjoint supports (line groups far apart in wavelength) have an exactly
      // zero product: their Gram entry is 0 at every shift and needs no correlation.
      const zero = x !== y && isZero(basisProduct(set, template, x, y));
      gram.push(jobFor(productKey(x, y), 'w', () => basisProduct(set, template, x, y), zero));
    }
    bins.push({ lo, hi, m, proj, gram });
  }
  return { template, sMin, lags: sMax - sMin + 1, maxBasis: Math.max(...template.bins.map((b) => b.basis.length)), bins };
}

/**
 * Runs correlation jobs, two per inverse transform. A job is packed only with one of the same kind
 * (projection with projection, Gram with Gram) and transform size: a packed pair shares one
 * inverse FFT and therefore its round-off scale.
 */
function runJobs(data: ScanData, jobs: Job[]): void {
  // The correlations live only until finishTemplate has read them: one reused arena instead of a
  // new array per correlation (≈ 25 MB per scan of every template over 0 ≤ z ≤ 9, which kept the
  // garbage collector at ≈ 8 % of the scan's time).
  let total = 0;
  for (const j of jobs) total += j.window.count;
  if (outputArena.length < total) outputArena = new Float64Array(Math.ceil(total * 1.25));
  let used = 0;
  const slot = (j: Job) => {
    const view = outputArena.subarray(used, used + j.window.count);
    used += j.window.count;
    return view;
  };
  const groups = new Map<ShiftCorrelator, Map<'wf' | 'w', Job[]>>();
  for (const j of jobs) {
    let byKind = groups.get(j.corr);
    if (!byKind) groups.set(j.corr, (byKind = new Map()));
    const list = byKind.get(j.data);
    if (list) list.push(j);
    else byKind.set(j.data, [j]);
  }
  for (const [corr, byKind] of groups) {
    const d = dataBuffers(data, corr);
    for (const [kind, list] of byKind) {
      for (let k = 0; k < list.length; k += 2) {
        const j1 = list[k]!;
        const j2 = list[k + 1];
        const [c1, c2] = corr.pair(d[kind], j1.vector.spectrum, j1.window, j2 && d[kind], j2?.vector.spectrum, j2?.window, slot(j1), j2 && slot(j2));
        j1.out = c1;
        if (j2) j2.out = c2;
      }
    }
  }
}

/** Backing store of runJobs' correlation outputs, grown on demand and reused by every scan of the thread. */
let outputArena = new Float64Array(0);

const scratchA = new Float64Array(MAX_COMPONENTS * MAX_COMPONENTS);
const scratchR = new Float64Array(MAX_COMPONENTS);
const scratchAmp = new Float64Array(MAX_COMPONENTS);

function finishTemplate(data: ScanData, plan: TemplatePlan): TemplateCurve {
  const { sMin, lags, maxBasis, template } = plan;
  const chi2 = new Float64Array(lags).fill(data.chi2Null);
  const amplitudes = new Float64Array(lags * maxBasis);
  const a = scratchA;
  const r = scratchR;
  const amp = scratchAmp;
  for (const { lo, hi, proj, gram, m } of plan.bins) {
    // Views of each correlation over this bin's shifts: element hi − s is shift s.
    const view = (j: Job) => j.out!.subarray(j.hi - hi, j.hi - lo + 1);
    const projs = proj.map(view);
    const grams = gram.map(view);
    // A component that barely overlaps the data at a shift gives an unstable amplitude, and FFT
    // round-off leaves tiny non-zero Gram entries where it does not overlap at all: such
    // components are left out below a fraction of their best overlap anywhere in the range.
    // The FFT leaves an absolute error of about ε·‖d‖·‖x‖ on every correlation; a component is
    // used at a shift only where that error moves its χ² reduction r²/A by less than 0.01.
    const floors = proj.map((pj, p) => {
      const g = grams[p * m + p]!;
      let max = 0;
      for (let l = 0; l < g.length; l++) if (g[l]! > max) max = g[l]!;
      const rNoise = FFT_EPS * data.normWf * pj.vector.norm;
      const aNoise = FFT_EPS * data.normW * gram[p * m + p]!.vector.norm;
      return Math.max(1e-3 * max, 1e3 * aNoise, 100 * rNoise * rNoise);
    });
    const cap = data.chi2Null * (1 + 1e-9);
    for (let s = lo; s <= hi; s++) {
      const l = hi - s;
      const idx = s - sMin;
      let reduction: number;
      if (m === 1) {
        const rv = projs[0]![l]!;
        const av = grams[0]![l]!;
        // Cauchy–Schwarz: (Σ w f T)² ≤ Σ w T² · Σ w f². A violation is FFT round-off, not signal.
        const usable = av >= floors[0]! && rv > 0 && rv * rv <= av * cap;
        const a0 = usable ? rv / av : 0;
        reduction = usable ? rv * a0 : 0;
        amplitudes[idx * maxBasis] = a0;
      } else {
        for (let p = 0; p < m; p++) r[p] = projs[p]![l]!;
        for (let e = 0; e < m * m; e++) a[e] = grams[e]![l]!;
        for (let p = 0; p < m; p++) {
          const app = a[p * m + p]!;
          if (app < floors[p]! || r[p]! * r[p]! > app * cap) a[p * m + p] = 0;
        }
        reduction = bestAmplitudes(a, r, m, amp);
        for (let p = 0; p < m; p++) amplitudes[idx * maxBasis + p] = amp[p]!;
      }
      chi2[idx] = data.chi2Null - Math.min(data.chi2Null, reduction);
    }
  }
  return { template, sMin, chi2, amplitudes, maxBasis };
}

/** Product of two basis vectors of a template on the full rest grid, memoised in the set. */
function basisProduct(set: TemplateSet, template: BuiltTemplate, p: number, q: number): Float64Array {
  const key = `${template.id}|${p},${q}`;
  let v = set.products.get(key);
  if (!v) {
    const a = template.basis[p]!.values;
    const b = template.basis[q]!.values;
    v = new Float64Array(a.length);
    for (let i = 0; i < a.length; i++) v[i] = a[i]! * b[i]!;
    set.products.set(key, v);
  }
  return v;
}

/** Stands for a template vector that is zero everywhere (its correlation is zero, not computed). */
const ZERO_VECTOR: PreparedVector = { spectrum: new Float64Array(0), norm: 0 };

const zeroProducts = new WeakMap<Float64Array, boolean>();

function isZero(v: Float64Array): boolean {
  let known = zeroProducts.get(v);
  if (known === undefined) {
    known = v.every((x) => x === 0);
    zeroProducts.set(v, known);
  }
  return known;
}

/** Relative round-off of double-precision FFT correlations, with margin (≈ 1e-16 · log₂N · 10). */
const FFT_EPS = 2e-14;

function norm(v: Float64Array): number {
  let s = 0;
  for (let i = 0; i < v.length; i++) s += v[i]! * v[i]!;
  return Math.sqrt(s);
}
