/**
 * Estimates inverse variances when a file carries no uncertainties: σ at each pixel is the robust
 * scatter (1.4826 × median absolute deviation) of second differences in a window of ±halfWidth
 * pixels, scaled by 1/√6 because a second difference of white noise has variance 6σ². Second
 * differences cancel smooth continuum and slopes, so the estimate follows the noise, not the signal.
 *
 * @param flux flux values (any unit)
 * @param valid 1 where the pixel can be used
 * @param halfWidth half window in pixels
 * @returns ivar in flux units⁻² (0 where no estimate was possible)
 */
export function estimateIvar(flux: Float64Array, valid: Uint8Array, halfWidth = 25): Float64Array {
  const n = flux.length;
  const d2 = new Float64Array(n).fill(NaN);
  for (let i = 1; i < n - 1; i++) {
    if (valid[i - 1] && valid[i] && valid[i + 1]) d2[i] = Math.abs(flux[i - 1]! - 2 * flux[i]! + flux[i + 1]!);
  }
  const ivar = new Float64Array(n);
  // A stretch of smooth flux (a noise-free model, an interpolated gap, an extrapolated end) has
  // second differences near zero and would get an almost infinite weight that swamps the rest of
  // the spectrum: no estimate may fall below a quarter of the spectrum's median estimate.
  const floor = 0.25 * robustGlobalSigma(d2);
  // Windows move by `stride` pixels so the cost stays O(n · window / stride) on long spectra.
  const stride = Math.max(1, Math.floor(halfWidth / 2));
  const buf: number[] = [];
  let globalFallback = NaN;
  for (let c = 0; c < n; c += stride) {
    buf.length = 0;
    for (let k = Math.max(0, c - halfWidth); k <= Math.min(n - 1, c + halfWidth); k++) if (!Number.isNaN(d2[k]!)) buf.push(d2[k]!);
    let sigma = NaN;
    if (buf.length >= 5) {
      buf.sort((a, b) => a - b);
      // |d2| of Gaussian noise has median 0.6745·√6·σ.
      sigma = buf[buf.length >> 1]! / (0.6745 * Math.sqrt(6));
    }
    if (!(sigma > 0)) {
      if (Number.isNaN(globalFallback)) globalFallback = robustGlobalSigma(d2);
      sigma = globalFallback;
    }
    if (floor > 0 && sigma < floor) sigma = floor;
    const iv = sigma > 0 ? 1 / (sigma * sigma) : 0;
    for (let i = c; i < Math.min(n, c + stride); i++) ivar[i] = valid[i] ? iv : 0;
  }
  return ivar;
}

function robustGlobalSigma(d2: Float64Array): number {
  const vals = Array.from(d2).filter((v) => !Number.isNaN(v) && v > 0).sort((a, b) => a - b);
  if (vals.length === 0) return NaN;
  return vals[vals.length >> 1]! / (0.6745 * Math.sqrt(6));
}
