import { displayWindow } from './display-window';
import type { WindowArrays } from './display-window';
import { lowerBound, robustRange } from './robust-range';
import type { DisplayArrays } from './use-display-arrays';

/** A window of display arrays as the spectrum plot draws it: its reduced arrays and its flux range. */
export interface PreparedWindow {
  win: WindowArrays;
  /** Robust flux range of the pixels in the window (robust-range.ts), or null when none is usable. */
  yRange: [number, number] | null;
}

interface Entry extends PreparedWindow {
  source: DisplayArrays['source'];
  model: Float32Array | null;
  xMin: number;
  xMax: number;
  columns: number;
}

// The latest window per flux array (the shown flux, smoothed or not): dropped with the array.
const prepared = new WeakMap<Float32Array, Entry>();

/**
 * The window [xMin, xMax] (Å) of `d` reduced to `columns` device pixels (displayWindow) and its
 * flux range, computed once: a second call with the same arrays, window and width returns the
 * same result. The plot can so prepare the spectrum a reader will open next while they read the
 * current one (`prepareWindow` in idle time) and show it without the passes over its pixels.
 * The arrays are read, never changed; each flux array keeps only its latest window.
 */
export function preparedWindow(d: DisplayArrays, xMin: number, xMax: number, columns: number): PreparedWindow {
  const hit = prepared.get(d.flux);
  if (hit && hit.source === d.source && hit.model === d.model && hit.xMin === xMin && hit.xMax === xMax && hit.columns === columns) return hit;
  const { wavelength, mask } = d.source;
  const i0 = lowerBound(wavelength, xMin);
  const i1 = lowerBound(wavelength, xMax);
  const entry: Entry = {
    source: d.source,
    model: d.model,
    xMin,
    xMax,
    columns,
    win: displayWindow(d, xMin, xMax, columns),
    yRange: robustRange(d.flux, mask, i0, Math.max(i1, i0 + 1)),
  };
  prepared.set(d.flux, entry);
  return entry;
}
