/**
 * The χ²(z) strip plots Δχ² = χ²(z) − χ²(best), the best being the lowest χ² of any class at any z.
 *
 * Up to the knee the scale is linear: Δχ² = 25 is 5σ for one fitted parameter with Gaussian
 * errors (common practice), so every minimum a reader should weigh sits in the linear part, where
 * depths compare by eye. Beyond it the scale is asinh (logarithmic far out), so a curve ranging
 * over 10⁵ does not squash the minima into the bottom pixel row. Values above the clip are drawn
 * at the clip: at Δχ² > 10⁴ a redshift is ruled out and its exact value does not matter, while
 * the engine's other solutions (often a few hundred to a few thousand above the best on faint
 * spectra) still show as dips below it.
 */
export const DELTA_CHI2_KNEE = 25;
export const DELTA_CHI2_CLIP = 10_000;

/**
 * Height on the strip for a Δχ² (arbitrary units, 0 at the best fit): K·asinh(Δχ²/K) with
 * K = DELTA_CHI2_KNEE, after clipping to [0, DELTA_CHI2_CLIP]. Within 1 % of linear below Δχ² ≈ 6,
 * within 12 % at the knee.
 *
 * @example deltaChi2Height(0) // 0
 */
export function deltaChi2Height(delta: number): number {
  const d = Math.min(DELTA_CHI2_CLIP, Math.max(0, delta));
  return DELTA_CHI2_KNEE * Math.asinh(d / DELTA_CHI2_KNEE);
}

/** The Δχ² of a height on the strip (the inverse of deltaChi2Height inside the clip). */
export const deltaChi2AtHeight = (h: number) => DELTA_CHI2_KNEE * Math.sinh(h / DELTA_CHI2_KNEE);

/** Axis ticks, as Δχ² values: dense in the linear part, sparse in the compressed one. */
export const DELTA_CHI2_TICKS = [0, 25, 100, 1000, 10_000] as const;
