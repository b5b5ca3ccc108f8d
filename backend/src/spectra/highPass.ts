/**
 * Removes the slowly varying continuum: subtracts a running mean of `width` pixels (a boxcar,
 * computed with prefix sums). The filter is linear and shift-invariant, so applying it to the data
 * and to each rest-frame template component gives a model that stays an exact linear combination
 * of filtered components at every redshift; this is what stands in for free low-order continuum
 * terms in the χ² (see docs/decisions/engine-scan.md). Masked pixels (valid = 0) are first filled by
 * linear interpolation so gaps do not drag the running mean.
 *
 * @param values input samples
 * @param width boxcar width in pixels (odd)
 * @param valid optional 1/0 usability per sample
 * @returns filtered copy
 */
export function highPass(values: Float64Array, width: number, valid?: Uint8Array): Float64Array {
  const n = values.length;
  const filled = valid ? fillGaps(values, valid) : values;
  const prefix = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) prefix[i + 1] = prefix[i]! + filled[i]!;
  const half = Math.floor(width / 2);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const a = Math.max(0, i - half);
    const b = Math.min(n, i + half + 1);
    out[i] = values[i]! - (prefix[b]! - prefix[a]!) / (b - a);
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
