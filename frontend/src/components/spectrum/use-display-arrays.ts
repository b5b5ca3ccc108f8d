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

// The latest smoothed flux per spectrum, so the spectrum prepared ahead (the next one in a queue)
// and the same spectrum on screen share one array.
const smoothed = new WeakMap<SpectrumArrays, { key: string; flux: Float32Array }>();

/**
 * The flux as shown: the stored flux itself without smoothing, else a new smoothed array (in
 * pixels, or in km/s converted with each pixel's own velocity width), made once per spectrum and
 * smoothing. The stored arrays are never altered.
 */
export function displayFlux(arrays: SpectrumArrays, smoothing: Smoothing): Float32Array {
  if (smoothing.kind === 'none' || arrays.pixels < 2) return arrays.flux;
  const key = `${smoothing.kind} ${smoothing.width} ${smoothing.unit}`;
  const hit = smoothed.get(arrays);
  if (hit && hit.key === key) return hit.flux;
  const flux = smoothFlux(arrays.flux, arrays.mask, smoothing.kind, smoothingWidths(smoothing, arrays.wavelength));
  smoothed.set(arrays, { key, flux });
  return flux;
}

/** A model is drawn only when it has one value per pixel. */
export const displayModel = (arrays: SpectrumArrays, solutionModel: Float32Array | null) => (solutionModel !== null && solutionModel.length === arrays.pixels ? solutionModel : null);

/** The display arrays of a spectrum, e.g. of the next one in a queue, outside React. */
export const displayArraysOf = (arrays: SpectrumArrays, smoothing: Smoothing, solutionModel: Float32Array | null = null): DisplayArrays => ({
  source: arrays,
  flux: displayFlux(arrays, smoothing),
  model: displayModel(arrays, solutionModel),
});

/** The display arrays, new only when the spectrum, the smoothing or the model changes. */
export function useDisplayArrays(arrays: SpectrumArrays, smoothing: Smoothing, solutionModel: Float32Array | null = null): DisplayArrays {
  const flux = useMemo(() => displayFlux(arrays, smoothing), [arrays, smoothing]);
  const model = displayModel(arrays, solutionModel);
  return useMemo(() => ({ source: arrays, flux, model }), [arrays, flux, model]);
}
