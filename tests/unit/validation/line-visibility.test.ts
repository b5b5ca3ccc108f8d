import { describe, expect, it } from 'vitest';
import { prepareSpectrum } from '../../../backend/src/spectra/prepareSpectrum';
import { readSpectrum } from '../../../backend/src/spectra/readSpectrum';
import { generateSkySpectrum } from '../../../backend/src/validation/independentSky/generateIndependentSky';
import { bestLineSnr, LINE_DETECTION_SIGMA } from '../../../backend/src/validation/lineVisibility';

/** Draws of the independent sky's tuning seed 31 (`npm run accuracy -- --only sky --seed 31`). */
function lineSnrAt(index: number, z?: number): { snr: number; truthZ: number } {
  const sky = generateSkySpectrum(31, index);
  expect(sky.truth.kind).toBe('emission-line');
  return { snr: bestLineSnr(prepareSpectrum(readSpectrum(sky.bytes)), z ?? sky.truth.z), truthZ: sky.truth.z };
}

describe('line visibility: which emission-line galaxies of the sky show a line at all', () => {
  it('a z = 1.53 galaxy whose lines all lie past its red end (8832 Å) shows none', () => {
    const { snr, truthZ } = lineSnrAt(13);
    expect(truthZ).toBeCloseTo(1.5297, 3);
    expect(snr).toBeLessThan(1);
  });

  it('a z = 0.24 galaxy with a bright Hβ shows it far above the threshold, and nothing at a wrong z', () => {
    const { snr, truthZ } = lineSnrAt(8);
    expect(truthZ).toBeCloseTo(0.2378, 3);
    expect(snr).toBeGreaterThan(50);
    // At z = 0.05 none of the strong lines falls on one of its lines: only noise is measured.
    expect(lineSnrAt(8, 0.05).snr).toBeLessThan(LINE_DETECTION_SIGMA);
  });
});
