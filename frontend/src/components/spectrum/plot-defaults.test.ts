import { describe, expect, it } from 'vitest';
import { defaultSmoothing, medianSnrPerPixel, spectrumSnr } from './default-smoothing';
import { sampleMedian } from './sample-median';
import { skySwampsData } from './sky-default';

/** Deterministic noise: a fixed pseudo-random sequence in [−1, 1). */
const noise = (n: number, seed = 7) => {
  let a = seed;
  return Float32Array.from({ length: n }, () => ((a = (a * 1103515245 + 12345) % 2 ** 31) / 2 ** 30) - 1);
};

describe('sampleMedian', () => {
  it('gives the documented example and averages the middle pair of an even count', () => {
    expect(sampleMedian(3, (i) => [5, 1, 3][i]!, () => true)).toBe(3);
    expect(sampleMedian(4, (i) => [5, 1, 3, 2][i]!, () => true)).toBe(2.5);
    expect(sampleMedian(3, (i) => [5, 1, 3][i]!, (i) => i !== 2)).toBe(3);
    expect(sampleMedian(2, () => Number.NaN, () => true)).toBeNull();
  });
});

describe('skySwampsData', () => {
  const mask = new Uint8Array(2000);
  const flux = noise(2000); // |flux| robust range ≈ 1.1 after padding
  it('hides a sky whose median lies above the flux axis', () => {
    expect(skySwampsData(Float32Array.of(-1, 0, 1), Float32Array.of(40, 50, 60), new Uint8Array(3))).toBe(true);
    expect(skySwampsData(flux, new Float32Array(2000).fill(30), mask)).toBe(true);
  });
  it('keeps a sky that sits inside the flux axis, and says no without a sky', () => {
    expect(skySwampsData(flux, new Float32Array(2000).fill(0.5), mask)).toBe(false);
    expect(skySwampsData(flux, null, mask)).toBe(false);
  });
  it('reads the sky only where the data are unmasked', () => {
    const sky = new Float32Array(2000).fill(0.2);
    const masked = new Uint8Array(2000);
    for (let i = 0; i < 1500; i++) (sky[i] = 1000), (masked[i] = 1);
    expect(skySwampsData(flux, sky, masked)).toBe(false);
  });
});

describe('default smoothing from the median S/N per pixel', () => {
  it('measures the median of flux / σ over usable pixels, in the best tenth of the spectrum', () => {
    expect(medianSnrPerPixel(Float32Array.of(2, 4, 6), Float32Array.of(1, 2, 1), new Uint8Array(3))).toBe(6);
    expect(medianSnrPerPixel(Float32Array.of(2, 4, 6), Float32Array.of(1, 0, Number.NaN), new Uint8Array(3))).toBe(2);
    expect(medianSnrPerPixel(Float32Array.of(2, 4), Float32Array.of(1, 1), Uint8Array.of(1, 1))).toBeNull();
    // A break: black (S/N 0 ± 1) over the blue 70 %, S/N 6 redward. The whole-spectrum median would be ≈ 0.5.
    const n = 2000;
    const err = new Float32Array(n).fill(1);
    const flux = Float32Array.from(noise(n, 5), (v, i) => (i < 1400 ? 0 : 6) + v);
    const snr = medianSnrPerPixel(flux, err, new Uint8Array(n))!;
    expect(snr).toBeGreaterThan(5.5);
    expect(snr).toBeLessThan(6.5);
  });
  it('smooths only below S/N 3, with a boxcar of (3 / S/N)² pixels rounded up to odd, 3 to 9', () => {
    expect(defaultSmoothing(null)).toEqual({ kind: 'none', width: 5, unit: 'pixels' });
    expect(defaultSmoothing(3).kind).toBe('none');
    expect(defaultSmoothing(12).kind).toBe('none');
    expect(defaultSmoothing(2)).toEqual({ kind: 'boxcar', width: 3, unit: 'pixels' });
    expect(defaultSmoothing(2.9).width).toBe(3);
    expect(defaultSmoothing(1.5).width).toBe(5); // (3/1.5)² = 4 → 5
    expect(defaultSmoothing(1.2).width).toBe(7); // 6.25 → 7
    expect(defaultSmoothing(1).width).toBe(9);
    expect(defaultSmoothing(0.3).width).toBe(9);
    expect(defaultSmoothing(-0.5).width).toBe(9);
  });
  it('keeps one S/N per flux array', () => {
    const arrays = { flux: Float32Array.of(2, 4, 6), error: Float32Array.of(1, 1, 1), mask: new Uint8Array(3) };
    expect(spectrumSnr(arrays)).toBe(6);
    arrays.error.fill(2); // the cache answers for the same flux array (arrays are never changed in the app)
    expect(spectrumSnr(arrays)).toBe(6);
    expect(spectrumSnr({ ...arrays, flux: Float32Array.of(2, 4, 6) })).toBe(3);
  });

  it('opens a noisy spectrum at S/N ≈ 2 with a 3-pixel boxcar', () => {
    const n = 3000;
    const err = new Float32Array(n).fill(0.5);
    const flux = Float32Array.from(noise(n, 11), (v) => 1 + 0.5 * v);
    const snr = medianSnrPerPixel(flux, err, new Uint8Array(n))!;
    expect(snr).toBeGreaterThan(1.9);
    expect(snr).toBeLessThan(2.3); // the best of ten stretches, a little above the whole median
    expect(defaultSmoothing(snr)).toEqual({ kind: 'boxcar', width: 3, unit: 'pixels' });
  });
});
