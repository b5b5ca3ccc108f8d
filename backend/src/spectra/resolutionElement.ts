import { C_KMS } from './logGrid';

/**
 * Pixels per resolution element (FWHM) assumed for a reduced 1D spectrum. Our files carry no
 * resolving power (no header R is read anywhere), so the resolution is taken from the data's own
 * pixel scale at Nyquist sampling: two pixels per FWHM. Common practice for reduced spectra is 2–3
 * pixels per FWHM; 2 is the smaller, so the floor it gives is the less conservative one.
 */
export const PIXELS_PER_RESOLUTION = 2;

/** FWHM of a Gaussian over its σ, 2√(2 ln 2). */
const FWHM_PER_SIGMA = 2 * Math.sqrt(2 * Math.LN2);

/** The resolution element of a spectrum as Redward derives it, with the words that say how. */
export interface ResolutionElement {
  /** Median pixel width, km/s (c·Δλ/λ over the usable pixels). */
  pixelKms: number;
  /** Resolution FWHM, km/s: PIXELS_PER_RESOLUTION × pixelKms. */
  fwhmKms: number;
  /** How it was obtained, for exports and the reading form. */
  from: string;
}

/**
 * The resolution element from the pixel scale of vacuum (or air) wavelengths in Å, strictly
 * increasing: the median c·Δλ/λ of neighbouring pixels (masked pixels count too: they are still
 * pixels of the detector). Example: a log-uniform grid of 1e-4 dex gives pixelKms ≈ 69.0 and
 * fwhmKms ≈ 138.1. Throws a RangeError for fewer than two pixels.
 */
export function resolutionElement(wavelength: Float64Array): ResolutionElement {
  const n = wavelength.length;
  if (n < 2) throw new RangeError('A resolution element needs at least two pixels.');
  const widths = new Float64Array(n - 1);
  for (let i = 0; i < n - 1; i++) widths[i] = (wavelength[i + 1]! - wavelength[i]!) / wavelength[i]!;
  widths.sort();
  const mid = (n - 1) >> 1;
  const median = (n - 1) % 2 === 1 ? widths[mid]! : (widths[mid - 1]! + widths[mid]!) / 2;
  const pixelKms = C_KMS * median;
  return {
    pixelKms,
    fwhmKms: PIXELS_PER_RESOLUTION * pixelKms,
    from: `pixel scale of the data (median ${pixelKms.toFixed(1)} km/s per pixel), ${PIXELS_PER_RESOLUTION} pixels per resolution FWHM assumed`,
  };
}

/**
 * The smallest redshift error a reading can claim on this spectrum: the σ of a Gaussian resolution
 * element, (1 + z)·FWHM/(2.355 c). A comb placed by eye cannot do better than a fraction of the
 * resolution element, and the engine's curvature error can be far smaller at high S/N.
 * Example: z = 1, FWHM 138.1 km/s → 3.91e-4.
 */
export function resolutionZFloor(z: number, fwhmKms: number): number {
  return ((1 + z) * fwhmKms) / (FWHM_PER_SIGMA * C_KMS);
}

/**
 * A reading's error: the submitted (engine) error widened by the resolution floor in quadrature,
 * so it is never below the floor; with no submitted error, the floor itself.
 */
export function widenByResolution(zErr: number | null | undefined, floor: number): number {
  return zErr !== null && zErr !== undefined && zErr > 0 ? Math.hypot(zErr, floor) : floor;
}
