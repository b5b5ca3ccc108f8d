import { useMemo } from 'react';
import type { SpectrumArrays } from '@/lib/decode-spectrum-data';
import { smoothFlux } from './smooth';
import type { Smoothing } from './smooth';

/** What the plot draws: the (optionally smoothed) flux and the error band around it. */
export interface DisplayArrays {
  source: SpectrumArrays;
  flux: Float32Array;
  bandLow: Float32Array;
  bandHigh: Float32Array;
  sky: Float32Array;
  /** Best-fit model of a solution, or all NaN (hidden) when none is shown. */
  model: Float32Array;
  hasModel: boolean;
}

/**
 * Computed into new arrays only when the spectrum or the smoothing changes; the stored data are
 * never altered. The band follows the raw 1σ error around the shown flux; where the error is
 * unknown the band closes onto the flux rather than inventing a width.
 */
export function useDisplayArrays(arrays: SpectrumArrays, smoothing: Smoothing, solutionModel: Float32Array | null = null): DisplayArrays {
  const flux = useMemo(() => smoothFlux(arrays.flux, arrays.mask, smoothing), [arrays, smoothing]);
  const band = useMemo(() => {
    const n = flux.length;
    const lo = new Float32Array(n);
    const hi = new Float32Array(n);
    for (let i = 0; i < n; i++) {
      const e = arrays.error[i]!;
      const f = flux[i]!;
      const d = Number.isFinite(e) ? e : 0;
      lo[i] = f - d;
      hi[i] = f + d;
    }
    return { lo, hi };
  }, [arrays, flux]);
  // uPlot wants every series the same length; a spectrum without sky gets an empty (NaN) one, hidden.
  const sky = useMemo(() => arrays.sky ?? new Float32Array(arrays.pixels).fill(Number.NaN), [arrays]);
  const usableModel = solutionModel !== null && solutionModel.length === arrays.pixels ? solutionModel : null;
  const model = useMemo(() => usableModel ?? new Float32Array(arrays.pixels).fill(Number.NaN), [arrays, usableModel]);
  return useMemo(
    () => ({ source: arrays, flux, bandLow: band.lo, bandHigh: band.hi, sky, model, hasModel: usableModel !== null }),
    [arrays, flux, band, sky, model, usableModel],
  );
}
