import { describe, expect, it } from 'vitest';
import { readSpectrum } from '../../../backend/src/spectra/readSpectrum';
import { scanSpectrum } from '../../../backend/src/spectra/scanSpectrum';
import { generateSkySpectrum } from '../../../backend/src/validation/independentSky/generateIndependentSky';

/**
 * Bright old galaxies whose metal lines our templates draw only in part (KC96 bulge and S0
 * composites of the independent sky, χ²/dof ≈ 15–20 at the true z) fitted a Lyman break at the
 * mirror redshift better in the continuum-removed data, although their blue side is far too bright
 * for the Lyα forest at z ≈ 6. With the unfiltered checks weighted by the misfit scale
 * (scanSpectrum.ts, misfitScale) they come out at their own z. Draws of the tuning seed 31 of
 * `npm run accuracy -- --only sky`; without the scale all three come out as Lyman-break sources
 * at z = 5.76–6.16.
 */
const MIRROR_CASES: Array<{ index: number; subclass: string }> = [
  { index: 43, subclass: 'quiescent-kc96-bulge' },
  { index: 76, subclass: 'quiescent-kc96-bulge' },
  { index: 545, subclass: 'quiescent-kc96-s0' },
];

describe('misfit scale: a bright old galaxy is not read as a Lyman break at the mirror redshift', () => {
  for (const { index, subclass } of MIRROR_CASES) {
    it(`sky seed 31 #${index} (${subclass}) comes out as a galaxy at its own z`, () => {
      const sky = generateSkySpectrum(31, index);
      expect(sky.truth.subclass).toBe(subclass);
      const result = scanSpectrum(readSpectrum(sky.bytes));
      const top = result.solutions[0]!;
      expect(top.class).toBe('galaxy');
      expect(Math.abs(top.z - sky.truth.z) / (1 + sky.truth.z)).toBeLessThan(0.002);
      // The Lyman-break reading is still listed, behind, and says what it lost to.
      const lyman = result.solutions.find((s) => s.class === 'lyman-break');
      if (lyman) expect(lyman.chi2 - top.chi2).toBeGreaterThan(1000);
    }, 30_000);
  }
});
