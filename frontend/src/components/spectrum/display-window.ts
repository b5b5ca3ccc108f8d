import { maskRuns } from './mask-runs';
import { columnBand, columnMinMax, columnX, pixelColumns } from './pixel-columns';
import { lowerBound } from './robust-range';
import type { DisplayArrays } from './use-display-arrays';

/** What the plot draws for one x window: columns in the order of the spectrum plot's series. */
export interface WindowArrays {
  x: Float64Array;
  flux: Array<number | null>;
  bandLow: Array<number | null>;
  bandHigh: Array<number | null>;
  sky: Array<number | null>;
  model: Array<number | null>;
  /** Masked stretches to shade, as wavelength intervals [start, end, …]; at most one per screen column. */
  masked: Float64Array;
  /** True when every pixel in the window is drawn as it is (no decimation). */
  exact: boolean;
}

/** Up to this many pixels per screen column are drawn as they are; beyond it, min/max per column. */
export const EXACT_PIXELS_PER_COLUMN = 2;

/**
 * The display arrays reduced to the window [xMin, xMax] (Å) drawn `columns` device pixels wide.
 * Pixels just outside the window are kept so lines run to the edges. When the window holds at
 * most 2 pixels per column every pixel is kept with its exact value; otherwise each column keeps
 * the minimum and maximum of flux, sky and model (in the order they occur) and the error band its
 * lowest lower edge and highest upper edge (shown flux ∓ the raw 1σ; an unknown σ closes the band
 * onto the flux), so no spike and no part of the band is lost. Masked flux and band values become
 * gaps (null) — the shading says why — and leave the column extremes alone. The display arrays
 * themselves are read, never changed.
 */
export function displayWindow(d: DisplayArrays, xMin: number, xMax: number, columns: number): WindowArrays {
  const { wavelength: w, mask, error, sky } = d.source;
  const n = w.length;
  // One pixel beyond each edge, so lines run to the edges of the plot.
  const i0 = Math.max(0, lowerBound(w, xMin) - 1);
  const last = lowerBound(w, xMax);
  const i1 = Math.min(n, (last < n && w[last] === xMax ? last + 1 : last) + 1);
  const span = xMax - xMin;
  if (i1 - i0 <= EXACT_PIXELS_PER_COLUMN * columns || !(span > 0)) {
    const count = Math.max(0, i1 - i0);
    const flux = new Array<number | null>(count);
    const bandLow = new Array<number | null>(count);
    const bandHigh = new Array<number | null>(count);
    for (let i = i0; i < i1; i++) {
      const f = d.flux[i]!;
      const ok = mask[i] === 0 && Number.isFinite(f);
      const e = error[i]!;
      const half = Number.isFinite(e) ? Math.abs(e) : 0;
      flux[i - i0] = ok ? f : null;
      bandLow[i - i0] = ok ? f - half : null;
      bandHigh[i - i0] = ok ? f + half : null;
    }
    return {
      x: w.slice(i0, i1),
      flux,
      bandLow,
      bandHigh,
      sky: sky ? finiteOrNull(sky, i0, i1) : nulls(count),
      model: d.model ? finiteOrNull(d.model, i0, i1) : nulls(count),
      masked: maskRuns(w, mask, i0, i1),
      exact: true,
    };
  }
  const cols = pixelColumns(w, i0, i1, xMin, xMax, columns);
  const band = columnBand(d.flux, error, cols, mask);
  return {
    x: columnX(w, cols),
    flux: columnMinMax(d.flux, cols, mask),
    bandLow: band.low,
    bandHigh: band.high,
    sky: sky ? columnMinMax(sky, cols, null) : nulls(cols.points),
    model: d.model ? columnMinMax(d.model, cols, null) : nulls(cols.points),
    masked: maskRuns(w, mask, i0, i1, span / columns),
    exact: false,
  };
}

function finiteOrNull(y: Float32Array, i0: number, i1: number): Array<number | null> {
  const out = new Array<number | null>(i1 - i0);
  for (let i = i0; i < i1; i++) out[i - i0] = Number.isFinite(y[i]!) ? y[i]! : null;
  return out;
}

const nulls = (length: number) => new Array<number | null>(length).fill(null);
