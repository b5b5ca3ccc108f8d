import { pixelVelocityWidths } from './velocity';

export type SmoothingKind = 'none' | 'boxcar' | 'gaussian';
export type SmoothingUnit = 'pixels' | 'km/s';

export interface Smoothing {
  kind: SmoothingKind;
  /** Boxcar: full width; Gaussian: FWHM — in pixels, or in km/s converted pixel by pixel. */
  width: number;
  unit: SmoothingUnit;
}

/** The widest smoothing, in pixels, in either unit: wider would blur lines away and cost more than a frame. */
export const MAX_SMOOTHING_PIXELS = 101;

/**
 * A smoothing width in pixels at every pixel. In pixels it is the same everywhere; in km/s each
 * pixel's own velocity width divides it (pixelVelocityWidths), so on a linear grid the kernel
 * covers more pixels towards the red, where pixels are narrower in velocity. Widths are cut to
 * MAX_SMOOTHING_PIXELS (a km/s width chosen on a coarse spectrum may be too wide for a fine one).
 *
 * @example smoothingWidths({ kind: 'boxcar', width: 300, unit: 'km/s' }, Float64Array.of(5000, 5001, 5002))[1] // 5.004 (300 / 59.95 km/s)
 */
export function smoothingWidths(s: Smoothing, wavelength: Float64Array): number | Float64Array {
  if (!(s.width > 0)) throw new RangeError(`A smoothing width must be positive (got ${s.width} ${s.unit}).`);
  if (s.unit === 'pixels') return Math.min(s.width, MAX_SMOOTHING_PIXELS);
  const dv = pixelVelocityWidths(wavelength);
  const out = new Float64Array(dv.length);
  for (let i = 0; i < dv.length; i++) out[i] = Math.min(s.width / dv[i]!, MAX_SMOOTHING_PIXELS);
  return out;
}

/** A width carried from one unit to the other at the grid's median pixel velocity width (km/s per pixel). */
export function convertSmoothingWidth(width: number, from: SmoothingUnit, to: SmoothingUnit, kmsPerPixel: number): number {
  if (from === to) return width;
  return from === 'pixels' ? width * kmsPerPixel : width / kmsPerPixel;
}

const GAUSSIAN_FWHM_PER_SIGMA = 2 * Math.sqrt(2 * Math.LN2);
/** Gaussian kernels are shared between pixels whose σ agree within 1 % (one kernel on a log grid). */
const SIGMA_STEP = Math.log(1.01);

/**
 * Smoothed copy of `flux` (the input is never touched); `width` in pixels, one number or one per
 * pixel (smoothingWidths). Masked and non-finite pixels are left out of every average so a bad
 * pixel cannot bleed into its neighbours; a pixel with no valid neighbour stays NaN. The boxcar
 * averages the pixels within ±⌊width/2⌋ (prefix sums, O(n) at any width); the Gaussian has the
 * width as FWHM and is truncated at ±3σ.
 *
 * @example smoothFlux(Float32Array.of(0, 3, 0), new Uint8Array(3), 'boxcar', 3)[1] // 1
 */
export function smoothFlux(flux: Float32Array, mask: Uint8Array, kind: SmoothingKind, width: number | Float64Array, out = new Float32Array(flux.length)): Float32Array {
  const n = flux.length;
  if (typeof width !== 'number' && width.length !== n) throw new RangeError(`Expected ${n} smoothing widths, one per pixel (got ${width.length}).`);
  const widthAt = typeof width === 'number' ? () => width : (i: number) => width[i]!;
  if (kind === 'none' || (typeof width === 'number' && width < 2)) {
    out.set(flux);
    return out;
  }
  if (kind === 'boxcar') {
    const sums = new Float64Array(n + 1);
    const counts = new Int32Array(n + 1);
    for (let i = 0; i < n; i++) {
      const f = flux[i]!;
      const ok = mask[i] === 0 && Number.isFinite(f);
      sums[i + 1] = sums[i]! + (ok ? f : 0);
      counts[i + 1] = counts[i]! + (ok ? 1 : 0);
    }
    for (let i = 0; i < n; i++) {
      const half = Math.floor(widthAt(i) / 2);
      const lo = Math.max(0, i - half);
      const hi = Math.min(n, i + half + 1);
      const count = counts[hi]! - counts[lo]!;
      out[i] = count > 0 ? (sums[hi]! - sums[lo]!) / count : Number.NaN;
    }
    return out;
  }
  const kernels = new Map<number, Float64Array>();
  for (let i = 0; i < n; i++) {
    const w = widthAt(i);
    if (w < 2) {
      out[i] = mask[i] === 0 ? flux[i]! : Number.NaN;
      continue;
    }
    const bucket = Math.round(Math.log(w / GAUSSIAN_FWHM_PER_SIGMA) / SIGMA_STEP);
    let kernel = kernels.get(bucket);
    if (!kernel) {
      const sigma = Math.exp(bucket * SIGMA_STEP);
      const half = Math.max(1, Math.ceil(3 * sigma));
      kernel = new Float64Array(2 * half + 1);
      for (let k = -half; k <= half; k++) kernel[k + half] = Math.exp(-0.5 * (k / sigma) ** 2);
      kernels.set(bucket, kernel);
    }
    const half = (kernel.length - 1) / 2;
    let num = 0;
    let den = 0;
    const lo = Math.max(0, i - half);
    const hi = Math.min(n - 1, i + half);
    for (let j = lo; j <= hi; j++) {
      const f = flux[j]!;
      if (mask[j] !== 0 || !Number.isFinite(f)) continue;
      const k = kernel[j - i + half]!;
      num += k * f;
      den += k;
    }
    out[i] = den > 0 ? num / den : Number.NaN;
  }
  return out;
}
