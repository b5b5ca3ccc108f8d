/**
 * Contiguous runs of bad pixels as wavelength intervals [start0, end0, start1, end1, …], each
 * widened to the pixel edges (half-way to the neighbours) so a single bad pixel is visible.
 */
export function maskRuns(wavelength: Float64Array, mask: Uint8Array): Float64Array {
  const out: number[] = [];
  const n = wavelength.length;
  let i = 0;
  while (i < n) {
    if (mask[i] === 0) {
      i++;
      continue;
    }
    const start = i;
    while (i < n && mask[i] !== 0) i++;
    const end = i - 1;
    const left = start > 0 ? (wavelength[start]! + wavelength[start - 1]!) / 2 : wavelength[start]!;
    const right = end < n - 1 ? (wavelength[end]! + wavelength[end + 1]!) / 2 : wavelength[end]!;
    out.push(left, right);
  }
  return Float64Array.from(out);
}
