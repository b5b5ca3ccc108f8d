import type { ScanCurves } from '../api/schemas';
import { deltaChi2Height } from './delta-chi2-scale';

/** χ²(z) per class on one shared z grid (uPlot wants one x column); null where a class was not searched. */
export interface Chi2StripData {
  z: Float64Array;
  classes: string[];
  /** One column per class: the height of Δχ² = χ² − the global minimum on the strip's scale (delta-chi2-scale.ts). */
  series: Array<Array<number | null>>;
  chi2Min: number;
}

/**
 * Merges the per-template curves into per-class curves on the union of their z grids, taking the
 * lowest χ² of a class's templates at each z (the class is as good as its best template), as
 * Δχ² above the best fit of any class, scaled and clipped for the strip.
 */
export function chi2Strip(curves: ScanCurves['curves']): Chi2StripData {
  const zs = new Set<number>();
  let chi2Min = Infinity;
  for (const c of curves) {
    for (const z of c.z) zs.add(z);
    for (const v of c.chi2) if (v < chi2Min) chi2Min = v;
  }
  const z = Float64Array.from(zs).sort();
  const index = new Map<number, number>();
  z.forEach((v, i) => index.set(v, i));
  const classes = [...new Set(curves.map((c) => c.class))];
  const deltas = classes.map(() => new Array<number | null>(z.length).fill(null));
  for (const c of curves) {
    const col = deltas[classes.indexOf(c.class)]!;
    for (let i = 0; i < c.z.length; i++) {
      const k = index.get(c.z[i]!)!;
      const v = c.chi2[i]! - chi2Min;
      const prev = col[k];
      if (prev == null || v < prev) col[k] = v;
    }
  }
  const series = deltas.map((col) => col.map((v) => (v == null ? null : deltaChi2Height(v))));
  return { z, classes, series, chi2Min: Number.isFinite(chi2Min) ? chi2Min : 0 };
}
