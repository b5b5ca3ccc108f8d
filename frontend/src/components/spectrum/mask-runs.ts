/**
 * Contiguous runs of bad pixels among pixels [i0, i1) as wavelength intervals [start0, end0,
 * start1, end1, …], each widened to the pixel edges (half-way to the neighbours) so a single bad
 * pixel is visible. Runs separated by less than `joinWithin` (Å) are merged: at a zoom where one
 * screen column holds many pixels the shading has at most one run per column.
 *
 * @example maskRuns(Float64Array.of(1, 2, 3, 4, 5), Uint8Array.of(0, 1, 0, 1, 0)) // [1.5, 2.5, 3.5, 4.5]
 */
export function maskRuns(wavelength: Float64Array, mask: Uint8Array, i0 = 0, i1 = wavelength.length, joinWithin = 0): Float64Array {
  const out: number[] = [];
  const n = wavelength.length;
  let i = i0;
  while (i < i1) {
    if (mask[i] === 0) {
      i++;
      continue;
    }
    const start = i;
    while (i < i1 && mask[i] !== 0) i++;
    const end = i - 1;
    const left = start > 0 ? (wavelength[start]! + wavelength[start - 1]!) / 2 : wavelength[start]!;
    const right = end < n - 1 ? (wavelength[end]! + wavelength[end + 1]!) / 2 : wavelength[end]!;
    if (out.length > 0 && left - out[out.length - 1]! < joinWithin) out[out.length - 1] = right;
    else out.push(left, right);
  }
  return Float64Array.from(out);
}
