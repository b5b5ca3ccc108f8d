import { sampleMedian } from './sample-median';
import type { Smoothing } from './smooth';

/** Below this median S/N per pixel the plot starts smoothed. */
export const SMOOTH_BELOW_SNR = 3;
/** Bounds of the default boxcar, pixels: at least 3 to help at all, at most 9 so lines a few pixels across survive. */
const MIN_WIDTH = 3;
const MAX_WIDTH = 9;

/**
 * Median S/N per pixel: the median of flux / σ over unmasked pixels with a finite flux and a
 * known positive σ. Null when no pixel has both (e.g. no error column).
 *
 * @example medianSnrPerPixel(Float32Array.of(2, 4, 6), Float32Array.of(1, 2, 1), new Uint8Array(3)) // 2
 */
export function medianSnrPerPixel(flux: Float32Array, error: Float32Array, mask: Uint8Array): number | null {
  return sampleMedian(
    flux.length,
    (i) => flux[i]! / error[i]!,
    (i) => mask[i] === 0 && Number.isFinite(flux[i]!) && error[i]! > 0,
  );
}

/**
 * The smoothing a spectrum opens with. At a median S/N per pixel of 3 or more (or unknown), none.
 * Below it, a boxcar of N pixels, N = (3 / S/N)² — averaging N independent pixels raises the S/N
 * by √N, so the median smoothed pixel reaches S/N ≈ 3 — rounded up to an odd N (centred on its
 * pixel), at least 3 and at most 9 pixels. At S/N 2 that is 3 pixels, at 1.5 five, at 1 or below nine.
 *
 * @example defaultSmoothing(2) // { kind: 'boxcar', width: 3, unit: 'pixels' }
 */
export function defaultSmoothing(snr: number | null): Smoothing {
  if (snr === null || !(snr < SMOOTH_BELOW_SNR)) return { kind: 'none', width: 5, unit: 'pixels' };
  const wanted = snr > 0 ? Math.ceil((SMOOTH_BELOW_SNR / snr) ** 2 - 1e-9) : MAX_WIDTH;
  const odd = wanted % 2 === 0 ? wanted + 1 : wanted;
  return { kind: 'boxcar', width: Math.min(MAX_WIDTH, Math.max(MIN_WIDTH, odd)), unit: 'pixels' };
}
