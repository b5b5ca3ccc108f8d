/** At most this many samples are sorted: a median of a 100 000-pixel array stays well under a millisecond. */
const MAX_SAMPLES = 4096;

/**
 * Median of `value(i)` over the pixels i in [0, n) that `usable(i)` accepts, from an even stride of
 * at most 4096 of them (exact for shorter arrays). Null when no pixel is usable.
 *
 * @example sampleMedian(3, (i) => [5, 1, 3][i]!, () => true) // 3
 */
export function sampleMedian(n: number, value: (i: number) => number, usable: (i: number) => boolean): number | null {
  const stride = Math.max(1, Math.floor(n / MAX_SAMPLES));
  const samples: number[] = [];
  for (let i = 0; i < n; i += stride) {
    if (!usable(i)) continue;
    const v = value(i);
    if (Number.isFinite(v)) samples.push(v);
  }
  if (samples.length === 0) return null;
  samples.sort((a, b) => a - b);
  const m = samples.length >> 1;
  return samples.length % 2 === 1 ? samples[m]! : (samples[m - 1]! + samples[m]!) / 2;
}
