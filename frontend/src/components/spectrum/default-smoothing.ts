import { sampleMedian } from './sample-median';
import type { Smoothing } from './smooth';

/** Below this median S/N per pixel the plot starts smoothed. */
export const SMOOTH_BELOW_SNR = 3;
/** Bounds of the default boxcar, pixels: at least 3 to help at all, at most 9 so lines a few pixels across survive. */
const MIN_WIDTH = 3;
const MAX_WIDTH = 9;

/** The spectrum is cut into this many stretches of equal pixel count for its S/N (medianSnrPerPixel). */
const STRETCHES = 10;
/** Pixels sampled per stretch: the median of 1024 is within a few per cent of the full one. */
const SAMPLES_PER_STRETCH = 1024;

/**
 * Median S/N per pixel of the part of the spectrum that carries signal: the median of flux / σ
 * (unmasked pixels with a finite flux and a known positive σ) in each tenth of the pixels, and
 * the highest of those ten. A Lyman-break source is black blueward of its break by nature and an
 * emission-line source may have continuum over part of the range only; over the whole spectrum
 * their median would call a clear S/N 6 continuum noise. Null when no stretch has a usable pixel.
 *
 * @example medianSnrPerPixel(Float32Array.of(2, 4, 6), Float32Array.of(1, 2, 1), new Uint8Array(3)) // 6 (three stretches of one pixel)
 */
export function medianSnrPerPixel(flux: Float32Array, error: Float32Array, mask: Uint8Array): number | null {
  const n = flux.length;
  let best: number | null = null;
  for (let k = 0; k < STRETCHES; k++) {
    const i0 = Math.floor((k * n) / STRETCHES);
    const i1 = Math.floor(((k + 1) * n) / STRETCHES);
    if (i1 <= i0) continue;
    const m = sampleMedian(
      i1 - i0,
      (i) => flux[i0 + i]! / error[i0 + i]!,
      (i) => mask[i0 + i] === 0 && Number.isFinite(flux[i0 + i]!) && error[i0 + i]! > 0,
      SAMPLES_PER_STRETCH,
    );
    if (m !== null && (best === null || m > best)) best = m;
  }
  return best;
}

/**
 * The smoothing a spectrum opens with, from medianSnrPerPixel. At a median S/N per pixel of 3 or
 * more (or unknown), none.
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

// Per flux array: the next spectrum's S/N is found in idle time and read again when it is shown.
const snrCache = new WeakMap<Float32Array, number | null>();

/** medianSnrPerPixel of a spectrum's arrays, computed once per flux array. */
export function spectrumSnr(arrays: { flux: Float32Array; error: Float32Array; mask: Uint8Array }): number | null {
  if (snrCache.has(arrays.flux)) return snrCache.get(arrays.flux)!;
  const snr = medianSnrPerPixel(arrays.flux, arrays.error, arrays.mask);
  snrCache.set(arrays.flux, snr);
  return snr;
}
