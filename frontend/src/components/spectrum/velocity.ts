/** Speed of light in km/s (exact, SI definition). */
export const SPEED_OF_LIGHT_KMS = 299_792.458;

/**
 * The velocity width of pixel i (km/s): c · (λ[i+1] − λ[i−1]) / (2 λ[i]), one-sided at the two
 * ends. Constant on a log-wavelength grid; on a linear grid it falls as 1/λ. The grid must have at
 * least two pixels and increase (pixelVelocityWidths checks).
 */
export function pixelVelocityWidth(wavelength: Float64Array, i: number): number {
  const n = wavelength.length;
  const lo = wavelength[i > 0 ? i - 1 : 0]!;
  const hi = wavelength[i < n - 1 ? i + 1 : n - 1]!;
  const span = i === 0 || i === n - 1 ? 1 : 2;
  return (SPEED_OF_LIGHT_KMS * (hi - lo)) / (span * wavelength[i]!);
}

/**
 * Every pixel's velocity width (km/s, see pixelVelocityWidth). Throws a sentence when the grid has
 * fewer than two pixels or does not increase.
 *
 * @example pixelVelocityWidths(Float64Array.of(5000, 5001, 5002))[1] // 59.946 (c · 2 Å / (2 · 5001 Å))
 */
export function pixelVelocityWidths(wavelength: Float64Array): Float64Array {
  checkGrid(wavelength);
  const out = new Float64Array(wavelength.length);
  for (let i = 0; i < out.length; i++) {
    const dv = pixelVelocityWidth(wavelength, i);
    if (!(dv > 0)) throw new RangeError(`Wavelengths must increase; they do not at pixel ${i} (${wavelength[i]} Å).`);
    out[i] = dv;
  }
  return out;
}

/**
 * The narrowest pixel in velocity (every pixel) and the median pixel (from at most 4,096 evenly
 * spaced pixels), in km/s: what a smoothing width in km/s is bounded and carried over by.
 */
export function pixelVelocitySummary(wavelength: Float64Array): { min: number; median: number } {
  checkGrid(wavelength);
  const n = wavelength.length;
  let min = Infinity;
  for (let i = 0; i < n; i++) {
    const dv = pixelVelocityWidth(wavelength, i);
    if (dv < min) min = dv;
  }
  if (!(min > 0)) throw new RangeError('Wavelengths must increase from pixel to pixel.');
  const stride = Math.max(1, Math.floor(n / 4096));
  const sample: number[] = [];
  for (let i = 0; i < n; i += stride) sample.push(pixelVelocityWidth(wavelength, i));
  sample.sort((a, b) => a - b);
  return { min, median: sample[sample.length >> 1]! };
}

function checkGrid(wavelength: Float64Array) {
  if (wavelength.length < 2) throw new RangeError(`A pixel's velocity width needs at least two pixels (got ${wavelength.length}).`);
}
