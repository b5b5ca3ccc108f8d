/** At most this many samples are sorted: percentiles of a 100 000-pixel window stay well under a millisecond. */
const MAX_SAMPLES = 4096;
const scratch = new Float64Array(MAX_SAMPLES);

/**
 * A flux range from the lo–hi percentiles of the unmasked, finite pixels in [i0, i1), padded by
 * 8 % of the span, so a cosmic ray or a sky residual does not flatten the plot. Null when no
 * pixel qualifies.
 *
 * @example robustRange(Float32Array.of(1, 2, 3, 1000), new Uint8Array(4), 0, 4, 0, 0.5) // [0.84, 3.16]
 */
export function robustRange(values: Float32Array, mask: Uint8Array, i0: number, i1: number, lo = 0.01, hi = 0.99): [number, number] | null {
  if (lo <= 0 && hi >= 1) return paddedExtent(values, mask, i0, i1);
  const span = Math.max(0, i1 - i0);
  const stride = Math.max(1, Math.floor(span / MAX_SAMPLES));
  let m = 0;
  for (let i = i0; i < i1 && m < MAX_SAMPLES; i += stride) {
    const v = values[i]!;
    if (mask[i] === 0 && Number.isFinite(v)) scratch[m++] = v;
  }
  if (m === 0) return null;
  const sorted = scratch.subarray(0, m).sort();
  const a = sorted[Math.floor(lo * (m - 1))]!;
  const b = sorted[Math.ceil(hi * (m - 1))]!;
  const pad = (b - a || Math.abs(a) || 1) * 0.08;
  return [a - pad, b + pad];
}

/** The full extent (the 0th and 100th percentiles) needs no sort: one pass over every pixel. */
function paddedExtent(values: Float32Array, mask: Uint8Array, i0: number, i1: number): [number, number] | null {
  let a = Infinity;
  let b = -Infinity;
  for (let i = Math.max(0, i0); i < i1; i++) {
    const v = values[i]!;
    if (mask[i] !== 0 || !Number.isFinite(v)) continue;
    if (v < a) a = v;
    if (v > b) b = v;
  }
  if (a > b) return null;
  const pad = (b - a || Math.abs(a) || 1) * 0.08;
  return [a - pad, b + pad];
}

/** First index with wavelength[i] ≥ value (binary search; wavelengths increase). */
export function lowerBound(wavelength: Float64Array, value: number): number {
  let lo = 0;
  let hi = wavelength.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (wavelength[mid]! < value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
