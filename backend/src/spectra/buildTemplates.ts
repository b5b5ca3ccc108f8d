import { MAX_COMPONENTS } from './bestAmplitudes';
import { highPass } from './highPass';
import { DEFAULT_IGM_MODEL, meanIgmTransmission, type IgmModel } from './igmTransmission';
import { TEMPLATE_LINES, type SpectralLine } from './lineList';
import { C_KMS } from './logGrid';
import { ENGINE_RECIPES, type ComponentRecipe, type ContinuumRecipe, type ProximityZone, type TemplateRecipe } from './templateRecipes';
import type { TemplateClass } from './types';

/** Rest-frame range every template covers, Å: wide enough for 0 ≤ z ≤ 9 on optical–K-band data. */
const REST_MIN_A = 300;
const REST_MAX_A = 32000;
const LY_ALPHA = 1215.67;
/**
 * Redshift bins inside which the mean IGM transmission is evaluated at one z (the bin centre). Each
 * bin is one more set of correlations, so bins above z = 2.2 are two units of z wide: at their
 * edges the template's forest is off by ≤ 0.15 in transmission (z = 2.2 vs the centre 3.1), and
 * the exact transmission enters through the break-consistency term (lymanBreakCheck.ts). Halving
 * the bins (from 1-wide) cost nothing in the real-spectra or accuracy tables and ≈ 12 % of a scan.
 * The last bin starts at z = 5.7, where the mean forest becomes nearly black (Gunn–Peterson
 * troughs; from memory: Fan et al. 2006): a bin straddling 5.7 gave z ≈ 6 templates a grey forest.
 */
const IGM_BIN_EDGES = [-0.01, 2.2, 4.2, 5.7, 9.6];

/** One basis vector of a template: a rest-frame array on the global log grid, continuum removed. */
export interface TemplateBasis {
  label: string;
  values: Float64Array;
  /** The same vector before continuum removal (instrument-smoothed, same scale as `values`). */
  unfiltered: Float64Array;
  /** Drawn in synthetic spectra of the template (false for variants such as a broad Balmer component). */
  synthetic: boolean;
  /** The component has a continuum (false: emission lines only). */
  continuum: boolean;
  /**
   * For an IGM-attenuated vector: the redshift its mean transmission was evaluated at (the bin
   * centre) and the same vector without attenuation (smoothed, same scale), so that checks on the
   * unfiltered shape can apply the transmission of the exact redshift.
   */
  igm?: { zc: number; unattenuated: Float64Array };
}

/** A redshift interval over which a fixed set of basis vectors is fitted. */
export interface TemplateBin {
  zLo: number;
  zHi: number;
  basis: number[];
}

export interface BuiltTemplate {
  id: string;
  class: TemplateClass;
  zMin: number;
  zMax: number;
  /** Scanned over the whole range (false: a variant fitted only near candidates; see TemplateRecipe.refineOnly). */
  scanned: boolean;
  basis: TemplateBasis[];
  bins: TemplateBin[];
  /** Lines the recipe uses, for reporting which features support a solution. */
  lines: SpectralLine[];
}

/** All templates on one grid: global index of element 0 is `h0`. */
export interface TemplateSet {
  step: number;
  h0: number;
  length: number;
  continuumWidthPx: number;
  instrumentSigmaPx: number;
  /** Mean IGM model of the attenuated components. */
  igmModel: IgmModel;
  templates: BuiltTemplate[];
  /** Identifies the set (step, σ, filter, IGM model) in caches of prepared template buffers. */
  key: string;
  /** Pairwise products of basis vectors (for the Gram correlations), filled on first use. */
  products: Map<string, Float64Array>;
}

/** The bin of a template whose basis vectors are fitted at z (the last bin past the template's range). */
export function binAt(template: BuiltTemplate, z: number): TemplateBin {
  return template.bins.find((b) => z >= b.zLo && z <= b.zHi) ?? template.bins[template.bins.length - 1]!;
}

const memo = new Map<string, TemplateSet>();

/**
 * The template set for (step, instrument σ, filter width), built on first use and kept for the life
 * of the process (≈ 100 ms to build; a scan or a synthetic spectrum then costs no rebuild).
 */
export function templateSetFor(step: number, instrumentSigmaPx: number, continuumWidthPx: number, model: IgmModel = DEFAULT_IGM_MODEL): TemplateSet {
  const key = `${step}|${instrumentSigmaPx}|${continuumWidthPx}|${model}`;
  let set = memo.get(key);
  if (!set) {
    set = buildTemplates(step, instrumentSigmaPx, continuumWidthPx, model);
    memo.set(key, set);
  }
  return set;
}

/**
 * Builds every template of line-lists/templates.json on the log grid of the given step, smoothed
 * to the instrument σ (grid pixels) and filtered with the same continuum-removing running mean as
 * the data. Call once per (step, resolution, filter width) and reuse.
 */
export function buildTemplates(step: number, instrumentSigmaPx: number, continuumWidthPx: number, model: IgmModel = DEFAULT_IGM_MODEL): TemplateSet {
  const h0 = Math.floor(Math.log10(REST_MIN_A) / step);
  const length = Math.ceil(Math.log10(REST_MAX_A) / step) - h0 + 1;
  const lambda = new Float64Array(length);
  for (let j = 0; j < length; j++) lambda[j] = 10 ** ((h0 + j) * step);
  const templates = ENGINE_RECIPES.map((r) => buildOne(r, lambda, step, instrumentSigmaPx, continuumWidthPx, model));
  return { step, h0, length, continuumWidthPx, instrumentSigmaPx, igmModel: model, templates, key: `${step}|${instrumentSigmaPx}|${continuumWidthPx}|${model}`, products: new Map() };
}

function buildOne(recipe: TemplateRecipe, lambda: Float64Array, step: number, sigmaPx: number, widthPx: number, model: IgmModel): BuiltTemplate {
  const staticBasis: TemplateBasis[] = [];
  const staticZMax: number[] = [];
  const binned: Array<{ label: string; rest: Float64Array; synthetic: boolean; continuum: boolean; proximity?: ProximityZone }> = [];
  const used = new Set<SpectralLine>();
  for (const comp of recipe.components) {
    const lines = selectLines(strengthKeyOf(recipe, comp), comp);
    lines.forEach((l) => used.add(l));
    const rest = componentSpectrum(recipe, comp, lines, lambda, step);
    if (comp.igm === 'red-only') {
      staticBasis.push({ label: `${comp.name} (red of Lyα)`, synthetic: comp.synthetic ?? true, continuum: comp.continuum !== undefined, ...finish(rest.map((v, j) => (lambda[j]! >= LY_ALPHA ? v : 0)), sigmaPx, widthPx) });
      staticZMax.push(comp.zMax ?? Infinity);
    } else if (comp.igm === 'mean') {
      if (comp.zMax !== undefined) throw new Error(`Template ${recipe.id}: zMax is not supported on an IGM-attenuated component (${comp.name}).`);
      // The attenuated blue side stays tied to the red side (one amplitude): fitted separately it
      // would become a free narrow feature at Lyα at high z, where the forest is nearly black.
      binned.push({ label: comp.name, rest, synthetic: comp.synthetic ?? true, continuum: comp.continuum !== undefined, proximity: comp.proximityZone });
    } else {
      staticBasis.push({ label: comp.name, synthetic: comp.synthetic ?? true, continuum: comp.continuum !== undefined, ...finish(rest, sigmaPx, widthPx) });
      staticZMax.push(comp.zMax ?? Infinity);
    }
  }
  const basis = [...staticBasis];
  const staticIdx = staticBasis.map((_, i) => i);
  // Bins: the IGM bins when a component is attenuated, split where a static component stops.
  const igmEdges = binned.length ? IGM_BIN_EDGES : [recipe.zMin, recipe.zMax];
  const cuts = staticZMax.filter((z) => z > recipe.zMin && z < recipe.zMax);
  const edges = [...new Set([...igmEdges, ...cuts])].sort((x, y) => x - y);
  const bins: TemplateBin[] = [];
  for (let b = 0; b + 1 < edges.length; b++) {
    const zLo = Math.max(recipe.zMin, edges[b]!);
    const zHi = Math.min(recipe.zMax, edges[b + 1]!);
    if (zHi <= zLo) continue;
    const idx = staticIdx.filter((i) => staticZMax[i]! >= zHi);
    const zc = Math.sqrt((1 + zLo) * (1 + zHi)) - 1;
    for (const f of binned) {
      const attenuated = f.rest.map((v, j) => (v === 0 || lambda[j]! >= LY_ALPHA ? v : v * transmissionWithProximity(lambda[j]!, zc, f.proximity, model)));
      idx.push(basis.length);
      const finished = finish(attenuated, sigmaPx, widthPx);
      const unattenuated = Float64Array.from(gaussianSmooth(f.rest, sigmaPx), (v) => v / finished.scale);
      basis.push({ label: `${f.label} × IGM(z=${zc.toFixed(2)})`, synthetic: f.synthetic, continuum: f.continuum, values: finished.values, unfiltered: finished.unfiltered, igm: { zc, unattenuated } });
    }
    if (idx.length > MAX_COMPONENTS) throw new Error(`Template ${recipe.id}: ${idx.length} components fitted at once in ${zLo} … ${zHi}; at most ${MAX_COMPONENTS}.`);
    bins.push({ zLo, zHi, basis: idx });
  }
  return {
    id: recipe.id,
    class: recipe.class,
    zMin: recipe.zMin,
    zMax: recipe.zMax,
    scanned: !recipe.refineOnly,
    basis,
    bins,
    lines: [...used].sort((a, b) => a.rest - b.rest),
  };
}

/**
 * Mean IGM transmission at rest wavelength λ for a source at z, raised inside a quasar's
 * proximity zone (where its own radiation keeps the gas ionised) to a ramp from `transmission` at
 * Lyα down to 0 at `velocityKms` blueward, for sources above `fromZ`.
 */
export function transmissionWithProximity(restA: number, z: number, zone: ProximityZone | undefined, model: IgmModel): number {
  const t = meanIgmTransmission(restA * (1 + z), z, model);
  if (!zone || z < zone.fromZ || restA >= LY_ALPHA) return t;
  const dv = (1 - restA / LY_ALPHA) * C_KMS;
  return dv < zone.velocityKms ? Math.max(t, zone.transmission * (1 - dv / zone.velocityKms)) : t;
}

/** The strength key a component reads its lines' strengths under (component, then recipe, then recipe id). */
export function strengthKeyOf(recipe: TemplateRecipe, comp: ComponentRecipe): string {
  return comp.strengthKey ?? recipe.strengthKey ?? recipe.id;
}

/** The lines a template component draws: a strength under its key, and its kinds, species and names. */
export function selectLines(recipeId: string, comp: ComponentRecipe): SpectralLine[] {
  return TEMPLATE_LINES.filter(
    (l) =>
      (l.strength[recipeId] ?? 0) > 0 &&
      comp.select.kind.includes(l.kind) &&
      (!comp.select.species || comp.select.species.includes(l.species)) &&
      (!comp.select.names || comp.select.names.includes(l.name)) &&
      !(comp.select.except ?? []).includes(l.name),
  );
}

function continuumAt(c: ContinuumRecipe | undefined, lam: number): number {
  if (!c) return 0;
  switch (c.shape) {
    case 'power-law':
      return (lam / 1500) ** c.slope;
    case 'blackbody': {
      // A mix adds cooler (or hotter) stars, each normalised at 5000 Å and weighted.
      let f = planck(lam, c.temperatureK) / planck(5000, c.temperatureK);
      for (const m of c.mix ?? []) f += (m.weight * planck(lam, m.temperatureK)) / planck(5000, m.temperatureK);
      return f;
    }
  }
}

/** Planck f_λ shape (arbitrary scale), λ in Å. */
function planck(lamA: number, tK: number): number {
  const x = 1.4387769e8 / (lamA * tK);
  return x > 700 ? 0 : 1 / (lamA ** 5 * Math.expm1(x));
}

function componentSpectrum(recipe: TemplateRecipe, comp: ComponentRecipe, lines: SpectralLine[], lambda: Float64Array, step: number): Float64Array {
  const n = lambda.length;
  const out = new Float64Array(n);
  for (let j = 0; j < n; j++) out[j] = continuumAt(comp.continuum, lambda[j]!);
  const sigmaLogLine = recipe.sigmaKms / C_KMS / Math.LN10;
  const logStart = Math.log10(lambda[0]!);
  const key = strengthKeyOf(recipe, comp);
  const absorb = new Float64Array(n).fill(1);
  const tau = new Float64Array(n);
  for (const line of lines) {
    const strength = line.strength[key]!;
    const kind = comp.as && line.kind === 'emission' ? comp.as : line.kind;
    const logC = Math.log10(line.rest);
    const centre = (logC - logStart) / step;
    if (kind === 'break' && comp.opacity) {
      const w = line.widthA ?? 20;
      for (let j = 0; j < n && lambda[j]! < line.rest + 20 * w; j++) tau[j]! += strength / (1 + Math.exp((lambda[j]! - line.rest) / w));
    } else if (kind === 'band' && comp.opacity) {
      addBandOpacity(tau, lambda, line, strength, centre);
    } else if (kind === 'band') {
      const w = line.widthA ?? 100;
      if (line.profile === 'broad') {
        const sig = w / 2.355 / (line.rest * Math.LN10) / step;
        applyGaussian(absorb, centre, sig, -strength, true);
      } else {
        for (let j = Math.max(0, Math.floor(centre)); j < n && lambda[j]! <= line.rest + w; j++) {
          absorb[j]! *= 1 - strength * (1 - (lambda[j]! - line.rest) / w);
        }
      }
    } else if (kind === 'absorption' && comp.opacity) {
      addLorentzOpacity(tau, lambda, line.rest, line.dampingA ?? 0.5, strength, centre);
    } else if (kind === 'absorption') {
      const sigLog = Math.max(sigmaLogLine, (line.widthA ?? 0) / 2.355 / (line.rest * Math.LN10));
      applyGaussian(absorb, centre, sigLog / step, -strength, true);
    } else if (kind === 'emission') {
      // A line group may sit off the systemic redshift and be wider (quasar high-ionisation lines).
      const offset = comp.lineOffsets?.find((o) => o.names.includes(line.name));
      const sigmaLog = offset?.sigmaKms ? offset.sigmaKms / C_KMS / Math.LN10 : sigmaLogLine;
      const shiftPx = offset ? Math.log10(1 + offset.velocityKms / C_KMS) / step : 0;
      const sigA = sigmaLog * Math.LN10 * line.rest;
      const area = comp.continuum ? strength * (recipe.emissionEwA ?? 50) * continuumAt(comp.continuum, line.rest) : strength;
      applyGaussian(out, centre + shiftPx, sigmaLog / step, area / (sigA * Math.sqrt(2 * Math.PI)), false);
    }
  }
  // The intrinsic line width (sigmaKms) of an opacity component is applied to its transmission.
  const transmission = comp.opacity ? gaussianSmooth(tau.map((t) => Math.exp(-t)), sigmaLogLine / step) : undefined;
  if (comp.continuum) for (let j = 0; j < n; j++) out[j]! *= absorb[j]! * (transmission ? transmission[j]! : 1);
  return out;
}

/**
 * Molecular band opacity: a red-degraded band rises sharply at its head and fades redward as
 * τ₀·exp(−(λ − λ_head)/widthA) (the rotational lines thin out away from the head), a
 * violet-degraded one ('head-violet', C2 Swan) the same towards the blue; a 'broad'
 * band (H₂O, CH₄, H₂ CIA) is a Gaussian in λ of FWHM widthA.
 */
function addBandOpacity(tau: Float64Array, lambda: Float64Array, line: SpectralLine, tau0: number, centre: number): void {
  const n = lambda.length;
  const w = line.widthA ?? 100;
  if (line.profile === 'broad') {
    const sigma = w / 2.355;
    for (let j = 0; j < n; j++) {
      const x = (lambda[j]! - line.rest) / sigma;
      if (x > -5 && x < 5) tau[j]! += tau0 * Math.exp(-0.5 * x * x);
    }
    return;
  }
  if (line.profile === 'head-violet') {
    for (let j = Math.min(n - 1, Math.ceil(centre)); j >= 0; j--) {
      const d = line.rest - lambda[j]!;
      if (d > 8 * w) break;
      if (d >= 0) tau[j]! += tau0 * Math.exp(-d / w);
    }
    return;
  }
  for (let j = Math.max(0, Math.floor(centre)); j < n; j++) {
    const d = lambda[j]! - line.rest;
    if (d > 8 * w) break;
    if (d >= 0) tau[j]! += tau0 * Math.exp(-d / w);
  }
}

/** Lorentzian opacity τ₀ / (1 + ((λ − λ₀)/γ)²) out to where it falls below 10⁻³ (and ≤ 4000 Å). */
function addLorentzOpacity(tau: Float64Array, lambda: Float64Array, rest: number, gammaA: number, tau0: number, centre: number): void {
  const reach = Math.min(4000, gammaA * Math.sqrt(Math.max(0, tau0 / 1e-3 - 1)));
  const n = lambda.length;
  const c = Math.round(centre);
  for (let j = Math.max(0, c); j < n && lambda[j]! - rest <= reach; j++) tau[j]! += tau0 / (1 + ((lambda[j]! - rest) / gammaA) ** 2);
  for (let j = Math.min(n - 1, c - 1); j >= 0 && rest - lambda[j]! <= reach; j--) tau[j]! += tau0 / (1 + ((lambda[j]! - rest) / gammaA) ** 2);
}

/** Adds (or, multiplicatively, applies 1 + peak·g) a Gaussian of σ pixels centred at `centre`. */
function applyGaussian(arr: Float64Array, centre: number, sigmaPx: number, peak: number, multiplicative: boolean): void {
  const s = Math.max(sigmaPx, 0.3);
  const lo = Math.max(0, Math.floor(centre - 5 * s));
  const hi = Math.min(arr.length - 1, Math.ceil(centre + 5 * s));
  for (let j = lo; j <= hi; j++) {
    const g = Math.exp(-0.5 * ((j - centre) / s) ** 2);
    if (multiplicative) arr[j]! *= 1 + peak * g;
    else arr[j]! += peak * g;
  }
}

/** Instrument smoothing, continuum removal, and unit scale (max |value| = 1). */
function finish(values: Float64Array, sigmaPx: number, widthPx: number): { values: Float64Array; unfiltered: Float64Array; scale: number } {
  const smoothed = Float64Array.from(gaussianSmooth(values, sigmaPx));
  const filtered = highPass(smoothed, widthPx);
  let max = 0;
  for (const v of filtered) max = Math.max(max, Math.abs(v));
  if (max > 0) {
    for (let j = 0; j < filtered.length; j++) {
      filtered[j]! /= max;
      smoothed[j]! /= max;
    }
  }
  return { values: filtered, unfiltered: smoothed, scale: max > 0 ? max : 1 };
}

function gaussianSmooth(values: Float64Array, sigmaPx: number): Float64Array {
  if (sigmaPx < 0.5) return values;
  const half = Math.ceil(4 * sigmaPx);
  const kernel = new Float64Array(2 * half + 1);
  let sum = 0;
  for (let k = -half; k <= half; k++) sum += kernel[k + half] = Math.exp(-0.5 * (k / sigmaPx) ** 2);
  for (let k = 0; k < kernel.length; k++) kernel[k]! /= sum;
  const n = values.length;
  const out = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    let acc = 0;
    for (let k = -half; k <= half; k++) {
      const idx = Math.min(n - 1, Math.max(0, j + k));
      acc += kernel[k + half]! * values[idx]!;
    }
    out[j] = acc;
  }
  return out;
}
