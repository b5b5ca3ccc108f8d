import { describe, expect, it } from 'vitest';
import { chi2Strip } from './chi2-strip-data';
import { DELTA_CHI2_CLIP, DELTA_CHI2_KNEE, deltaChi2AtHeight, deltaChi2Height } from './delta-chi2-scale';

describe('the Δχ² scale of the strip', () => {
  it('is 0 at the best fit, near-linear below the knee, asinh beyond, flat past the clip', () => {
    expect(deltaChi2Height(0)).toBe(0);
    expect(deltaChi2Height(-3)).toBe(0);
    expect(deltaChi2Height(1)).toBeCloseTo(1, 2);
    expect(deltaChi2Height(6) / 6).toBeGreaterThan(0.99);
    expect(deltaChi2Height(DELTA_CHI2_KNEE) / DELTA_CHI2_KNEE).toBeCloseTo(Math.asinh(1), 9); // 0.881
    expect(deltaChi2Height(1e6)).toBe(deltaChi2Height(DELTA_CHI2_CLIP));
    // The linear part (Δχ² ≤ 25) keeps an eighth of the clipped height, not 0.25 % as on a linear axis,
    // and a dip 1000 above the best still reaches a third of the way down from the clip.
    expect(deltaChi2Height(25) / deltaChi2Height(DELTA_CHI2_CLIP)).toBeGreaterThan(0.125);
    expect(1 - deltaChi2Height(1000) / deltaChi2Height(DELTA_CHI2_CLIP)).toBeGreaterThan(0.33);
    for (const d of [0.5, 10, 25, 400, 1000, 9000]) expect(deltaChi2AtHeight(deltaChi2Height(d))).toBeCloseTo(d, 6);
  });
});

describe('chi2Strip', () => {
  it('takes each class’s best template per z, relative to the best χ² of all, on the strip scale', () => {
    const data = chi2Strip([
      { template: 'galaxy-emission', class: 'galaxy', z: [0.1, 0.2, 0.3], chi2: [5010, 5000, 5020] },
      { template: 'galaxy-absorption', class: 'galaxy', z: [0.1, 0.2], chi2: [5004, 5100] },
      { template: 'quasar', class: 'quasar', z: [0.2, 0.4], chi2: [40000, 5002] },
    ]);
    expect(Array.from(data.z)).toEqual([0.1, 0.2, 0.3, 0.4]);
    expect(data.classes).toEqual(['galaxy', 'quasar']);
    expect(data.chi2Min).toBe(5000);
    expect(data.series[0]).toEqual([deltaChi2Height(4), 0, deltaChi2Height(20), null]);
    expect(data.series[1]).toEqual([null, deltaChi2Height(35000), null, deltaChi2Height(2)]);
    expect(data.series[1]![1]).toBe(deltaChi2Height(DELTA_CHI2_CLIP));
  });
});
