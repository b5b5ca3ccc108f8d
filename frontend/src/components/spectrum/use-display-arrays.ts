import { useMemo } from 'react';
import type { SpectrumArrays } from '@/lib/decode-spectrum-data';
import { smoothFlux, smoothingWidths } from './smooth';
import type { Smoothing } from './smooth';

/**
 * What the plot draws, at full resolution: the flux as shown (smoothed or not) and the model of
 * the chosen solution. The error band (shown flux ± the raw 1σ), sky and mask come from `source`
 * and are reduced to the window on screen only when drawn (display-window.ts).
 */
export interface DisplayArrays {
  source: SpectrumArrays;
  flux: Float32Array;
  /** Best-fit model of a solution on the spectrum's pixels, or null when none is shown. */
  model: Float32Array | null;
}

/**
 * The stored arrays are never altered: smoothing (in pixels, or in km/s converted with each
 * pixel's own velocity width) makes a new flux array, and only when the spectrum or the smoothing
 * changes; without smoothing the stored flux is shown as it is.
 */
export function useDisplayArrays(arrays: SpectrumArrays, smoothing: Smoothing, solutionModel: Float32Array | null = null): DisplayArrays {
  const flux = useMemo(
    () => (smoothing.kind === 'none' || arrays.pixels < 2 ? arrays.flux : smoothFlux(arrays.flux, arrays.mask, smoothing.kind, smoothingWidths(smoothing, arrays.wavelength))),
    [arrays, smoothing],
  );
  const model = solutionModel !== null && solutionModel.length === arrays.pixels ? solutionModel : null;
  return useMemo(() => ({ source: arrays, flux, model }), [arrays, flux, model]);
}
