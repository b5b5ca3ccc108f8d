import { describe, expect, it } from 'vitest';
import { PZ_FLOOR_FRACTION, pzWeight, rankWithPz } from '../../../backend/src/spectra/rankWithPz';
import type { Solution } from '../../../backend/src/spectra/scanSpectrum';

const sol = (z: number, chi2: number): Solution => ({ z, zErr: 1e-4, reducedChi2: 1, class: 'galaxy', template: 't', chi2, deltaChi2: null, detectionChi2: 50, lines: [] });
// A triangular P(z) peaking at z = 1.0 (value 4), zero at 0.5 and 1.5.
const pz = { z: Float64Array.from([0.5, 1.0, 1.5]), p: Float64Array.from([0, 4, 0]) };

describe('pzWeight', () => {
  it('interpolates P(z)/peak linearly and floors it at 1e-6 of the peak, also off the grid', () => {
    expect(pzWeight(pz, 1.0)).toBe(1);
    expect(pzWeight(pz, 0.75)).toBeCloseTo(0.5, 12);
    expect(pzWeight(pz, 1.4)).toBeCloseTo(0.2, 12);
    expect(pzWeight(pz, 0.5)).toBe(PZ_FLOOR_FRACTION);
    expect(pzWeight(pz, 3.0)).toBe(1e-6);
  });
  it('rejects an empty, mismatched or all-zero P(z)', () => {
    expect(() => pzWeight({ z: [], p: [] }, 1)).toThrow(RangeError);
    expect(() => pzWeight({ z: [0, 1], p: [1] }, 1)).toThrow(RangeError);
    expect(() => pzWeight({ z: [0, 1], p: [0, 0] }, 1)).toThrow(RangeError);
  });
});

describe('rankWithPz', () => {
  it('moves a solution inside P(z) above a slightly better one outside it, with Δχ² from the scores', () => {
    // 0.75: score 100 − 2 ln 0.5 = 101.386; 3.0: score 95 − 2 ln 1e-6 = 122.631.
    const ranked = rankWithPz([sol(3.0, 95), sol(0.75, 100)], pz);
    expect(ranked.map((s) => s.z)).toEqual([0.75, 3.0]);
    expect(ranked[0]!.priorWeight).toBeCloseTo(0.5, 12);
    expect(ranked[0]!.deltaChi2).toBeCloseTo(95 + 2 * Math.log(1e6) - (100 + 2 * Math.log(2)), 9);
    expect(ranked[1]!.deltaChi2).toBeNull();
    expect(ranked[1]!.chi2).toBe(95);
  });
  it('lets a spectral solution better by more than 2 ln 1e6 ≈ 27.6 win against the floor', () => {
    const ranked = rankWithPz([sol(1.0, 130), sol(3.0, 100)], pz);
    expect(ranked.map((s) => s.z)).toEqual([3.0, 1.0]);
    expect(ranked[0]!.deltaChi2).toBeCloseTo(130 - (100 + 2 * Math.log(1e6)), 9);
  });
});
