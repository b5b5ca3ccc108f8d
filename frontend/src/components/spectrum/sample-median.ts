/** At most this many samples are sorted by default: a median of a 100 000-pixel array stays well under a millisecond. */
const MAX_SAMPLES = 4096;
let scratch = new Float64Array(MAX_SAMPLES);

/**
 * Median of `value(i)` over the pixels i in [0, n) that `usable(i)` accepts, from an even stride of
 * about `maxSamples` of them (exact for shorter arrays). Null when no pixel is usable.
 *
 * @example sampleMedian(3, (i) => [5, 1, 3][i]!, () => true) // 3
 */
export function sampleMedian(n: number, value: (i: number) => number, usable: (i: number) => boolean, maxSamples = MAX_SAMPLES): number | null {
  const stride = Math.max(1, Math.ceil(n / maxSamples));
  if (scratch.length < maxSamples) scratch = new Float64Array(maxSamples);
  let m = 0;
  for (let i = 0; i < n && m < maxSamples; i += stride) {
    if (!usable(i)) continue;
    const v = value(i);
    if (Number.isFinite(v)) scratch[m++] = v;
  }
  if (m === 0) return null;
  // A typed array sorts numerically without a comparator (several times faster than Array#sort).
  const sorted = scratch.subarray(0, m).sort();
  const h = m >> 1;
  return m % 2 === 1 ? sorted[h]! : (sorted[h - 1]! + sorted[h]!) / 2;
}
