import { describe, expect, it } from 'vitest';
import { forestChi2, forestStructure, forestSums } from '../../../backend/src/spectra/forestStructureCheck';
import { prepareSpectrum } from '../../../backend/src/spectra/prepareSpectrum';
import { readSpectrum } from '../../../backend/src/spectra/readSpectrum';
import { generateSkySpectrum } from '../../../backend/src/validation/independentSky/generateIndependentSky';

/** Sums of one spectrum of the independent sky (tuning seed 31 of `npm run accuracy -- --only sky`). */
function skySums(index: number) {
  const sky = generateSkySpectrum(31, index);
  return { truth: sky.truth, sums: forestSums(prepareSpectrum(readSpectrum(sky.bytes))) };
}

describe('forest structure: the Lyα forest is ragged, a continuum read as one is smooth', () => {
  it('quasars at their own z show a forest well above the floor and pay nothing', () => {
    for (const index of [0, 240]) {
      const { truth, sums } = skySums(index);
      expect(truth.kind).toBe('quasar');
      const s = forestStructure(sums, truth.z)!;
      expect(s.v).toBeGreaterThan(5 * s.floor);
      expect(forestChi2(sums, truth.z)).toBe(0);
    }
  });

  it('a quasar whose Mg II or C IV is read as Lyα has a smooth "forest" and pays', () => {
    // #361: z = 0.748, Mg II read as Lyα at z = 3.016; #551: z = 2.354, C IV read as Lyα at z = 3.253.
    for (const [index, wrongZ] of [[361, 3.0161], [551, 3.2528]] as const) {
      const { truth, sums } = skySums(index);
      expect(truth.kind).toBe('quasar');
      const s = forestStructure(sums, wrongZ)!;
      expect(Math.abs(s.v)).toBeLessThan(3 * s.sigma);
      expect(forestChi2(sums, wrongZ)).toBeGreaterThan(50);
    }
  });

  it('cannot judge a forest darker than T = 0.3 (z ≳ 4.7): the mean-level test is the one there', () => {
    const { sums } = skySums(240);
    expect(forestStructure(sums, 5.5)).toBeUndefined();
    expect(forestChi2(sums, 5.5)).toBe(0);
  });
});
