import { describe, expect, it } from 'vitest';
import { generateSyntheticSpectrum } from '../../../backend/src/spectra/generateSyntheticSpectrum';

describe('generateSyntheticSpectrum', () => {
  it('is deterministic for a seed and differs between seeds', () => {
    const a = generateSyntheticSpectrum({ class: 'quasar', z: 2.1, snr: 5, seed: 31 });
    const b = generateSyntheticSpectrum({ class: 'quasar', z: 2.1, snr: 5, seed: 31 });
    const c = generateSyntheticSpectrum({ class: 'quasar', z: 2.1, snr: 5, seed: 32 });
    expect(Array.from(b.flux)).toEqual(Array.from(a.flux));
    expect(Array.from(b.ivar)).toEqual(Array.from(a.ivar));
    expect(Array.from(b.mask)).toEqual(Array.from(a.mask));
    expect(Array.from(c.flux)).not.toEqual(Array.from(a.flux));
  });

});
