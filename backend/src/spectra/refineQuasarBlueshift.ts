import type { TemplateSet } from './buildTemplates';
import { DISTINCT_DEX, findMinima, type RawSolution } from './findSolutions';
import { C_KMS } from './logGrid';
import { scanTemplate, type ScanData, type TemplateCurve } from './scanTemplate';
import { QUASAR_BLUESHIFTS_KMS, quasarTemplateId } from './templateRecipes';

/**
 * How far (km/s) the refinement may move a quasar candidate's redshift: a candidate found with
 * the high-ionisation lines at 2500 km/s whose true blueshift is 0 sits ≈ 2500 km/s high when
 * those lines dominate its fit.
 */
export const REFINE_WINDOW_KMS = 3000;
/** Quasar candidates refined per scan (the best distinct ones); the rest keep their scanned fit. */
export const REFINED_CANDIDATES = 3;

/**
 * A weak prior on the blueshift, χ² = ((v − 1500)/2000)²: where the data cannot tell z from v (only
 * C IV in range, no low-ionisation line), it settles on a typical blueshift rather than an end of
 * the grid. Centre and width after the C IV blueshifts of SDSS and z > 6 quasars (typically
 * 500–2500 km/s; from memory: Richards et al. 2011; Meyer et al. 2019); common practice to make it
 * this weak (≤ 5 over the grid).
 */
export function blueshiftPriorChi2(blueshiftKms: number): number {
  return ((blueshiftKms - 1500) / 2000) ** 2;
}

/**
 * Only quasar candidates whose χ² lies within this share of the best candidate's gain over the zero
 * model (plus 25) are refined: the refinement moves χ² by what one velocity can explain, far less
 * than the gaps to candidates it cannot reach (keeps `npm run bench` within its budget).
 */
export const REFINE_REACH = 0.1;

export interface RefineContext {
  data: ScanData;
  set: TemplateSet;
  /** The redshift range the scan was asked for: a refined solution stays inside it. */
  zMin: number;
  zMax: number;
  /** The scanned curves: their own shifts are reused for the blueshifts they hold. */
  scanned: TemplateCurve[];
  /** Applies the scan's own curve terms (shifts without features, the break-consistency χ²). */
  finishCurve: (curve: TemplateCurve) => void;
}

export interface RefinedQuasars {
  /** The candidates, refined ones replaced, sorted by χ² again. */
  candidates: RawSolution[];
  /** Curves of the blueshift variants that replaced a candidate (for the lazy checks). */
  curves: TemplateCurve[];
}

/**
 * The fitted blueshift of the quasar's high-ionisation group (N V, Si IV, C IV, He II). The scan
 * fits two fixed patterns (2500 and 5000 km/s); near each of the best quasar candidates this fits
 * the pattern at every step of 0 … 6000 km/s with the redshift free within ±3000 km/s, and keeps
 * the (v, z) of least χ² + prior; the solution's χ² is the fit's, without the prior. The lines that do not move (Lyα, Mg II, the Balmer lines,
 * [O III]) anchor the systemic redshift; one amplitude still holds all lines, so the only new
 * freedom is one bounded velocity. Lazy: ≈ 13 narrow-window FFT scans per refined candidate.
 */
export function refineQuasarCandidates(candidates: RawSolution[], ctx: RefineContext): RefinedQuasars {
  const { set } = ctx;
  const step = set.step;
  const distinctPx = Math.round(DISTINCT_DEX / step);
  const windowPx = Math.ceil(REFINE_WINDOW_KMS / (C_KMS * Math.LN10 * step));
  const picked: RawSolution[] = [];
  const best0 = candidates[0];
  const reach = best0 ? best0.chi2 + 25 + REFINE_REACH * Math.max(0, ctx.data.chi2Null - best0.chi2) : -Infinity;
  for (const c of candidates) {
    if (c.chi2 > reach) break;
    if (picked.length === REFINED_CANDIDATES) break;
    if (c.class !== 'quasar') continue;
    if (picked.some((p) => Math.abs(p.shift - c.shift) <= distinctPx)) continue;
    picked.push(c);
  }
  if (picked.length === 0) return { candidates, curves: [] };
  const replaced = new Map<RawSolution, RawSolution>();
  const curves: TemplateCurve[] = [];
  for (const cand of picked) {
    const zLo = Math.max(ctx.zMin, 10 ** ((cand.shift - windowPx) * step) - 1);
    const zHi = Math.min(ctx.zMax, 10 ** ((cand.shift + windowPx) * step) - 1);
    let best: { raw: RawSolution; score: number; curve: TemplateCurve } | undefined;
    for (const v of QUASAR_BLUESHIFTS_KMS) {
      const template = set.templates.find((t) => t.id === quasarTemplateId(v));
      if (!template) continue;
      const curve = template.scanned ? windowOf(ctx.scanned.find((c) => c.template === template), cand.shift - windowPx, cand.shift + windowPx) : scanTemplate(ctx.data, set, template, Math.max(zLo, template.zMin), Math.min(zHi, template.zMax), 'fft');
      if (!curve) continue;
      if (!template.scanned) ctx.finishCurve(curve);
      const m = findMinima([curve], step, 1)[0];
      if (!m) continue;
      const score = m.chi2 + blueshiftPriorChi2(v);
      if (!best || score < best.score) best = { raw: m, score, curve };
    }
    // The prior only chooses among the blueshifts; the χ² that ranks the solution against other
    // classes is the fit's own.
    if (best && (best.raw.template !== cand.template || best.raw.chi2 < cand.chi2)) {
      replaced.set(cand, best.raw);
      curves.push(best.curve);
    }
  }
  const out = candidates.map((c) => replaced.get(c) ?? c);
  out.sort((a, b) => a.chi2 - b.chi2);
  return { candidates: out, curves };
}

/** A scanned curve's shifts lo … hi as a curve of its own (views, no copy). */
function windowOf(curve: TemplateCurve | undefined, lo: number, hi: number): TemplateCurve | undefined {
  if (!curve) return undefined;
  const a = Math.max(lo, curve.sMin) - curve.sMin;
  const b = Math.min(hi, curve.sMin + curve.chi2.length - 1) - curve.sMin;
  if (b < a) return undefined;
  return { ...curve, sMin: curve.sMin + a, chi2: curve.chi2.subarray(a, b + 1), amplitudes: curve.amplitudes.subarray(a * curve.maxBasis, (b + 1) * curve.maxBasis) };
}
