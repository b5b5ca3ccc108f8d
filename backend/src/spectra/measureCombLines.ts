import { LINES, type LineKind, type SpectralLine } from './lineList';
import { C_KMS } from './logGrid';
import { resolutionElement } from './resolutionElement';

/**
 * Measures the comb's lines at a redshift from the data themselves, so a reading records what was
 * seen rather than every marker that falls in range. Thresholds and windows are explained in
 * docs/decisions/readings-lines.md; in short:
 * - emission: flux above a straight continuum fitted to sidebands (inverse-variance weighted),
 *   integrated over ±1.5 FWHM of the line; detected when flux / σ ≥ 3;
 * - absorption lines and molecular bands: equivalent width against the same kind of continuum;
 *   detected when the absorbed EW / σ ≥ 3;
 * - breaks: the mean f_ν redward over the mean f_ν blueward in fixed rest windows; detected when
 *   the step (red − blue) is ≥ 3σ and the ratio ≥ 1.25 (molecular bands also need a mean depth
 *   ≥ 10 % of the continuum). Lyα also gets this measure (its forest
 *   decrement): for a Lyman-break source the break is the evidence for Lyα's position.
 * Lines closer than the effective line width (resolution and intrinsic width in quadrature) are
 * measured once, together, and each member says which others it was blended with.
 */

/** What decides whether a feature is detected. */
export type LineMeasure = 'flux' | 'ew' | 'break';

/** Significance a feature needs to count as detected (3σ, for every measure). */
export const DETECTION_SIGMA = 3;

/** One comb line measured in the data at a redshift. Errors are 1σ; null where not defined. */
export interface LineMeasurement {
  name: string;
  /** Rest vacuum wavelength, Å. */
  rest: number;
  /** Observed vacuum wavelength at the measured z, Å. */
  observed: number;
  kind: LineKind;
  /** Other comb lines measured together with this one (unresolved at this z); empty when alone. */
  blendedWith: string[];
  /** The quantity whose significance decides `detected`. */
  measure: LineMeasure;
  /** False when the data cannot give a measurement (masked, no continuum beside it); `note` says why. */
  measured: boolean;
  note: string | null;
  /** Emission: integrated flux above the continuum, in the file's flux unit × Å. */
  flux: number | null;
  fluxErr: number | null;
  /** Rest-frame equivalent width, Å: positive for emission, negative for absorption. */
  ewRest: number | null;
  ewRestErr: number | null;
  /** Breaks (and Lyα's forest decrement): ⟨f_ν⟩ red / ⟨f_ν⟩ blue; null when the blue side is consistent with zero. */
  breakRatio: number | null;
  breakRatioErr: number | null;
  /** Significance of `measure`: flux/σ, absorbed EW/σ, or the break step (red − blue)/σ. */
  snr: number | null;
  /** Emission: flux-weighted centroid minus the comb's position, km/s; only for detected lines. */
  offsetKms: number | null;
  offsetErrKms: number | null;
  /** Fraction of the line window covered by usable pixels (0–1). */
  coverage: number;
  detected: boolean;
}

export interface MeasureInput {
  /** Vacuum wavelengths, Å, strictly increasing. */
  wavelength: Float64Array;
  flux: Float64Array | Float32Array;
  /** 1/σ², 0 where unknown. */
  ivar: Float64Array | Float32Array;
  /** 1 = bad pixel. */
  mask: Uint8Array;
}

export interface MeasureOptions {
  z: number;
  /** Lines to measure (default the comb's lines). */
  lines?: readonly SpectralLine[];
  /** Intrinsic FWHM of emission and absorption lines, km/s (default 300: a galaxy's lines; use ~4000 for a quasar's broad lines). */
  lineFwhmKms?: number;
  /** Resolution FWHM, km/s (default from the pixel scale, resolutionElement). */
  resolutionFwhmKms?: number;
}

/** Intrinsic FWHM used for a solution of each class, km/s (common practice: narrow lines of galaxies, broad lines of quasars). */
export function lineFwhmForClass(cls: string): number {
  return cls === 'quasar' ? 4000 : 300;
}

/**
 * Rest windows of the breaks, Å: [blue from, blue to, red from, red to]. The 4000 Å break uses the
 * narrow definition's windows, 3850–3950 and 4000–4100 Å in f_ν (Balogh et al. 1999, from memory);
 * the others are our own choice (common practice: windows beside the break that avoid the strong
 * lines next to it).
 */
const BREAK_WINDOWS: Record<string, readonly [number, number, number, number]> = {
  'Lyman limit': [860, 905, 925, 965],
  'Balmer limit': [3525, 3625, 3675, 3715],
  '4000 Å break': [3850, 3950, 4000, 4100],
};
/** Smallest ⟨f_ν⟩ red/blue that counts as a break (our choice: well above the 1.08 of a flat f_λ continuum). */
export const MIN_BREAK_RATIO = 1.25;
/** Smallest mean depth of a molecular band, as a share of the continuum, that counts as detected (our choice). */
export const MIN_BAND_DEPTH = 0.1;
/** Lyα forest decrement: blueward of Lyα (forest) against the continuum redward of it; our own windows. */
const LYA_BREAK_WINDOW = [1100, 1180, 1250, 1350] as const;

/** Sidebands of a line: their width and their gap from the line window, in units of the window's half width. */
const SIDEBAND_GAP = 0.5;
const SIDEBAND_WIDTH = 3;
/** Line windows: ± this many effective FWHM. ±1.5 FWHM holds 99.9 % of a Gaussian line. */
const WINDOW_FWHM = 1.5;
/** The core of a line, ± this many effective FWHM: no pixel in it may be masked. */
const CORE_FWHM = 0.5;
/** A window needs this share of its width on usable pixels to be measured. */
const MIN_COVERAGE = 0.7;

/**
 * Measures every comb line whose observed position falls on the data's range at redshift z. Lines
 * outside the range are not returned. Example (tests/unit/spectra/measure-comb-lines.test.ts): a
 * Gaussian line of flux 50 on a continuum of 10 with σ = 1 per 1 Å pixel comes back with
 * flux ≈ 50 ± 4.4, EW ≈ 5/(1 + z) Å and S/N ≈ 11.
 */
export function measureCombLines(spectrum: MeasureInput, options: MeasureOptions): LineMeasurement[] {
  const { wavelength, flux, ivar, mask } = spectrum;
  const n = wavelength.length;
  if (flux.length !== n || ivar.length !== n || mask.length !== n) throw new RangeError('wavelength, flux, ivar and mask must have the same length.');
  if (!Number.isFinite(options.z) || options.z <= -1) throw new RangeError(`z must be a finite number above −1, not ${options.z}.`);
  if (n < 2) return [];
  const z = options.z;
  const good = new Uint8Array(n);
  let first = -1;
  let last = -1;
  for (let i = 0; i < n; i++) {
    if (mask[i] === 0 && ivar[i]! > 0 && Number.isFinite(flux[i]!)) {
      good[i] = 1;
      if (first < 0) first = i;
      last = i;
    }
  }
  if (first < 0) return [];
  const lo = wavelength[first]!;
  const hi = wavelength[last]!;
  const data: Data = { wavelength, flux, ivar, good, n };
  const resolutionKms = options.resolutionFwhmKms ?? resolutionElement(wavelength).fwhmKms;
  const fwhmKms = Math.hypot(resolutionKms, options.lineFwhmKms ?? 300);
  const lines = (options.lines ?? LINES).filter((l) => {
    const observed = l.rest * (1 + z);
    return observed >= lo && observed <= hi;
  });
  // Cores of the other narrow features, kept out of every sideband.
  const cores = lines.filter((l) => l.kind === 'emission' || l.kind === 'absorption').map((l) => l.rest * (1 + z));
  const out: LineMeasurement[] = [];
  const emission = lines.filter((l) => l.kind === 'emission');
  for (const group of blendGroups(emission, z, fwhmKms)) out.push(...measureEmission(data, group, z, fwhmKms, cores));
  for (const line of lines) {
    if (line.kind === 'absorption' || line.kind === 'band') out.push(measureAbsorption(data, line, z, fwhmKms, cores));
    else if (line.kind === 'break') out.push(measureBreak(data, line, z, BREAK_WINDOWS[line.name]));
  }
  for (const m of out) if (m.name === 'Ly-alpha') addLyaBreak(data, m, z);
  return out.sort((a, b) => a.rest - b.rest);
}

interface Data {
  wavelength: Float64Array;
  flux: Float64Array | Float32Array;
  ivar: Float64Array | Float32Array;
  good: Uint8Array;
  n: number;
}

/** First index with wavelength ≥ x. */
function lowerBound(w: Float64Array, x: number): number {
  let a = 0;
  let b = w.length;
  while (a < b) {
    const m = (a + b) >> 1;
    if (w[m]! < x) a = m + 1;
    else b = m;
  }
  return a;
}

/** Width of pixel i, Å (half the distance between its neighbours). */
function pixelWidth(w: Float64Array, i: number): number {
  const n = w.length;
  if (n < 2) return 1;
  if (i === 0) return w[1]! - w[0]!;
  if (i === n - 1) return w[n - 1]! - w[n - 2]!;
  return (w[i + 1]! - w[i - 1]!) / 2;
}

/** Unresolved runs of emission lines: neighbours closer than one effective FWHM are measured as one. */
function blendGroups(lines: SpectralLine[], z: number, fwhmKms: number): SpectralLine[][] {
  const sorted = lines.slice().sort((a, b) => a.rest - b.rest);
  const groups: SpectralLine[][] = [];
  for (const line of sorted) {
    const group = groups[groups.length - 1];
    const prev = group?.[group.length - 1];
    if (group && prev && (C_KMS * (line.rest - prev.rest)) / prev.rest < fwhmKms) group.push(line);
    else groups.push([line]);
  }
  return groups;
}

interface Continuum {
  /** c(λ) = a + b (λ − centre); covariance of (a, b). */
  a: number;
  b: number;
  centre: number;
  vaa: number;
  vbb: number;
  vab: number;
}

/**
 * Inverse-variance weighted straight line through the usable sideband pixels (a constant when
 * one side has fewer than two pixels). Null when fewer than four pixels remain.
 */
function fitContinuum(d: Data, bands: Array<[number, number]>, centre: number, exclude: number[], excludeHalfWidth: number): Continuum | null {
  let s = 0;
  let sx = 0;
  let sxx = 0;
  let sy = 0;
  let sxy = 0;
  let count = 0;
  const sides = [0, 0];
  bands.forEach(([from, to], side) => {
    for (let i = lowerBound(d.wavelength, from); i < d.n && d.wavelength[i]! <= to; i++) {
      if (!d.good[i]) continue;
      const w = d.wavelength[i]!;
      if (exclude.some((c) => Math.abs(w - c) < excludeHalfWidth)) continue;
      const wt = d.ivar[i]!;
      const x = w - centre;
      s += wt;
      sx += wt * x;
      sxx += wt * x * x;
      sy += wt * d.flux[i]!;
      sxy += wt * x * d.flux[i]!;
      count++;
      sides[side]!++;
    }
  });
  if (count < 4 || s <= 0) return null;
  const det = s * sxx - sx * sx;
  if (bands.length < 2 || sides[0]! < 2 || sides[1]! < 2 || !(det > 0)) {
    // One side only: a constant at the weighted mean.
    return { a: sy / s, b: 0, centre, vaa: 1 / s, vbb: 0, vab: 0 };
  }
  const a = (sxx * sy - sx * sxy) / det;
  const b = (s * sxy - sx * sy) / det;
  return { a: a, b, centre, vaa: sxx / det, vbb: s / det, vab: -sx / det };
}

function base(line: SpectralLine, z: number, measure: LineMeasure): LineMeasurement {
  return {
    name: line.name,
    rest: line.rest,
    observed: line.rest * (1 + z),
    kind: line.kind,
    blendedWith: [],
    measure,
    measured: false,
    note: null,
    flux: null,
    fluxErr: null,
    ewRest: null,
    ewRestErr: null,
    breakRatio: null,
    breakRatioErr: null,
    snr: null,
    offsetKms: null,
    offsetErrKms: null,
    coverage: 0,
    detected: false,
  };
}

/** Share of [from, to] covered by usable pixels (pixels beyond the data count as missing). */
function coverageOf(d: Data, from: number, to: number): number {
  let covered = 0;
  for (let i = lowerBound(d.wavelength, from); i < d.n && d.wavelength[i]! <= to; i++) if (d.good[i]) covered += pixelWidth(d.wavelength, i);
  return Math.min(1, covered / (to - from));
}

function measureEmission(d: Data, group: SpectralLine[], z: number, fwhmKms: number, cores: number[]): LineMeasurement[] {
  const positions = group.map((l) => l.rest * (1 + z));
  const centre = positions.reduce((s, p) => s + p, 0) / positions.length;
  const half = (WINDOW_FWHM * fwhmKms * centre) / C_KMS;
  const others = cores.filter((c) => !positions.includes(c));
  // A resolved neighbour (e.g. [N II] beside Hα) closer than two half windows: each window stops
  // half way, so no flux is counted twice (at the cost of the outer wings of both).
  const left = Math.max(-Infinity, ...others.filter((c) => c < positions[0]!).map((c) => (c + positions[0]!) / 2));
  const right = Math.min(Infinity, ...others.filter((c) => c > positions[positions.length - 1]!).map((c) => (c + positions[positions.length - 1]!) / 2));
  const from = Math.max(positions[0]! - half, left);
  const to = Math.min(positions[positions.length - 1]! + half, right);
  const gap = SIDEBAND_GAP * half;
  const width = SIDEBAND_WIDTH * half;
  const result = measureExcess(d, from, to, centre, [[from - gap - width, from - gap], [to + gap, to + gap + width]], others, half, {
    at: positions,
    half: (CORE_FWHM * fwhmKms * centre) / C_KMS,
  });
  const names = group.map((l) => l.name);
  return group.map((line) => {
    const m = base(line, z, 'flux');
    m.blendedWith = names.filter((x) => x !== line.name);
    m.coverage = result.coverage;
    if (result.note) {
      m.note = result.note;
      return m;
    }
    m.measured = true;
    m.flux = result.flux;
    m.fluxErr = result.fluxErr;
    m.snr = result.flux / result.fluxErr;
    m.detected = m.snr >= DETECTION_SIGMA;
    if (result.continuum > 0 && result.continuum / result.continuumErr >= 1) {
      const ewObs = result.flux / result.continuum;
      const ewErr = Math.hypot(result.fluxErr / result.continuum, (result.flux * result.continuumErr) / result.continuum ** 2);
      m.ewRest = ewObs / (1 + z);
      m.ewRestErr = ewErr / (1 + z);
    }
    // A centroid of noise says nothing: offsets only for detected lines.
    if (m.detected && result.centroid !== null) {
      m.offsetKms = (C_KMS * (result.centroid - centre)) / centre;
      m.offsetErrKms = (C_KMS * result.centroidErr) / centre;
    }
    return m;
  });
}

interface Excess {
  note: string | null;
  coverage: number;
  flux: number;
  fluxErr: number;
  /** Continuum at the centre and its σ. */
  continuum: number;
  continuumErr: number;
  centroid: number | null;
  /** σ of the centroid from the pixels' noise, Å. */
  centroidErr: number;
  /** Σ f Δλ over the window (for equivalent widths of absorption). */
  sumFlux: number;
  sumWidth: number;
  varRatio: number;
  absorbed: number;
}

/** Flux above (or absorbed below) a sideband continuum over [from, to]. */
function measureExcess(
  d: Data,
  from: number,
  to: number,
  centre: number,
  bands: Array<[number, number]>,
  exclude: number[],
  excludeHalf: number,
  core: { at: number[]; half: number },
): Excess {
  const out: Excess = { note: null, coverage: coverageOf(d, from, to), flux: 0, fluxErr: 0, continuum: 0, continuumErr: 0, centroid: null, centroidErr: 0, sumFlux: 0, sumWidth: 0, varRatio: 0, absorbed: 0 };
  // A narrow line carries most of its flux in one or two pixels: with one of them masked, any
  // sum (or interpolation) understates it, so the line is not measured rather than measured low.
  const maskedCore = core.at.some((at) => {
    for (let i = lowerBound(d.wavelength, at - core.half); i < d.n && d.wavelength[i]! <= at + core.half; i++) if (!d.good[i]) return true;
    return false;
  });
  if (maskedCore) {
    out.note = 'a pixel in the core of the line is masked or unusable';
    return out;
  }
  if (out.coverage < MIN_COVERAGE) {
    out.note = `only ${Math.round(out.coverage * 100)} % of the line window is on usable pixels (masked or at the edge of the data)`;
    return out;
  }
  const c = fitContinuum(d, bands, centre, exclude, excludeHalf);
  if (!c) {
    out.note = 'too few usable pixels beside the line to fit a continuum';
    return out;
  }
  let f = 0;
  let varPix = 0;
  let sumW = 0;
  let sumXW = 0;
  let moment = 0;
  let absorbed = 0;
  let varRatio = 0;
  let sumFlux = 0;
  for (let i = lowerBound(d.wavelength, from); i < d.n && d.wavelength[i]! <= to; i++) {
    if (!d.good[i]) continue;
    const w = pixelWidth(d.wavelength, i);
    const x = d.wavelength[i]! - centre;
    const cont = c.a + c.b * x;
    const excess = d.flux[i]! - cont;
    f += excess * w;
    varPix += (w * w) / d.ivar[i]!;
    sumW += w;
    sumXW += x * w;
    moment += d.wavelength[i]! * excess * w;
    sumFlux += d.flux[i]! * w;
    if (cont !== 0) {
      absorbed += (1 - d.flux[i]! / cont) * w;
      varRatio += (w / cont) ** 2 / d.ivar[i]!;
    }
  }
  // The continuum under the window is one fitted line, so its error adds coherently over the window.
  const varCont = sumW * sumW * c.vaa + sumXW * sumXW * c.vbb + 2 * sumW * sumXW * c.vab;
  out.flux = f;
  out.fluxErr = Math.sqrt(varPix + varCont);
  out.continuum = c.a;
  out.continuumErr = Math.sqrt(c.vaa);
  out.centroid = f > 0 ? moment / f : null;
  if (out.centroid !== null) {
    // ∂centroid/∂f_i = (λ_i − centroid) Δλ_i / F.
    let v = 0;
    for (let i = lowerBound(d.wavelength, from); i < d.n && d.wavelength[i]! <= to; i++) {
      if (d.good[i]) v += ((d.wavelength[i]! - out.centroid) * pixelWidth(d.wavelength, i)) ** 2 / d.ivar[i]!;
    }
    out.centroidErr = Math.sqrt(v) / f;
  }
  out.sumFlux = sumFlux;
  out.sumWidth = sumW;
  out.absorbed = absorbed;
  // EW = Σ (1 − f/c) Δλ: its error from the pixels and, through c, from the continuum (∂EW/∂c = Σ f Δλ / c²).
  out.varRatio = c.a !== 0 ? varRatio + (sumFlux / c.a ** 2) ** 2 * c.vaa : Number.POSITIVE_INFINITY;
  return out;
}

/** Window of an absorption line or band, observed Å, and which sides hold its continuum. */
function absorptionWindow(line: SpectralLine, z: number, fwhmKms: number): { from: number; to: number; sides: 'both' | 'blue' | 'red' } {
  const centre = line.rest * (1 + z);
  const pad = (WINDOW_FWHM * fwhmKms * centre) / C_KMS;
  if (line.widthA === undefined) return { from: centre - pad, to: centre + pad, sides: 'both' };
  const w = line.widthA * (1 + z);
  // A band head is sharp: its absorption lies on one side of it, and the continuum on the other.
  if (line.kind === 'band' && line.profile === 'head-red') return { from: centre - pad / 3, to: centre + w, sides: 'blue' };
  if (line.kind === 'band' && line.profile === 'head-violet') return { from: centre - w, to: centre + pad / 3, sides: 'red' };
  return { from: centre - w / 2 - pad / 3, to: centre + w / 2 + pad / 3, sides: 'both' };
}

function measureAbsorption(d: Data, line: SpectralLine, z: number, fwhmKms: number, cores: number[]): LineMeasurement {
  const m = base(line, z, 'ew');
  const { from, to, sides } = absorptionWindow(line, z, fwhmKms);
  const half = (to - from) / 2;
  const gap = SIDEBAND_GAP * Math.min(half, (WINDOW_FWHM * fwhmKms * m.observed) / C_KMS);
  const width = Math.max(SIDEBAND_WIDTH * (WINDOW_FWHM * fwhmKms * m.observed) / C_KMS, half);
  const blue: [number, number] = [from - gap - width, from - gap];
  const red: [number, number] = [to + gap, to + gap + width];
  const bands = sides === 'both' ? [blue, red] : sides === 'blue' ? [blue] : [red];
  const exclude = line.kind === 'band' ? [] : cores.filter((c) => c !== m.observed);
  // Bands are broad: a masked pixel at the head does not hide them, coverage decides.
  const core = line.kind === 'band' ? { at: [], half: 0 } : { at: [m.observed], half: (CORE_FWHM * fwhmKms * m.observed) / C_KMS };
  const r = measureExcess(d, from, to, m.observed, bands, exclude, (WINDOW_FWHM * fwhmKms * m.observed) / C_KMS, core);
  m.coverage = r.coverage;
  if (r.note) {
    m.note = r.note;
    return m;
  }
  if (!(r.continuum > 0) || !Number.isFinite(r.varRatio)) {
    m.note = 'the continuum beside the line is not above zero, so no equivalent width';
    return m;
  }
  const ewErr = Math.sqrt(r.varRatio);
  m.measured = true;
  m.ewRest = -r.absorbed / (1 + z);
  m.ewRestErr = ewErr / (1 + z);
  m.snr = r.absorbed / ewErr;
  // A band spans 50–2000 Å: a slope of the continuum alone can make it significant, so it must also be deep.
  const deepEnough = line.kind !== 'band' || r.absorbed / r.sumWidth >= MIN_BAND_DEPTH;
  m.detected = m.snr >= DETECTION_SIGMA && deepEnough;
  return m;
}

/** Mean f_ν (∝ f_λ λ²) over usable pixels of [from, to], its σ and the covered share. */
function meanFnu(d: Data, from: number, to: number): { mean: number; err: number; coverage: number } {
  let sum = 0;
  let v = 0;
  let k = 0;
  for (let i = lowerBound(d.wavelength, from); i < d.n && d.wavelength[i]! <= to; i++) {
    if (!d.good[i]) continue;
    const l2 = (d.wavelength[i]! / 1e4) ** 2;
    sum += d.flux[i]! * l2;
    v += (l2 * l2) / d.ivar[i]!;
    k++;
  }
  return k === 0 ? { mean: 0, err: Number.POSITIVE_INFINITY, coverage: 0 } : { mean: sum / k, err: Math.sqrt(v) / k, coverage: coverageOf(d, from, to) };
}

interface BreakResult {
  note: string | null;
  coverage: number;
  ratio: number | null;
  ratioErr: number | null;
  step: number;
}

function breakAcross(d: Data, z: number, win: readonly [number, number, number, number]): BreakResult {
  const s = 1 + z;
  const blue = meanFnu(d, win[0] * s, win[1] * s);
  const red = meanFnu(d, win[2] * s, win[3] * s);
  const coverage = Math.min(blue.coverage, red.coverage);
  if (coverage < 0.5) return { note: `only ${Math.round(coverage * 100)} % of a break window is on usable pixels`, coverage, ratio: null, ratioErr: null, step: 0 };
  const step = (red.mean - blue.mean) / Math.hypot(red.err, blue.err);
  // A ratio is only meaningful while the blue side is measured (≥ 2σ); a break into noise is a lower limit, told by its step.
  if (blue.mean / blue.err < 2) return { note: null, coverage, ratio: null, ratioErr: null, step };
  const ratio = red.mean / blue.mean;
  return { note: null, coverage, ratio, ratioErr: ratio * Math.hypot(red.err / red.mean, blue.err / blue.mean), step };
}

function measureBreak(d: Data, line: SpectralLine, z: number, win: readonly [number, number, number, number] | undefined): LineMeasurement {
  const m = base(line, z, 'break');
  const w = win ?? [line.rest - 2 * (line.widthA ?? 50), line.rest - (line.widthA ?? 50) / 2, line.rest + (line.widthA ?? 50) / 2, line.rest + 2 * (line.widthA ?? 50)];
  const r = breakAcross(d, z, w);
  m.coverage = r.coverage;
  if (r.note) {
    m.note = r.note;
    return m;
  }
  m.measured = true;
  m.breakRatio = r.ratio;
  m.breakRatioErr = r.ratioErr;
  m.snr = r.step;
  m.detected = breakDetected(r);
  return m;
}

/**
 * A break is detected when the step is ≥ 3σ and the ratio reaches MIN_BREAK_RATIO (or the blue
 * side is consistent with zero, a lower limit). The ratio condition matters at high S/N: a
 * continuum flat in f_λ already gives a significant f_ν ratio of 1.08 across the 4000 Å windows.
 */
function breakDetected(r: BreakResult): boolean {
  return r.step >= DETECTION_SIGMA && (r.ratio === null || r.ratio >= MIN_BREAK_RATIO);
}

/** Lyα also counts as detected by the forest decrement across it (the Lyman-break evidence). */
function addLyaBreak(d: Data, m: LineMeasurement, z: number): void {
  const r = breakAcross(d, z, LYA_BREAK_WINDOW);
  if (r.note) return;
  m.breakRatio = r.ratio;
  m.breakRatioErr = r.ratioErr;
  if (!m.detected && breakDetected(r)) {
    m.measure = 'break';
    m.snr = r.step;
    m.detected = true;
    m.measured = true;
    m.note = null;
  }
}
