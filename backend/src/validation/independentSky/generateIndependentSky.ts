import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { TemplateClass } from '../../spectra/types';
import { blur, fineGrid, integratePixels, type FineGrid } from './fineGrid';
import { emissionLineGalaxy, postStarburstGalaxy, quiescentGalaxy } from './galaxySources';
import { lymanBreakGalaxy } from './lymanBreakSource';
import { airToVacuum, C_KMS, vacuumToAir } from './physics';
import { quasar } from './quasarSource';
import { createRandom, type Random } from './random';
import { REST } from './restLines';
import { carbonStar, coolDwarf, dwarfSed, INFRARED_DWARFS, OPTICAL_DWARFS } from './starSources';
import { writeSpectrumFile, type FileLayout, type ImageAxis } from './writeSpectrumFile';

/**
 * The independent sky: a second synthetic set that shares no code or data with the engine's
 * templates (nothing from backend/src/spectra but the TemplateClass type, nothing from
 * line-lists/). Each spectrum is drawn from physical shapes of its own (real KC96 and dwarf
 * spectra, our own line lists, quasar outflows, a stochastic IGM), observed through an instrument
 * of random resolution and range, given noise, and written as a FITS image, FITS table, CSV or
 * whitespace table in air or vacuum. Seeded: the same (seed, index) gives the same bytes.
 */

/** Kinds of source drawn, with their share of the sky. */
export type SkyKind = 'quiescent' | 'post-starburst' | 'emission-line' | 'quasar' | 'lyman-break' | 'cool-dwarf' | 'carbon-star';
const KINDS: Array<[SkyKind, TemplateClass, number]> = [
  ['quiescent', 'galaxy', 0.17], ['post-starburst', 'galaxy', 0.07], ['emission-line', 'galaxy', 0.22],
  ['quasar', 'quasar', 0.2], ['lyman-break', 'lyman-break', 0.22], ['cool-dwarf', 'star', 0.08], ['carbon-star', 'star', 0.04],
];

/** What is true about one generated spectrum (kept beside the file as a row of truth.tsv). */
export interface SkyTruth {
  file: string;
  class: TemplateClass;
  kind: SkyKind;
  subclass: string;
  /** Systemic redshift (stars: 0). */
  z: number;
  /** S/N per pixel of the reference window (galaxies, stars: the whole spectrum's median; quasars: redward of Lyα; Lyman-break: rest 1250–1500 Å, else redward of Lyα). */
  snr: number;
  layout: FileLayout;
  medium: 'vacuum' | 'air';
  /** Observed vacuum range, Å, and pixel count. */
  lambdaMin: number;
  lambdaMax: number;
  pixels: number;
  /** Resolving power λ/FWHM of the instrument drawn (the real dwarfs keep their own). */
  resolution: number;
  /** Extra facts of the draw (quasar blueshift km/s, Lyman-break β and Lyα EW). */
  notes: string;
}

export interface SkySpectrum {
  truth: SkyTruth;
  bytes: Uint8Array;
}

/** Bright night-sky lines, air Å (from memory: [O I] 5577, Na D, [O I] 6300/6364 and OH bands). */
const SKY_LINES_AIR = [5577.34, 5889.95, 5895.92, 6300.30, 6363.78, 6863.96, 7316.28, 7340.89, 7794.11, 7821.50, 7913.71, 7993.33, 8344.60, 8399.17, 8430.17, 8827.10, 8885.85, 8919.63, 8943.40, 9375.96, 9439.67, 9872.14];
/** Telluric absorption bands (vacuum Å) where reductions leave extra noise: O₂ B and A, water. */
const TELLURIC: Array<[number, number, number]> = [[6868, 6920, 2], [7595, 7700, 3], [9300, 9650, 2], [11_100, 11_600, 4], [13_500, 14_500, 10], [18_000, 19_500, 10]];

function drawKind(random: Random): [SkyKind, TemplateClass] {
  let u = random.next();
  for (const [kind, cls, share] of KINDS) {
    if ((u -= share) < 0) return [kind, cls];
  }
  return ['quiescent', 'galaxy'];
}

function opticalRange(random: Random): [number, number] {
  if (random.chance(0.1)) {
    const lo = random.uniform(3600, 5000);
    return [lo, lo + random.uniform(2500, 3500)];
  }
  return [random.uniform(3600, 4200), random.uniform(8600, 9800)];
}

interface Plan { kind: SkyKind; cls: TemplateClass; z: number; range: [number, number]; resolution: number; realResolution: boolean; snr: number; dwarf?: string }

function plan(random: Random): Plan {
  const [kind, cls] = drawKind(random);
  // Lyman-break galaxies are faint (70 % at S/N 2–5); the rest reach 5–15 so that the S/N ≥ 10
  // Lyman-break ↔ 4000 Å-break count has Lyman-break sources in it too.
  const snr = kind === 'lyman-break' && random.chance(0.7) ? random.logUniform(2, 5) : kind === 'lyman-break' ? random.logUniform(5, 15) : random.logUniform(2, 20);
  const resolution = random.logUniform(1000, 5000);
  const base = { kind, cls, snr, resolution, realResolution: false };
  switch (kind) {
    case 'quiescent': return { ...base, z: random.uniform(0.02, 1.2), range: opticalRange(random) };
    case 'post-starburst': return { ...base, z: random.uniform(0.05, 1.0), range: opticalRange(random) };
    case 'emission-line': return { ...base, z: random.uniform(0.01, 1.6), range: opticalRange(random) };
    case 'quasar': {
      const z = random.chance(0.7) ? random.uniform(0.15, 4.5) : random.uniform(4.5, 7.0);
      let range: [number, number] = z > 5.7 && random.chance(0.5) ? (random.chance(0.5) ? [9950, 22_000] : [5500, 10_200]) : opticalRange(random);
      // A window that ends short of Lyα holds only the Gunn–Peterson trough: no spectrum anyone
      // would take of a quasar, and the mock's normalisation blew its last light up to ≈ 1e29.
      // Such a window moves to the red arm that holds Lyα (no random draw: the rest stays as drawn).
      if (REST.lyAlpha * (1 + z) > range[1] - 300) range = REST.lyAlpha * (1 + z) < 9900 ? [5500, 10_200] : [9950, 22_000];
      return { ...base, z, range };
    }
    case 'lyman-break': {
      const z = random.uniform(3, 8.5);
      const edge = REST.lyAlpha * (1 + z);
      let range: [number, number];
      if (random.chance(0.3)) range = [Math.max(3600, edge - random.uniform(300, 1200)), edge + random.uniform(800, 2500)];
      else if (edge < 9300) range = opticalRange(random);
      else range = [6500, 13_500];
      // A window that misses the break is no Lyman-break spectrum: move it onto the break.
      if (edge < range[0] + 100 || edge > range[1] - 300) range = [Math.max(3600, edge - 800), edge + 1500];
      return { ...base, z, range };
    }
    case 'cool-dwarf': {
      const file = random.chance(0.7) ? random.pick(OPTICAL_DWARFS) : random.pick(INFRARED_DWARFS);
      const sed = dwarfSed(file);
      const lo = sed.wavelength[0]! * 1.01;
      const hi = sed.wavelength[sed.wavelength.length - 1]! * 0.99;
      const span = hi - lo;
      const a = lo + random.uniform(0, 0.2) * span;
      const b = hi - random.uniform(0, 0.2) * span;
      return { ...base, z: 0, range: [a, b], dwarf: file, realResolution: true, resolution: file.startsWith('Kesseli') ? 2000 : 120 };
    }
    case 'carbon-star': return { ...base, z: 0, range: opticalRange(random) };
  }
}

/** Pixel centres in the written medium, their vacuum equivalents and (for images) the axis. */
function pixelAxis(range: [number, number], resolution: number, medium: 'air' | 'vacuum', layout: FileLayout, random: Random) {
  const toMedium = (v: number) => (medium === 'air' ? vacuumToAir(v) : v);
  const lo = toMedium(range[0]);
  const hi = toMedium(range[1]);
  const perPixel = 1 / (2.5 * resolution); // Δλ/λ: 2.5 pixels per resolution element
  const kind: ImageAxis['kind'] = layout === 'fits-image' ? random.pick(['linear', 'linear', 'wave-log', 'log10'] as const) : random.chance(0.5) ? 'linear' : 'log10';
  let axis: ImageAxis;
  let n: number;
  if (kind === 'linear') {
    const step = Number((perPixel * Math.sqrt(lo * hi)).toPrecision(6));
    n = Math.floor((hi - lo) / step) + 1;
    axis = { kind, start: lo, step };
  } else {
    const dlog = perPixel / Math.LN10;
    n = Math.floor(Math.log10(hi / lo) / dlog) + 1;
    axis = kind === 'log10' ? { kind, start: Math.log10(lo), step: dlog } : { kind, start: lo, step: lo * dlog * Math.LN10 };
  }
  const written = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    written[i] = axis.kind === 'linear' ? axis.start + axis.step * i : axis.kind === 'log10' ? 10 ** (axis.start + axis.step * i) : axis.start * Math.exp((axis.step * i) / axis.start);
  }
  const vacuum = medium === 'air' ? Float64Array.from(written, airToVacuum) : written;
  const edges = new Float64Array(n + 1);
  for (let i = 1; i < n; i++) edges[i] = 0.5 * (vacuum[i - 1]! + vacuum[i]!);
  edges[0] = vacuum[0]! - 0.5 * (vacuum[1]! - vacuum[0]!);
  edges[n] = vacuum[n - 1]! + 0.5 * (vacuum[n - 1]! - vacuum[n - 2]!);
  return { written, vacuum, edges, axis };
}

function skySpectrum(vacuum: Float64Array, resolution: number): Float64Array {
  const sky = new Float64Array(vacuum.length);
  const lines = SKY_LINES_AIR.map(airToVacuum);
  // Beyond 9000 Å the OH forest is dense: a fixed, seeded stand-in (positions not real; common practice for mocks).
  const forest = createRandom(0x5eed);
  for (let lam = 9000; lam < 24_000; lam += forest.uniform(8, 40)) lines.push(lam);
  const strength = lines.map((_, k) => (k < SKY_LINES_AIR.length ? 30 : 5 + 25 * createRandom(k).next()));
  for (let i = 0; i < vacuum.length; i++) {
    const lam = vacuum[i]!;
    let s = 1 + 0.5 * (lam / 6000) ** 2;
    const sigma = lam / (2.355 * resolution);
    for (let k = 0; k < lines.length; k++) {
      const d = (lam - lines[k]!) / sigma;
      if (d > -5 && d < 5) s += strength[k]! * Math.exp(-0.5 * d * d);
    }
    sky[i] = s;
  }
  return sky;
}

function median(values: number[]): number {
  if (values.length === 0) return NaN;
  const v = values.slice().sort((a, b) => a - b);
  return v[v.length >> 1]!;
}

/** Fills the fine grid with the planned source; returns its subclass and notes. */
function drawSource(g: FineGrid, p: Plan, random: Random): { subclass: string; notes: string } {
  switch (p.kind) {
    case 'quiescent': {
      const q = quiescentGalaxy(g, p.z, random);
      // A window past the composite's red end would show flux falling to zero there, as no galaxy
      // does (the KC96 bulge ends at 7550 Å rest; before this, bulges at z < 0.3 ended in a fake
      // cliff that emission-line and quasar templates fitted): the window stops 1 % short of it.
      p.range = [p.range[0], Math.min(p.range[1], 0.99 * q.redEndRest * (1 + p.z))];
      return { subclass: q.subclass, notes: '' };
    }
    case 'post-starburst': return { subclass: postStarburstGalaxy(g, p.z, random), notes: '' };
    case 'emission-line': return { subclass: emissionLineGalaxy(g, p.z, random), notes: '' };
    case 'quasar': {
      const q = quasar(g, p.z, random);
      return { subclass: q.subclass, notes: `civ_blueshift_kms=${q.blueshiftKms.toFixed(0)}` };
    }
    case 'lyman-break': {
      const l = lymanBreakGalaxy(g, p.z, random);
      return { subclass: l.subclass, notes: `beta=${l.beta.toFixed(2)} lya_ew=${l.lyaEw.toFixed(1)}` };
    }
    case 'cool-dwarf': return { subclass: coolDwarf(g, p.dwarf!), notes: p.dwarf! };
    case 'carbon-star': return { subclass: carbonStar(g, random), notes: '' };
  }
}

/** The seed of spectrum `index` in a sky of seed `seed` (each spectrum draws from its own stream). */
function spectrumSeed(seed: number, index: number): number {
  return (Math.imul(seed ^ 0x2545f491, 0x9e3779b1) + Math.imul(index + 1, 0x85ebca77)) >>> 0;
}

/**
 * Spectrum number `index` of the sky with seed `seed`: its file bytes and its truth.
 *
 * @param kind draw this kind instead of a random one (tests)
 */
export function generateSkySpectrum(seed: number, index: number, kind?: SkyKind): SkySpectrum {
  const random = createRandom(spectrumSeed(seed, index));
  let p = plan(random);
  while (kind && p.kind !== kind) p = plan(random);
  const layout = random.pick(['fits-image', 'fits-table', 'csv', 'text'] as const);
  const medium = random.chance(0.4) ? 'air' : 'vacuum';
  const g = fineGrid(p.range[0], p.range[1]);
  const { subclass, notes } = drawSource(g, p, random);
  if (!p.realResolution) blur(g, C_KMS / (2.355 * p.resolution));
  const px = pixelAxis(p.range, p.resolution, medium, layout, random);
  const signal = integratePixels(g, px.edges);
  // S/N reference window and noise level.
  const lyaObs = REST.lyAlpha * (1 + p.z) * 1.01;
  const ref: number[] = [];
  for (let i = 0; i < signal.length; i++) {
    const lam = px.vacuum[i]!;
    const rest = lam / (1 + p.z);
    const inWindow = p.kind === 'lyman-break' ? rest >= 1250 && rest <= 1500 : p.kind === 'quasar' ? lam > lyaObs : true;
    if (inWindow) ref.push(signal[i]!);
  }
  if (ref.length < 20) for (let i = 0; i < signal.length; i++) if (px.vacuum[i]! > lyaObs) ref.push(signal[i]!);
  let level = median(ref);
  if (!(level > 0)) level = median(Array.from(signal, Math.abs)) || 1;
  const scale = 5 / level; // flux in units of 1e-17 erg/s/cm²/Å, continuum ≈ 5
  const sigma0 = 5 / p.snr;
  const sky = skySpectrum(px.vacuum, p.resolution);
  const skyTypical = median(Array.from(sky));
  const flux = new Float64Array(signal.length);
  const error = new Float64Array(signal.length);
  for (let i = 0; i < signal.length; i++) {
    const lam = px.vacuum[i]!;
    let tell = 1;
    for (const [a, b, f] of TELLURIC) if (lam >= a && lam <= b) tell = f;
    const s = sigma0 * Math.sqrt(sky[i]! / skyTypical) * tell;
    // Sky-subtraction residuals: 1 % of the sky line above its continuum, not in the error.
    const residual = 0.01 * sigma0 * (sky[i]! - 1 - 0.5 * (lam / 6000) ** 2) * random.gauss();
    flux[i] = signal[i]! * scale + s * random.gauss() + residual;
    error[i] = s;
  }
  const name = `sky-${String(index).padStart(5, '0')}${layout.startsWith('fits') ? '.fits' : layout === 'csv' ? '.csv' : '.txt'}`;
  const withError = !(layout === 'text' && random.chance(0.15));
  const bytes = writeSpectrumFile({
    wavelength: px.written, flux, error: withError ? error : undefined, sky: layout === 'fits-table' ? Float64Array.from(sky, (v) => v * sigma0 * 4) : undefined,
    medium, axis: px.axis, unit: layout === 'text' && random.chance(0.2) ? 'nm' : 'angstrom', object: name.replace(/\.\w+$/, ''),
  }, layout);
  return {
    bytes,
    truth: {
      file: name, class: p.cls, kind: p.kind, subclass, z: p.z, snr: p.snr, layout, medium,
      lambdaMin: px.vacuum[0]!, lambdaMax: px.vacuum[px.vacuum.length - 1]!, pixels: signal.length, resolution: p.resolution,
      notes: `${notes}${withError ? '' : `${notes ? ' ' : ''}no_error_column`}`,
    },
  };
}

export const TRUTH_COLUMNS = ['file', 'class', 'kind', 'subclass', 'z', 'snr', 'layout', 'medium', 'lambdaMin', 'lambdaMax', 'pixels', 'resolution', 'notes'] as const;

/** One truth.tsv line. */
export function truthLine(t: SkyTruth): string {
  return TRUTH_COLUMNS.map((c) => {
    const v = t[c];
    return typeof v === 'number' ? (c === 'z' ? v.toFixed(6) : c === 'pixels' ? String(v) : v.toFixed(2)) : v;
  }).join('\t');
}

/**
 * Writes `count` spectra of the sky `seed` into `dir` with truth.tsv beside them; returns the truths.
 * `onSpectrum` sees each spectrum as it is written (the accuracy command scans them there).
 */
export function writeIndependentSky(dir: string, count: number, seed: number, onSpectrum?: (s: SkySpectrum, path: string) => void): SkyTruth[] {
  mkdirSync(dir, { recursive: true });
  const truths: SkyTruth[] = [];
  for (let k = 0; k < count; k++) {
    const s = generateSkySpectrum(seed, k);
    const path = join(dir, s.truth.file);
    writeFileSync(path, s.bytes);
    truths.push(s.truth);
    onSpectrum?.(s, path);
  }
  writeFileSync(join(dir, 'truth.tsv'), `${TRUTH_COLUMNS.join('\t')}\n${truths.map(truthLine).join('\n')}\n`);
  return truths;
}
