/**
 * A band between two curves (e.g. flux ± 1σ) rasterised onto screen columns 0 … width−1: for each
 * column, the smallest and largest edge position reached there, with straight lines between
 * neighbouring points. Filled as one rectangle per column, a band of thousands of points costs a
 * few hundred rectangles instead of a self-crossing polygon, which a software rasteriser fills
 * slowly. `toX` and `toY` map data to column and row units (fractional); a null edge is a gap.
 * Writes into `top` and `bottom` (NaN where the band does not reach); returns the columns reached.
 *
 * @example bandColumns([0, 4], [0, 4], [2, 6], (v) => v, (v) => v, 5, top, bottom) // 5; top [0, 1.5, 2.5, 3.5, 4], bottom [2, 3.5, 4.5, 5.5, 6]
 */
export function bandColumns(
  x: ArrayLike<number>,
  low: ArrayLike<number | null>,
  high: ArrayLike<number | null>,
  toX: (v: number) => number,
  toY: (v: number) => number,
  width: number,
  top: Float32Array,
  bottom: Float32Array,
): number {
  top.fill(Number.NaN, 0, width);
  bottom.fill(Number.NaN, 0, width);
  let reached = 0;
  const mark = (c: number, a: number, b: number) => {
    const lo = a < b ? a : b;
    const hi = a < b ? b : a;
    if (Number.isNaN(top[c]!)) {
      top[c] = lo;
      bottom[c] = hi;
      reached++;
    } else {
      if (lo < top[c]!) top[c] = lo;
      if (hi > bottom[c]!) bottom[c] = hi;
    }
  };
  let prevX = Number.NaN;
  let prevA = 0;
  let prevB = 0;
  for (let k = 0; k < x.length; k++) {
    const l = low[k];
    const h = high[k];
    if (l == null || h == null) {
      prevX = Number.NaN;
      continue;
    }
    const px = toX(x[k]!);
    const a = toY(l);
    const b = toY(h);
    const c = Math.floor(px);
    if (c >= 0 && c < width) mark(c, a, b);
    if (!Number.isNaN(prevX) && px > prevX) {
      // Columns strictly between the two points take the straight line between them, at their middle.
      const from = Math.max(0, Math.floor(prevX) + 1);
      const to = Math.min(width - 1, c - 1);
      for (let col = from; col <= to; col++) {
        const t = (col + 0.5 - prevX) / (px - prevX);
        mark(col, prevA + (a - prevA) * t, prevB + (b - prevB) * t);
      }
    }
    prevX = px;
    prevA = a;
    prevB = b;
  }
  return reached;
}
