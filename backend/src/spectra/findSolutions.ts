import { shiftToZ } from './logGrid';
import type { TemplateCurve } from './scanTemplate';
import type { TemplateClass } from './types';

/** A χ² minimum before lines and priors are attached. */
export interface RawSolution {
  z: number;
  zErr: number;
  chi2: number;
  class: TemplateClass;
  template: string;
  /** Integer shift of the minimum, pixels. */
  shift: number;
  /** Best amplitudes of the template's basis vectors at the minimum. */
  amplitudes: number[];
  /** χ² added by the single-feature check (included in chi2). */
  penalty?: number;
  /** Share of the χ² gain in the strongest feature window (templates the check applies to). */
  featureShare?: number;
  /** χ² of the unfiltered continuum shape in coarse bins (continuumShapeCheck.ts; included in chi2). */
  shapeChi2?: number;
  /** χ² of a too-smooth Lyα forest (forestStructureCheck.ts; included in chi2). */
  forestChi2?: number;
}

/** Minima closer than this in log10(1+z) (≈ 1000 km/s; 15 pixels of the default grid) are one solution. */
export const DISTINCT_DEX = 15e-4;

/**
 * The lowest `perCurve` local minima of every curve, best first. Each minimum is refined by a
 * parabola through its three lowest points; the 1σ error is where χ² rises by 1 on that parabola,
 * σ_s = √(2/χ²''), converted to z with dz = (1+z)·ln10·step·σ_s. `pickDistinct` then ranks them
 * into distinct solutions.
 */
export function findMinima(curves: TemplateCurve[], step: number, perCurve: number): RawSolution[] {
  const candidates: RawSolution[] = [];
  for (const c of curves) {
    const y = c.chi2;
    const mins = lowestLocalMinima(y, perCurve);
    for (const i of mins) {
      let offset = 0;
      let curvature = NaN;
      if (i > 0 && i < y.length - 1) {
        const c2 = y[i - 1]! - 2 * y[i]! + y[i + 1]!;
        if (c2 > 0) {
          // A vertex more than half a pixel away means the three points are not a parabola (a
          // step in the curve, e.g. where a window leaves the data): keep the sampled minimum.
          const vertex = (0.5 * (y[i - 1]! - y[i + 1]!)) / c2;
          offset = Math.abs(vertex) <= 0.5 ? vertex : 0;
          curvature = c2;
        }
      }
      const s = c.sMin + i + offset;
      const z = shiftToZ(s, step);
      const sigmaPx = curvature > 0 ? Math.sqrt(2 / curvature) : 1;
      const chi2 = Math.max(0, y[i]! - (curvature > 0 ? 0.5 * curvature * offset * offset : 0));
      candidates.push({
        z,
        zErr: (1 + z) * Math.LN10 * step * sigmaPx,
        chi2,
        class: c.template.class,
        template: c.template.id,
        shift: c.sMin + i,
        amplitudes: Array.from(c.amplitudes.subarray(i * c.maxBasis, (i + 1) * c.maxBasis)),
      });
    }
  }
  candidates.sort((a, b) => a.chi2 - b.chi2);
  return candidates;
}

/**
 * The best `maxSolutions` candidates at least DISTINCT_DEX apart, from a list sorted by χ².
 * `penalty`, when given, is asked once about each candidate about to be chosen; a candidate with a
 * positive penalty gets it added to its χ² and goes back into the list at its new rank. Only
 * candidates that would be chosen are asked (the check may be costly), and the result equals
 * penalising every candidate first, since penalties only ever raise χ².
 */
export function pickDistinct(candidates: RawSolution[], step: number, maxSolutions: number, penalty?: (candidate: RawSolution) => number): RawSolution[] {
  const distinctPx = Math.round(DISTINCT_DEX / step);
  const queue = candidates.slice();
  const asked = new Set<RawSolution>();
  const chosen: RawSolution[] = [];
  while (queue.length > 0 && chosen.length < maxSolutions) {
    const cand = queue.shift()!;
    if (chosen.some((s) => Math.abs(s.shift - cand.shift) <= distinctPx)) continue;
    if (penalty && !asked.has(cand)) {
      asked.add(cand);
      const p = penalty(cand);
      if (p > 0) {
        cand.chi2 += p;
        let k = 0;
        while (k < queue.length && queue[k]!.chi2 <= cand.chi2) k++;
        queue.splice(k, 0, cand);
        continue;
      }
    }
    chosen.push(cand);
  }
  return chosen;
}

/**
 * Indices of the `count` lowest local minima of y (a point no higher than its three neighbours on
 * each side), lowest first. A bounded insertion list: noise gives thousands of minima per curve,
 * and most are rejected by one comparison with the current worst kept.
 */
function lowestLocalMinima(y: Float64Array, count: number): number[] {
  const kept: number[] = [];
  const n = y.length;
  for (let i = 0; i < n; i++) {
    const v = y[i]!;
    if (kept.length === count && v >= y[kept[count - 1]!]!) continue;
    let isMin = true;
    for (let k = 1; k <= 3 && isMin; k++) {
      if (i - k >= 0 && y[i - k]! < v) isMin = false;
      if (i + k < n && y[i + k]! < v) isMin = false;
    }
    if (!isMin) continue;
    let at = kept.length;
    while (at > 0 && y[kept[at - 1]!]! > v) at--;
    kept.splice(at, 0, i);
    if (kept.length > count) kept.pop();
  }
  return kept;
}
