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
}

/** Minima closer than this (pixels, ≈ 1000 km/s at 1e-4 dex) are one solution. */
export const DISTINCT_PX = 15;

/**
 * Ranked distinct χ² minima over all template curves. Each minimum is refined by a parabola
 * through its three lowest points; the 1σ error is where χ² rises by 1 on that parabola,
 * σ_s = √(2/χ²''), converted to z with dz = (1+z)·ln10·step·σ_s.
 */
export function findSolutions(curves: TemplateCurve[], step: number, maxSolutions: number): RawSolution[] {
  const candidates: RawSolution[] = [];
  for (const c of curves) {
    const y = c.chi2;
    const mins: number[] = [];
    for (let i = 0; i < y.length; i++) {
      const v = y[i]!;
      let isMin = true;
      for (let k = 1; k <= 3 && isMin; k++) {
        if (i - k >= 0 && y[i - k]! < v) isMin = false;
        if (i + k < y.length && y[i + k]! < v) isMin = false;
      }
      if (isMin) mins.push(i);
    }
    mins.sort((a, b) => y[a]! - y[b]!);
    for (const i of mins.slice(0, 4 * maxSolutions + 4)) {
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
  const chosen: RawSolution[] = [];
  for (const cand of candidates) {
    if (chosen.some((s) => Math.abs(s.shift - cand.shift) <= DISTINCT_PX)) continue;
    chosen.push(cand);
    if (chosen.length >= maxSolutions) break;
  }
  return chosen;
}
