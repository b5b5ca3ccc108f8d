import { describe, expect, it } from 'vitest';
import { lowerBound, robustRange } from './robust-range';

describe('robustRange', () => {
  it('ranges on percentiles so a spike does not flatten the plot (the documented example)', () => {
    const r = robustRange(Float32Array.of(1, 2, 3, 1000), new Uint8Array(4), 0, 4, 0, 0.5)!;
    expect(r[0]).toBeCloseTo(0.84, 9);
    expect(r[1]).toBeCloseTo(3.16, 9);
  });

  it('takes the full extent in one pass for the 0th to 100th percentile, leaving masked and non-finite pixels out', () => {
    const values = Float32Array.from({ length: 10_000 }, (_, i) => Math.sin(i));
    values[7_777] = 50;
    values[8_888] = -1e6;
    values[9_999] = Number.NaN;
    const mask = new Uint8Array(10_000);
    mask[8_888] = 1;
    const [lo, hi] = robustRange(values, mask, 0, 10_000, 0, 1)!;
    const span = 50 - Math.min(...Array.from(values.subarray(0, 8_888)));
    expect(hi).toBeCloseTo(50 + 0.08 * span, 4);
    expect(lo).toBeCloseTo(50 - span - 0.08 * span, 4);
    expect(robustRange(values, Uint8Array.from(mask, () => 1), 0, 10_000, 0, 1)).toBeNull();
  });
});

describe('lowerBound', () => {
  it('finds the first wavelength at or above a value', () => {
    const w = Float64Array.of(1, 2, 2, 3);
    expect(lowerBound(w, 2)).toBe(1);
    expect(lowerBound(w, 2.5)).toBe(3);
    expect(lowerBound(w, 9)).toBe(4);
  });
});
