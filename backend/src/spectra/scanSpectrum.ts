import { templateSetFor, type TemplateSet } from './buildTemplates';
import { shapeBins, shapeChi2 } from './continuumShapeCheck';
import { forestChi2, forestSums } from './forestStructureCheck';
import { DEFAULT_IGM_MODEL, meanIgmTransmission, type IgmModel } from './igmTransmission';
import { interloperAlternatives, type Interloper } from './interloperCheck';
import { informationWeightedChi2 } from './lineMisfit';
import { findMinima, pickDistinct, type RawSolution } from './findSolutions';
import { C_KMS, shiftToZ } from './logGrid';
import { addBreakChi2, windowSums } from './lymanBreakCheck';
import { matchEmissionLines, type LineMatchResult } from './matchEmissionLines';
import { prepareSpectrum, type PrepareOptions, type PreparedSpectrum } from './prepareSpectrum';
import { rankWithPhotoZ, type PhotoZPrior } from './rankWithPhotoZ';
import { scanData, scanTemplates, type TemplateCurve, type TemplateRequest } from './scanTemplate';
import { checksSingleFeature, featureShare } from './singleFeatureCheck';
import type { Spectrum, SpectrumClass, TemplateClass } from './types';
import { ENGINE_VERSION } from './version';
import { ENGINE_RECIPES } from './templateRecipes';
import { refineQuasarCandidates } from './refineQuasarBlueshift';

export interface ScanOptions extends PrepareOptions {
  /** Redshift range searched (default 0 … 9). Star templates always stay near z = 0. */
  zMin?: number;
  zMax?: number;
  /** Template classes to try (default all). */
  classes?: TemplateClass[];
  /** Number of distinct solutions returned (default 5). */
  maxSolutions?: number;
  /** Photometric redshift of the target: re-ranks, never removes, solutions. */
  photoZ?: PhotoZPrior;
  /** 'fft' (default) or 'direct' (loop over shifts; for benchmarks and checks). */
  method?: 'fft' | 'direct';
  /** Maximum points per χ²(z) curve kept for plotting (default 1500). */
  curvePoints?: number;
  /** Minimum χ² improvement over a zero model for any class decision (default 50: the best of ~10⁴ trial shifts × templates on pure noise reaches ~20–40). */
  minDetectionChi2?: number;
  /** Cap the evidence of one feature for absorption-line galaxies and stars (singleFeatureCheck.ts; default true). */
  singleFeatureCheck?: boolean;
  /** Mean IGM transmission model of the Lyman-break and quasar templates (default 'inoue2014'; 'madau1995' as an option). */
  igmModel?: IgmModel;
  /** Add the χ² of the unfiltered continuum shape in coarse bins to each candidate (continuumShapeCheck.ts; default true). */
  shapeCheck?: boolean;
  /** Penalise quasar and Lyman-break solutions whose Lyα forest is too smooth (forestStructureCheck.ts; default: on when the file carried its errors). */
  forestCheck?: boolean;
}

/** A feature of the line list at a solution's redshift, inside the observed range. */
export interface SolutionLine {
  name: string;
  /** Rest vacuum wavelength, Å. */
  rest: number;
  /** Observed vacuum wavelength, Å. */
  observed: number;
}

/** One redshift proposed by the scan. */
export interface Solution {
  z: number;
  /**
   * 1σ from the χ² curvature, scaled by √(χ²/dof) when the fit is worse than the errors allow
   * (common practice), with a sub-pixel floor in quadrature; pulls per class are printed by
   * npm run accuracy.
   */
  zErr: number;
  /** Lyman-break galaxies and quasars: the systematic error from line offsets to systemic (see systematicError). */
  zSysErr?: number;
  /** χ² per degree of freedom at the solution (usable grid pixels minus fitted amplitudes). */
  reducedChi2: number;
  class: TemplateClass;
  template: string;
  chi2: number;
  /** χ² of the next distinct solution minus this one's (null for the last). */
  deltaChi2: number | null;
  /** χ² improvement over a zero model. */
  detectionChi2: number;
  lines: SolutionLine[];
  /** Prior weight when a photometric redshift was given (1 inside its range). */
  priorWeight?: number;
  /** Share of the χ² gain carried by the strongest 0.006 dex window (absorption-line galaxies and stars). */
  featureShare?: number;
  /** χ² added because one feature carried more than 90 % of the gain (included in chi2). */
  singleFeaturePenalty?: number;
  /** χ² of the continuum shape in coarse bins, before continuum removal (included in chi2). */
  shapeChi2?: number;
  /** Quasars and Lyman-break sources: χ² added because the Lyα forest is too smooth (forestStructureCheck.ts; included in chi2). */
  forestChi2?: number;
  /**
   * Lyman-break solutions only: the interloper alternatives (a 4000 Å/Balmer-break galaxy at the
   * mirror redshift, cool stars, brown dwarfs and carbon stars at z = 0) with Δχ² against this one.
   */
  interlopers?: Interloper[];
}

/** χ²(z) of one template, decimated (minimum per block) for plotting. */
export interface ScanCurve {
  template: string;
  class: TemplateClass;
  z: Float64Array;
  chi2: Float64Array;
}

export interface ScanResult {
  engineVersion: string;
  /** Class of the best solution, or 'unknown' when nothing beats a zero model clearly. */
  class: SpectrumClass;
  /** Why the class is 'unknown' (absent otherwise). */
  unknownReason?: string;
  solutions: Solution[];
  curves: ScanCurve[];
  /** The second, independent route: emission peaks matched in pairs. */
  lineMatches: LineMatchResult;
  chi2Null: number;
  meta: {
    pixels: number;
    step: number;
    wavelengthMin: number;
    wavelengthMax: number;
    medium: 'air' | 'vacuum';
    snrMedian: number;
    masks: string[];
    zMin: number;
    zMax: number;
    templates: string[];
  };
}

/** Templates for a prepared spectrum's grid, built once per (step, resolution, filter) and reused. */
export function templatesFor(prepared: PreparedSpectrum, igmModel: IgmModel = DEFAULT_IGM_MODEL): TemplateSet {
  return templateSetFor(prepared.step, quantise(prepared.instrumentSigmaPx), prepared.continuumWidthPx, igmModel);
}

function quantise(sigmaPx: number): number {
  const levels = [1, 1.5, 2, 3, 4, 6, 8, 12, 16, 24, 32];
  return levels.reduce((best, l) => (Math.abs(Math.log(l / sigmaPx)) < Math.abs(Math.log(best / sigmaPx)) ? l : best), 1);
}

/**
 * The scan: prepares the spectrum, computes χ²(z) for every template over the range with FFT
 * correlations, and returns ranked distinct solutions with errors, Δχ², class and the lines that
 * fall in the observed range, plus the decimated curves and the emission-line route.
 *
 * @example scanSpectrum(spectrum, { zMin: 0, zMax: 9 }).solutions[0].z
 */
export function scanSpectrum(spectrum: Spectrum, options: ScanOptions = {}): ScanResult {
  const zMin = options.zMin ?? 0;
  const zMax = options.zMax ?? 9;
  if (!(zMax > zMin) || zMin < -0.01 || zMax > 12) throw new RangeError(`The redshift range must satisfy −0.01 ≤ zMin < zMax ≤ 12, got ${zMin} … ${zMax}.`);
  const prepared = prepareSpectrum(spectrum, options);
  const igmModel = options.igmModel ?? DEFAULT_IGM_MODEL;
  const set = templatesFor(prepared, igmModel);
  const data = scanData(prepared);
  const classes = options.classes;
  const requests: TemplateRequest[] = [];
  for (const t of set.templates) {
    if (!t.scanned) continue;
    if (classes && !classes.includes(t.class)) continue;
    // Stars are Galactic: their templates cover only |z| ≤ 0.002 regardless of the range asked.
    if (t.class === 'star' && zMin > 0.002) continue;
    requests.push({ template: t, zMin: t.class === 'star' ? t.zMin : zMin, zMax: t.class === 'star' ? t.zMax : zMax });
  }
  const curves = scanTemplates(data, set, requests, options.method ?? 'fft');
  for (const c of curves) dropShiftsWithoutFeatures(c, prepared, data.chi2Null);
  let usable = 0;
  for (let i = 0; i < prepared.n; i++) if (prepared.ivar[i]! > 0) usable++;
  const misfit = misfitScale(curves, usable);
  addLymanBreakChecks(curves, prepared, igmModel, misfit);
  const maxSolutions = options.maxSolutions ?? 5;
  const refined = refineQuasarCandidates(findMinima(curves, set.step, 4 * maxSolutions + 4), {
    data,
    set,
    zMin,
    zMax,
    scanned: curves,
    finishCurve: (c) => {
      dropShiftsWithoutFeatures(c, prepared, data.chi2Null);
      addLymanBreakChecks([c], prepared, igmModel, misfit);
    },
  });
  const candidates = refined.candidates;
  const check = options.singleFeatureCheck ?? true;
  const bins = options.shapeCheck ?? true ? shapeBins(prepared) : undefined;
  // The checks too costly for every shift, run on candidates about to be chosen and on the
  // interloper alternatives: the single-feature cap, the unfiltered continuum shape and the
  // forest structure of quasar and Lyman-break candidates.
  const forest = (options.forestCheck ?? !spectrum.meta.errorsEstimated) ? forestSums(prepared) : undefined;
  const lazyAt = (curve: TemplateCurve, shift: number): { single: number; share?: number; shape?: number; forest: number } => {
    const t = curve.template;
    let single = 0;
    let share: number | undefined;
    if (check && checksSingleFeature(t)) {
      const i = shift - curve.sMin;
      const f = featureShare(data, set, t, shift, curve.amplitudes.subarray(i * curve.maxBasis, (i + 1) * curve.maxBasis));
      share = f.gain > 0 ? f.window / f.gain : 0;
      single = f.penalty;
    }
    const shape = bins ? misfit * shapeChi2(bins, prepared, set, t, shift, (lambda, z) => meanIgmTransmission(lambda, z, igmModel)) : undefined;
    const hasForest = forest && (t.class === 'quasar' || t.class === 'lyman-break');
    return { single, share, shape, forest: hasForest ? misfit * forestChi2(forest, shiftToZ(shift, set.step), igmModel) : 0 };
  };
  // A candidate's curve: its template's, holding its shift (refined variants cover a narrow window each).
  const allCurves = [...curves, ...refined.curves];
  const curveOf = (cand: RawSolution) => allCurves.find((c) => c.template.id === cand.template && cand.shift >= c.sMin && cand.shift < c.sMin + c.chi2.length)!;
  const lazyChecks = (cand: RawSolution): number => {
    const r = lazyAt(curveOf(cand), cand.shift);
    if (r.share !== undefined) cand.featureShare = r.share;
    if (r.single > 0) cand.penalty = r.single;
    if (r.shape !== undefined) cand.shapeChi2 = r.shape;
    if (r.forest > 0) cand.forestChi2 = r.forest;
    return r.single + (r.shape ?? 0) + r.forest;
  };
  const raw = pickDistinct(candidates, set.step, maxSolutions, lazyChecks);
  const lineMisfit = (s: RawSolution): number => informationWeightedChi2(data, set, curveOf(s).template, s.shift, s.amplitudes);
  const solutions: Solution[] = raw.map((s, k) => {
    // The fit's own χ² (without the single-feature penalty, which only re-ranks) per degree of freedom.
    const dof = Math.max(1, usable - s.amplitudes.filter((a) => a > 0).length);
    const reducedChi2 = (s.chi2 - (s.penalty ?? 0) - (s.shapeChi2 ?? 0) - (s.forestChi2 ?? 0)) / dof;
    const lazyTotal = (curve: TemplateCurve, shift: number): number => {
      const r = lazyAt(curve, shift);
      return r.single + (r.shape ?? 0) + r.forest;
    };
    const interlopers = s.class === 'lyman-break' ? interloperAlternatives(s.z, s.chi2, curves, set.step, lazyTotal) : undefined;
    return {
      z: s.z,
      zErr: withSubPixelFloor(s.zErr * Math.sqrt(Math.max(1, reducedChi2, lineMisfit(s))), s.z, set.step),
      ...(systematicError(s.z, s.class) !== undefined ? { zSysErr: systematicError(s.z, s.class)! } : {}),
      reducedChi2,
      class: s.class,
      template: s.template,
      chi2: s.chi2,
      deltaChi2: k + 1 < raw.length ? raw[k + 1]!.chi2 - s.chi2 : null,
      detectionChi2: data.chi2Null - (s.chi2 - (s.shapeChi2 ?? 0) - (s.forestChi2 ?? 0)),
      lines: linesInRange(set, s.template, s.z, prepared),
      ...(s.featureShare !== undefined ? { featureShare: s.featureShare } : {}),
      ...(s.penalty ? { singleFeaturePenalty: s.penalty } : {}),
      ...(s.shapeChi2 !== undefined ? { shapeChi2: s.shapeChi2 } : {}),
      ...(s.forestChi2 ? { forestChi2: s.forestChi2 } : {}),
      ...(interlopers ? { interlopers } : {}),
    };
  });
  const ranked = options.photoZ ? rankWithPhotoZ(solutions, options.photoZ) : solutions;
  const best = ranked[0];
  const minDet = options.minDetectionChi2 ?? 50;
  const detected = !!best && best.detectionChi2 >= minDet;
  return {
    engineVersion: ENGINE_VERSION,
    class: detected ? best.class : 'unknown',
    ...(detected ? {} : { unknownReason: unknownReason(best?.detectionChi2, minDet) }),
    solutions: ranked,
    curves: curves.map((c) => decimate(c, set.step, options.curvePoints ?? 1500)),
    lineMatches: matchEmissionLines(prepared, { zMin, zMax }),
    chi2Null: data.chi2Null,
    meta: {
      pixels: prepared.n,
      step: prepared.step,
      wavelengthMin: prepared.wavelengthMin,
      wavelengthMax: prepared.wavelengthMax,
      medium: prepared.medium,
      snrMedian: prepared.snrMedian,
      masks: prepared.masks,
      zMin,
      zMax,
      templates: curves.map((c) => c.template.id),
    },
  };
}

/**
 * A template whose features all fall outside the observed range can still lower χ² through the
 * sidelobes of the continuum filter (a line just past the red end leaves a broad dip inside it):
 * that is no evidence, so those shifts get the zero model's χ².
 */
/** Lyα, Å (vacuum; lines.json). */
const LY_ALPHA_A = 1215.67;

function dropShiftsWithoutFeatures(c: TemplateCurve, prepared: PreparedSpectrum, chi2Null: number): void {
  const n = c.chi2.length;
  const covered = new Int32Array(n + 1);
  const { step, wavelengthMin, wavelengthMax } = prepared;
  for (const l of c.template.lines) {
    const a = Math.max(0, Math.ceil(Math.log10(wavelengthMin / l.rest) / step) - c.sMin);
    const b = Math.min(n - 1, Math.floor(Math.log10(wavelengthMax / l.rest) / step) - c.sMin);
    if (b < a) continue;
    covered[a]! += 1;
    covered[b + 1]! -= 1;
  }
  let running = 0;
  for (let i = 0; i < n; i++) {
    running += covered[i]!;
    if (running === 0) c.chi2[i] = chi2Null;
  }
  // A Lyman-break solution is a claim about the break: where Lyα lies outside the data, what is
  // left is a UV continuum with absorption lines, which matches a quasar's troughs between its
  // broad lines or intervening absorbers (the near-infrared arm of J1212+0505, z = 6.44, read as
  // a Lyman-break source at 6.07 once Si IV and C IV joined the template) as well as a galaxy.
  if (c.template.class === 'lyman-break') {
    const a = Math.ceil(Math.log10(wavelengthMin / LY_ALPHA_A) / step) - c.sMin;
    const b = Math.floor(Math.log10(wavelengthMax / LY_ALPHA_A) / step) - c.sMin;
    for (let i = 0; i < n; i++) if (i < a || i > b) c.chi2[i] = chi2Null;
  }
}

/**
 * Sub-pixel floor of a redshift error, added in quadrature to the curvature error: the three-point
 * parabola and the resampling onto the grid (0.05 pixel: on the engine's own synthetic spectra
 * pulls were 1.18–1.36 without it and 0.1–0.65 with 0.35 pixel; npm run accuracy).
 */
export const SUB_PIXEL_FLOOR_PX = 0.05;

function withSubPixelFloor(zErr: number, z: number, step: number): number {
  const pixel = (1 + z) * Math.LN10 * step * SUB_PIXEL_FLOOR_PX;
  return Math.sqrt(zErr * zErr + pixel * pixel);
}

/**
 * The systematic error of classes whose redshift-setting features sit off the systemic redshift by
 * amounts that vary from object to object, kept apart from zErr (a measurement error): Lyman-break
 * galaxies (Lyα emission typically +200–400 km/s, interstellar absorption ≈ −150 km/s; from memory:
 * Shapley et al. 2003) and quasars (broad high-ionisation lines blueshifted by 0–5000 km/s; from
 * memory: Richards et al. 2011). On the independent synthetic sky, which draws such offsets, the
 * measurement-only pulls of these classes are ≈ 10; with this term in quadrature they are ≈ 1.
 */
const SYSTEMATIC_KMS: Partial<Record<TemplateClass, number>> = { 'lyman-break': 250, quasar: 400 };

function systematicError(z: number, cls: TemplateClass): number | undefined {
  const v = SYSTEMATIC_KMS[cls];
  return v === undefined ? undefined : ((1 + z) * v) / C_KMS;
}

function unknownReason(detectionChi2: number | undefined, threshold: number): string {
  if (detectionChi2 === undefined) return 'No template fitted anywhere in the range: nothing to propose.';
  return `The best fit improves χ² over a model with no features by only ${Math.max(0, detectionChi2).toFixed(1)}, below the detection threshold of ${threshold}: no redshift is claimed.`;
}

/**
 * Sources whose Lyα sits in the spectrum must be dark blueward of it: the χ² of Lyman-break and
 * quasar templates gets the break-consistency term of lymanBreakCheck.ts.
 */
function addLymanBreakChecks(curves: TemplateCurve[], prepared: PreparedSpectrum, igmModel: IgmModel, misfit: number): void {
  const sums = windowSums(prepared);
  for (const c of curves) {
    if (c.template.class !== 'lyman-break' && c.template.class !== 'quasar') continue;
    addBreakChi2(c.chi2, c.sMin, sums, { slope: continuumSlope(c.template.id), igmModel, weight: misfit });
  }
}

/**
 * How far the best template falls short of the data: the smallest χ² per degree of freedom of the
 * continuum-removed fit over all templates and shifts, at least 1. The scan's χ² and the checks on
 * the unfiltered data (break consistency, continuum shape) carry their own error models: the checks
 * allow 10–20 % template and forest error, the scan's χ² only the pixel errors. When no template
 * reaches χ²/dof ≈ 1 (a bright galaxy whose metal lines our templates draw only in part: χ²/dof ≈
 * 15–20 on KC96 bulges at S/N 15), differences in the scan's χ² are that many times larger than the
 * evidence they stand for, and a Lyman break that fits an old galaxy's 4000 Å break a little better
 * in the filtered data outvotes a blue side far too bright for the forest. Multiplying the checks by
 * this factor is the same as inflating the pixel errors until the best fit is acceptable (common
 * practice in template fitting); the filtered χ² itself is left as it is, and the χ² a solution
 * reports includes the checks as multiplied.
 */
function misfitScale(curves: TemplateCurve[], usable: number): number {
  let best = Infinity;
  for (const c of curves) for (let i = 0; i < c.chi2.length; i++) if (c.chi2[i]! < best) best = c.chi2[i]!;
  return Number.isFinite(best) && usable > 0 ? Math.min(MAX_MISFIT_SCALE, Math.max(1, best / usable)) : 1;
}

/**
 * Beyond this the checks' own 10–20 % error allowances are no better than the scan's fit: a bright
 * real M9 dwarf (χ²/dof ≈ 300 against our analytic cool-star template; independent sky seed 31
 * #480) is read as a galaxy at z = 1.2 from a small difference in continuum shape once the scale
 * passes ≈ 85. KC96 bulges at S/N 10–15 sit at 15–20; one at S/N 20 (χ²/dof ≈ 80, seed 5151 #72)
 * needs ≥ 42 not to be read as a Lyman break at the mirror z. 30 until engine 0.6.8.
 */
const MAX_MISFIT_SCALE = 60;

function continuumSlope(templateId: string): number {
  const recipe = ENGINE_RECIPES.find((r) => r.id === templateId);
  const continuum = recipe?.components.find((c) => c.continuum?.shape === 'power-law')?.continuum;
  return continuum?.shape === 'power-law' ? continuum.slope : -2;
}

function linesInRange(set: TemplateSet, templateId: string, z: number, prepared: PreparedSpectrum): SolutionLine[] {
  const t = set.templates.find((x) => x.id === templateId)!;
  const out: SolutionLine[] = [];
  for (const l of t.lines) {
    const observed = l.rest * (1 + z);
    if (observed >= prepared.wavelengthMin && observed <= prepared.wavelengthMax) out.push({ name: l.name, rest: l.rest, observed });
  }
  return out;
}

function decimate(c: TemplateCurve, step: number, points: number): ScanCurve {
  const n = c.chi2.length;
  const block = Math.max(1, Math.ceil(n / points));
  const m = Math.ceil(n / block);
  const z = new Float64Array(m);
  const chi2 = new Float64Array(m);
  for (let b = 0; b < m; b++) {
    let best = b * block;
    for (let i = b * block; i < Math.min(n, (b + 1) * block); i++) if (c.chi2[i]! < c.chi2[best]!) best = i;
    z[b] = shiftToZ(c.sMin + best, step);
    chi2[b] = c.chi2[best]!;
  }
  return { template: c.template.id, class: c.template.class, z, chi2 };
}
