/** Default step of the log10-wavelength grid: 1e-4 dex ≈ 69 km/s per pixel. */
export const DEFAULT_LOG_STEP = 1e-4;

/** Speed of light, km/s. */
export const C_KMS = 299792.458;

/**
 * Every grid in the engine is anchored at log10 λ = 0, so pixel g has log10 λ = g·step. Spectra and
 * templates on the same step then line up exactly and a redshift is an integer shift
 * s = log10(1+z)/step plus a sub-pixel refinement; templates can be prepared once and reused.
 */
export function gridIndex(wavelengthA: number, step: number): number {
  return Math.log10(wavelengthA) / step;
}

/** Wavelength (Å) at fractional global grid position g. */
export function gridWavelength(g: number, step: number): number {
  return 10 ** (g * step);
}

/** Redshift of a fractional pixel shift s on a grid of the given step. */
export function shiftToZ(s: number, step: number): number {
  return 10 ** (s * step) - 1;
}

/** Fractional pixel shift of a redshift. */
export function zToShift(z: number, step: number): number {
  return Math.log10(1 + z) / step;
}
