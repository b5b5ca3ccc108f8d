/**
 * Which grid pixels may steer the running-mean continuum: usable pixels whose inverse variance is
 * at least `1/ratio²` of the typical inverse variance around them. A near-infrared arm keeps a few
 * pixels in the water bands whose flux swings 100–1000× the continuum with honestly huge error
 * bars; their χ² weight is tiny, but an unweighted running mean would let one of them move the
 * continuum of a thousand neighbours. Treated as gaps, they are bridged by interpolation instead.
 *
 * "Typical" is the median inverse variance of blocks of `block` pixels, taken as the median of the
 * block medians within ±`reach` blocks, so a band that is noisy throughout keeps its pixels.
 *
 * @param ivar inverse variance per grid pixel (0 = unusable)
 * @param ratio σ above this multiple of the local typical σ removes a pixel from the continuum (default 30: the junk of a water band sits at 100–1000×, ordinary sky lines at 3–10×, which must keep steering it)
 */
export function continuumSupport(ivar: Float64Array, ratio = 30, block = 64, reach = 4): Uint8Array {
  const n = ivar.length;
  const blocks = Math.ceil(n / block);
  const blockMedian = new Float64Array(blocks);
  // Typed-array sorts are numeric without a comparator call per comparison (this runs per scan).
  const values = new Float64Array(Math.max(block, 2 * reach + 1));
  for (let b = 0; b < blocks; b++) {
    let k = 0;
    for (let i = b * block; i < Math.min(n, (b + 1) * block); i++) if (ivar[i]! > 0) values[k++] = ivar[i]!;
    const sorted = values.subarray(0, k).sort();
    blockMedian[b] = k ? sorted[k >> 1]! : NaN;
  }
  const floor = new Float64Array(blocks);
  for (let b = 0; b < blocks; b++) {
    let k = 0;
    for (let c = Math.max(0, b - reach); c <= Math.min(blocks - 1, b + reach); c++) if (blockMedian[c]! > 0) values[k++] = blockMedian[c]!;
    const sorted = values.subarray(0, k).sort();
    floor[b] = k ? sorted[k >> 1]! / (ratio * ratio) : 0;
  }
  const valid = new Uint8Array(n);
  for (let i = 0; i < n; i++) valid[i] = ivar[i]! > 0 && ivar[i]! >= floor[Math.floor(i / block)]! ? 1 : 0;
  return valid;
}
