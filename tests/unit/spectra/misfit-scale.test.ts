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
const MIRROR_CASES: Array<{ seed: number; index: number; subclass: string }> = [
  { seed: 31, index: 43, subclass: 'quiescent-kc96-bulge' },
  { seed: 31, index: 76, subclass: 'quiescent-kc96-bulge' },
  { seed: 31, index: 545, subclass: 'quiescent-kc96-s0' },
  // S/N 20, χ²/dof ≈ 80 at its z: with the scale capped at 30 it came out a Lyman-break source at
  // z = 5.78 (seed 5151, a validation seed, spent on this case; the cap is now 60).
  { seed: 5151, index: 72, subclass: 'quiescent-kc96-bulge' },
];

describe('misfit scale: a bright old galaxy is not read as a Lyman break at the mirror redshift', () => {
  for (const { seed, index, subclass } of MIRROR_CASES) {
    it(`sky seed ${seed} #${index} (${subclass}) comes out as a galaxy at its own z`, () => {
      const sky = generateSkySpectrum(seed, index);
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

  it('the cap keeps a bright real M9 dwarf (χ²/dof ≈ 300) a star: seed 31 #480 is read as a galaxy at z = 1.2 with a cap of 100', () => {
    const sky = generateSkySpectrum(31, 480);
    expect(sky.truth.subclass).toBe('dwarf-M9');
    const top = scanSpectrum(readSpectrum(sky.bytes)).solutions[0]!;
    expect(top.class).toBe('star');
    expect(Math.abs(top.z)).toBeLessThan(0.002);
  }, 30_000);
});
