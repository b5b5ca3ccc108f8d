export type SmoothingKind = 'none' | 'boxcar' | 'gaussian';

export interface Smoothing {
  kind: SmoothingKind;
  /** Boxcar: full width in pixels; Gaussian: FWHM in pixels. */
  width: number;
}

/**
 * Smoothed copy of `flux` (the input is never touched). Masked and non-finite pixels are left out
 * of every average so a bad pixel cannot bleed into its neighbours; a pixel with no valid
 * neighbour stays NaN. Boxcar is a running sum (O(n)); the Gaussian is truncated at ±3σ.
 *
 * @example smoothFlux(Float32Array.of(0, 3, 0), new Uint8Array(3), { kind: 'boxcar', width: 3 })[1] // 1
 */
export function smoothFlux(flux: Float32Array, mask: Uint8Array, s: Smoothing, out = new Float32Array(flux.length)): Float32Array {
  const n = flux.length;
  if (s.kind === 'none' || s.width < 2) {
    out.set(flux);
    return out;
  }
  if (s.kind === 'boxcar') {
    const half = Math.floor(s.width / 2);
    let sum = 0;
    let count = 0;
    const ok = (j: number) => mask[j] === 0 && Number.isFinite(flux[j]!);
    for (let j = 0; j < Math.min(n, half + 1); j++) if (ok(j)) (sum += flux[j]!), count++;
    for (let i = 0; i < n; i++) {
      out[i] = count > 0 ? sum / count : Number.NaN;
      const enter = i + half + 1;
      const leave = i - half;
      if (enter < n && ok(enter)) (sum += flux[enter]!), count++;
      if (leave >= 0 && ok(leave)) (sum -= flux[leave]!), count--;
    }
    return out;
  }
  const sigma = s.width / 2.3548;
  const half = Math.max(1, Math.ceil(3 * sigma));
  const kernel = new Float64Array(2 * half + 1);
  for (let k = -half; k <= half; k++) kernel[k + half] = Math.exp(-0.5 * (k / sigma) ** 2);
  for (let i = 0; i < n; i++) {
    let num = 0;
    let den = 0;
    const lo = Math.max(0, i - half);
    const hi = Math.min(n - 1, i + half);
    for (let j = lo; j <= hi; j++) {
      const f = flux[j]!;
      if (mask[j] !== 0 || !Number.isFinite(f)) continue;
      const w = kernel[j - i + half]!;
      num += w * f;
      den += w;
    }
    out[i] = den > 0 ? num / den : Number.NaN;
  }
  return out;
}
