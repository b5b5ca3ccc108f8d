/** A spectrum on the global log10-λ grid: pixel i sits at global index g0 + i. */
export interface LogGridSpectrum {
  /** log10 step, dex. */
  step: number;
  /** Global index of pixel 0 (log10 λ = g0·step). */
  g0: number;
  /** Mean flux density in each output pixel (flux units). */
  flux: Float64Array;
  /** Inverse variance of that mean; 0 where no input pixel contributed. */
  ivar: Float64Array;
}

/** Most pixels of the log grid a spectrum is resampled onto: ten times the 5 dex of the widest allowed axis on the finest step. */
export const MAX_GRID_PIXELS = 2_000_000;

/**
 * Rebinning onto the log10-λ grid: every input pixel is a bin whose edges are halfway to its
 * neighbours; each output pixel takes the mean of the flux densities it covers, weighted by overlap
 * (Å) × inverse variance. Where the errors within an output pixel are equal this is the
 * flux-conserving overlap mean (∫f dλ preserved); where they differ — a near-infrared arm sampled
 * at 10 km/s puts seven native pixels in one 69 km/s pixel, and one of them may sit on a water-band
 * residual with a thousand times the σ — the good pixels are not thrown away with the bad. The
 * variance of the weighted mean is Σ u_k² σ_k² / (Σ u_k)² with u_k = o_k/σ_k²; pixels with ivar 0
 * (masked) do not contribute.
 *
 * @param wavelength input wavelength, Å, strictly increasing
 * @param flux input flux density
 * @param ivar input inverse variance (0 = unusable)
 * @param step output log10 step, dex
 */
export function resampleToLogGrid(wavelength: Float64Array, flux: Float64Array, ivar: Float64Array, step: number): LogGridSpectrum {
  const n = wavelength.length;
  const edge = (i: number) => {
    if (i <= 0) return wavelength[0]! - 0.5 * (wavelength[1]! - wavelength[0]!);
    if (i >= n) return wavelength[n - 1]! + 0.5 * (wavelength[n - 1]! - wavelength[n - 2]!);
    return 0.5 * (wavelength[i - 1]! + wavelength[i]!);
  };
  const lo = Math.max(edge(0), 1e-3);
  const hi = edge(n);
  const g0 = Math.ceil(Math.log10(lo) / step - 0.5);
  const g1 = Math.floor(Math.log10(hi) / step - 0.5);
  const m = Math.max(0, g1 - g0 + 1);
  // Checked before anything is allocated: readers keep wavelengths within 100 Å – 1 mm (5 dex,
  // 200,000 pixels at the finest 'native' step), so only a caller's own step or axis gets here.
  if (!(m <= MAX_GRID_PIXELS)) {
    throw new RangeError(
      `The log grid would have ${m} pixels (${lo.toPrecision(6)} – ${hi.toPrecision(6)} Å at ${step} dex per pixel), more than the ${MAX_GRID_PIXELS.toLocaleString('en-US')} allowed; check the wavelengths and the grid step.`,
    );
  }
  const sumF = new Float64Array(m);
  const sumW = new Float64Array(m);
  const sumV = new Float64Array(m);
  const sumU = new Float64Array(m);
  const edges = Float64Array.from({ length: m + 1 }, (_, j) => 10 ** ((g0 + j - 0.5) * step));
  const outEdge = (j: number) => edges[j]!;
  let j = 0;
  for (let i = 0; i < n && j < m; i++) {
    const a = Math.max(edge(i), lo);
    const b = edge(i + 1);
    if (!(ivar[i]! > 0) || b <= a) continue;
    while (j < m && outEdge(j + 1) <= a) j++;
    let k = j;
    while (k < m && outEdge(k) < b) {
      const overlap = Math.min(b, outEdge(k + 1)) - Math.max(a, outEdge(k));
      if (overlap > 0) {
        const u = overlap * ivar[i]!;
        sumF[k]! += u * flux[i]!;
        sumU[k]! += u;
        sumW[k]! += overlap;
        sumV[k]! += u * overlap;
      }
      k++;
    }
  }
  const outFlux = new Float64Array(m);
  const outIvar = new Float64Array(m);
  for (let k = 0; k < m; k++) {
    const width = outEdge(k + 1) - outEdge(k);
    // Pixels only partly covered by good data are dropped: their mean would be biased at edges.
    if (sumW[k]! > 0.5 * width && sumV[k]! > 0) {
      outFlux[k] = sumF[k]! / sumU[k]!;
      outIvar[k] = (sumU[k]! * sumU[k]!) / sumV[k]!;
    }
  }
  return { step, g0, flux: outFlux, ivar: outIvar };
}
