/**
 * Pixels [i0, i1) of an increasing x grid grouped by the screen column they fall in when the window
 * [xMin, xMax] is drawn `width` columns wide. Pixels left of the window share column −1, pixels
 * right of it column `width`. Only non-empty columns are kept.
 */
export interface PixelColumns {
  /** First pixel of each non-empty column, then i1: `count + 1` entries. */
  starts: Int32Array;
  count: number;
  /** Points a decimated series has: one for a column holding a single pixel, two otherwise. */
  points: number;
}

/**
 * Groups the pixels of `x` (increasing, e.g. vacuum Å) by screen column, for min/max decimation.
 * One pass over the pixels; throws a sentence on an empty window or a width below one column.
 *
 * @example pixelColumns(Float64Array.of(0, 0.1, 0.2, 1.5, 2.5), 0, 5, 0, 3, 3) // starts [0, 3, 4, 5], count 3, points 4
 */
export function pixelColumns(x: Float64Array, i0: number, i1: number, xMin: number, xMax: number, width: number): PixelColumns {
  if (!(xMax > xMin)) throw new RangeError(`The window must have xMax > xMin (got ${xMin} to ${xMax}).`);
  if (!(width >= 1)) throw new RangeError(`A window must be at least one column wide (got ${width}).`);
  if (i0 < 0 || i1 > x.length || i1 < i0) throw new RangeError(`Pixels ${i0} to ${i1} are outside the ${x.length} pixels given.`);
  const columns = Math.floor(width);
  const scale = columns / (xMax - xMin);
  const starts = new Int32Array(Math.min(i1 - i0, columns + 2) + 1);
  let count = 0;
  let points = 0;
  let current = Number.NaN;
  let runStart = i0;
  for (let i = i0; i < i1; i++) {
    let c = Math.floor((x[i]! - xMin) * scale);
    if (c < 0) c = -1;
    else if (c >= columns) c = columns;
    if (c !== current) {
      if (count > 0) points += i - runStart > 1 ? 2 : 1;
      starts[count++] = i;
      current = c;
      runStart = i;
    }
  }
  if (count > 0) points += i1 - runStart > 1 ? 2 : 1;
  starts[count] = i1;
  return { starts, count, points };
}

/** The x of each decimated point: a column's first pixel, and its last when it holds more than one. */
export function columnX(x: Float64Array, cols: PixelColumns): Float64Array {
  const out = new Float64Array(cols.points);
  let o = 0;
  for (let k = 0; k < cols.count; k++) {
    const a = cols.starts[k]!;
    const b = cols.starts[k + 1]!;
    out[o++] = x[a]!;
    if (b - a > 1) out[o++] = x[b - 1]!;
  }
  return out;
}

/**
 * Min and max of `y` per column, in the order they occur, so a line through the points reaches
 * every extreme (a one-pixel spike survives). Masked (mask ≠ 0) and non-finite values are left
 * out; a column without a usable value gives null, which the plot draws as a gap.
 *
 * @example columnMinMax(Float32Array.of(1, 9, 2, 3), pixelColumns(Float64Array.of(0, 1, 2, 3), 0, 4, 0, 4, 1), null) // [1, 9]
 */
export function columnMinMax(y: ArrayLike<number>, cols: PixelColumns, mask: Uint8Array | null): Array<number | null> {
  const out = new Array<number | null>(cols.points);
  let o = 0;
  for (let k = 0; k < cols.count; k++) {
    const a = cols.starts[k]!;
    const b = cols.starts[k + 1]!;
    let lo = Infinity;
    let hi = -Infinity;
    let iLo = -1;
    let iHi = -1;
    // Inlined checks: this loop runs over every pixel in the window on each zoom, pan or new spectrum.
    for (let i = a; i < b; i++) {
      const v = y[i]!;
      if ((mask !== null && mask[i] !== 0) || v - v !== 0) continue; // masked, NaN or ±Infinity
      if (v < lo) (lo = v), (iLo = i);
      if (v > hi) (hi = v), (iHi = i);
    }
    if (b - a === 1) out[o++] = iLo >= 0 ? lo : null;
    else if (iLo < 0) (out[o++] = null), (out[o++] = null);
    else if (iLo <= iHi) (out[o++] = lo), (out[o++] = hi);
    else (out[o++] = hi), (out[o++] = lo);
  }
  return out;
}

/**
 * The error band around `flux` reduced per column: its lowest lower edge (flux − σ) and highest
 * upper edge (flux + σ), at both of the column's points, so the band drawn from them covers every
 * pixel's band. A pixel with an unknown σ (NaN) counts with zero width: the band closes onto the
 * flux rather than inventing one. Masked and non-finite flux is left out; null where nothing is left.
 */
export function columnBand(flux: ArrayLike<number>, error: ArrayLike<number>, cols: PixelColumns, mask: Uint8Array | null): { low: Array<number | null>; high: Array<number | null> } {
  const low = new Array<number | null>(cols.points);
  const high = new Array<number | null>(cols.points);
  let o = 0;
  for (let k = 0; k < cols.count; k++) {
    const a = cols.starts[k]!;
    const b = cols.starts[k + 1]!;
    let lo = Infinity;
    let hi = -Infinity;
    for (let i = a; i < b; i++) {
      const f = flux[i]!;
      if ((mask !== null && mask[i] !== 0) || f - f !== 0) continue; // masked, NaN or ±Infinity
      const e = error[i]!;
      const d = e - e === 0 ? Math.abs(e) : 0;
      if (f - d < lo) lo = f - d;
      if (f + d > hi) hi = f + d;
    }
    const found = lo <= hi;
    low[o] = found ? lo : null;
    high[o++] = found ? hi : null;
    if (b - a > 1) {
      low[o] = found ? lo : null;
      high[o++] = found ? hi : null;
    }
  }
  return { low, high };
}
