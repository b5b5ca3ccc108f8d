/**
 * Removes the slowly varying continuum: subtracts a running mean of `width` pixels (a boxcar,
 * computed with prefix sums). The filter is linear and shift-invariant, so applying it to the data
 * and to each rest-frame template component gives a model that stays an exact linear combination
 * of filtered components at every redshift; this is what stands in for free low-order continuum
 * terms in the χ² (see docs/decisions/engine-scan.md).
 *
 * Data (`valid` given): masked pixels are first filled by linear interpolation so gaps do not drag
 * the running mean, and beyond the first and last usable pixels the spectrum is continued by point
 * reflection about the mean of its outermost EDGE_ANCHOR·width/2 pixels. A truncated mean at the
 * ends lags a sloped or curved continuum by up to half its change over the window, which leaves a
 * ramp that lines just inside (or, through the filter's sidelobes, just outside) the edge could
 * "explain"; the point reflection continues a straight continuum exactly. Templates cover the full
 * rest range and are filtered without it.
 *
 * @param values input samples
 * @param width boxcar width in pixels (odd)
 * @param valid optional 1/0 usability per sample (data)
 * @returns filtered copy
 */
export function highPass(values: Float64Array, width: number, valid?: Uint8Array): Float64Array {
  const n = values.length;
  const half = Math.floor(width / 2);
  const source = valid ? extendByReflection(fillGaps(values, valid), valid, half) : values;
  const pad = valid ? half : 0;
  const m = source.length;
  const prefix = new Float64Array(m + 1);
  for (let j = 0; j < m; j++) prefix[j + 1] = prefix[j]! + source[j]!;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const j = i + pad;
    const a = Math.max(0, j - half);
    const b = Math.min(m, j + half + 1);
    out[i] = values[i]! - (prefix[b]! - prefix[a]!) / (b - a);
  }
  return out;
}

/**
 * Fraction of the half-width averaged for the reflection anchor at each end: 0.2–0.5 gave the same
 * real-spectra tables (0.05 is too noisy: faint SDSS galaxies moved to z ≈ 1.85); 0.35 is used.
 */
export const EDGE_ANCHOR = 0.35;

/** `filled` padded by `half` pixels on each side, continued beyond the usable range by point reflection. */
function extendByReflection(filled: Float64Array, valid: Uint8Array, half: number): Float64Array {
  const n = filled.length;
  let first = 0;
  while (first < n && !valid[first]) first++;
  let last = n - 1;
  while (last > first && !valid[last]) last--;
  const out = new Float64Array(n + 2 * half);
  if (first > last) {
    out.set(filled, half);
    return out;
  }
  let q = Math.max(5, Math.round(half * EDGE_ANCHOR));
  const meanOf = (from: number, to: number) => {
    let s = 0;
    for (let i = from; i <= to; i++) s += filled[i]!;
    return s / (to - from + 1);
  };
  if (last - first + 1 < q) q = last - first + 1;
  const lowAnchor = meanOf(first, first + q - 1);
  const highAnchor = meanOf(last - q + 1, last);
  for (let j = 0; j < out.length; j++) {
    const i = j - half;
    // Reflection about the anchors' centres (first + (q−1)/2 and last − (q−1)/2), so a straight
    // continuum continues exactly.
    if (i < first) out[j] = 2 * lowAnchor - filled[Math.min(last, 2 * first + q - 1 - i)]!;
    else if (i > last) out[j] = 2 * highAnchor - filled[Math.max(first, 2 * last - q + 1 - i)]!;
    else out[j] = filled[i]!;
  }
  return out;
}

function fillGaps(values: Float64Array, valid: Uint8Array): Float64Array {
  const n = values.length;
  const out = Float64Array.from(values);
  let last = -1;
  for (let i = 0; i <= n; i++) {
    if (i < n && !valid[i]) continue;
    const left = last >= 0 ? values[last]! : i < n ? values[i]! : 0;
    const right = i < n ? values[i]! : left;
    for (let k = last + 1; k < i; k++) {
      const t = last >= 0 && i < n ? (k - last) / (i - last) : 0;
      out[k] = left + t * (right - left);
    }
    last = i;
  }
  return out;
}
