import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { gzipSync } from 'fflate';
import { readSpectrum } from '../../../backend/src/spectra/readSpectrum';
import { SpectrumReadError } from '../../../backend/src/spectra/errors';
import { concat, float32BE, header, padData } from './fits-writer';

const validFits = concat(
  header([['SIMPLE', true], ['BITPIX', -32], ['NAXIS', 1], ['NAXIS1', 40], ['CRVAL1', 5000], ['CDELT1', 2], ['CRPIX1', 1]]),
  padData(float32BE(Array.from({ length: 40 }, (_, i) => 1 + (i % 7)))),
);
const validText = new TextEncoder().encode('# wave flux err\n' + Array.from({ length: 40 }, (_, i) => `${4000 + i} ${1 + (i % 5)} 0.1`).join('\n'));

/** A reader may return a spectrum or throw SpectrumReadError; anything else is a bug. */
function outcome(bytes: Uint8Array): 'spectrum' | 'typed-error' {
  try {
    const s = readSpectrum(bytes);
    expect(s.wavelength.length).toBe(s.flux.length);
    for (let i = 1; i < s.wavelength.length; i++) expect(s.wavelength[i]!).toBeGreaterThan(s.wavelength[i - 1]!);
    return 'spectrum';
  } catch (e) {
    if (e instanceof SpectrumReadError) return 'typed-error';
    throw e;
  }
}

describe('readers on random and mutated bytes (fast-check, seeded)', () => {
  it('random bytes', () => {
    fc.assert(fc.property(fc.uint8Array({ maxLength: 6000 }), (b) => { outcome(b); }), { seed: 42, numRuns: 300 });
  });

  it('mutated valid FITS: flipped bytes, truncation', () => {
    expect(outcome(validFits)).toBe('spectrum');
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.nat(validFits.length - 1), fc.integer({ min: 0, max: 255 })), { maxLength: 20 }), fc.nat(validFits.length), (edits, cut) => {
        const b = validFits.slice(0, Math.max(1, cut));
        for (const [at, v] of edits) if (at < b.length) b[at] = v;
        outcome(b);
      }),
      { seed: 7, numRuns: 300 },
    );
  });

  it('mutated header cards with huge or negative axis values', () => {
    fc.assert(
      fc.property(fc.oneof(fc.constant(1e12), fc.constant(-5), fc.integer({ min: 0, max: 1e9 })), fc.integer({ min: -64, max: 64 }), (naxis1, bitpix) => {
        const b = concat(header([['SIMPLE', true], ['BITPIX', bitpix], ['NAXIS', 1], ['NAXIS1', naxis1]]), new Uint8Array(2880));
        outcome(b);
      }),
      { seed: 11, numRuns: 200 },
    );
  });

  it('mutated text tables and gzip streams', () => {
    expect(outcome(validText)).toBe('spectrum');
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.nat(validText.length - 1), fc.integer({ min: 0, max: 127 })), { maxLength: 30 }), (edits) => {
        const b = validText.slice();
        for (const [at, v] of edits) b[at] = v;
        outcome(b);
      }),
      { seed: 3, numRuns: 300 },
    );
    const gz = gzipSync(validFits);
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.nat(gz.length - 1), fc.integer({ min: 0, max: 255 })), { minLength: 1, maxLength: 8 }), (edits) => {
        const b = gz.slice();
        for (const [at, v] of edits) b[at] = v;
        outcome(b);
      }),
      { seed: 5, numRuns: 200 },
    );
  });
});
