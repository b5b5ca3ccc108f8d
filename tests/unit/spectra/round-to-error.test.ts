import { describe, expect, it } from 'vitest';
import { resolutionElement, resolutionZFloor, widenByResolution } from '../../../backend/src/spectra/resolutionElement';
import { roundToError } from '../../../backend/src/spectra/roundToError';

describe('roundToError', () => {
  it('keeps two significant digits of the error, rounded up, and the value to the same place', () => {
    expect(roundToError(1.234567891, 0.000391)).toEqual({ value: 1.23457, error: 0.0004, decimals: 5, valueText: '1.23457', errorText: '0.00040' });
    expect(roundToError(0.3456789, 0.0123)).toMatchObject({ valueText: '0.346', errorText: '0.013' });
    expect(roundToError(2.5, 0.15)).toMatchObject({ valueText: '2.50', errorText: '0.15' });
  });

  it('never writes an error smaller than the one computed', () => {
    for (const err of [1.0001e-4, 3.9e-4, 0.000995, 0.0123, 0.5, 1.7]) {
      expect(roundToError(1, err).error).toBeGreaterThanOrEqual(err);
    }
  });

  it('drops a decimal when rounding up adds a digit (0.000995 → 0.0010)', () => {
    expect(roundToError(1.0, 0.000995)).toMatchObject({ decimals: 4, errorText: '0.0010', valueText: '1.0000' });
  });

  it('handles errors of order one and above with no decimals', () => {
    expect(roundToError(12.34, 3.2)).toMatchObject({ valueText: '12.3', errorText: '3.2' });
    expect(roundToError(1234, 56)).toMatchObject({ valueText: '1234', errorText: '56' });
  });

  it('refuses a non-positive or non-finite error with a sentence', () => {
    expect(() => roundToError(1, 0)).toThrow(/positive finite/);
    expect(() => roundToError(Number.NaN, 0.1)).toThrow(/non-finite/);
  });
});

describe('resolution floor', () => {
  it('takes the resolution from the pixel scale: 1e-4 dex pixels → 69.0 km/s, FWHM 138.1 km/s', () => {
    const wavelength = Float64Array.from({ length: 1000 }, (_, i) => 4000 * 10 ** (i * 1e-4));
    const r = resolutionElement(wavelength);
    expect(r.pixelKms).toBeCloseTo(69.05, 1);
    expect(r.fwhmKms).toBeCloseTo(138.1, 1);
    expect(r.from).toMatch(/2 pixels per resolution FWHM assumed/);
  });

  it('gives the σ of the resolution element in z, (1 + z) FWHM / (2.355 c)', () => {
    expect(resolutionZFloor(1, 138.1)).toBeCloseTo(3.912e-4, 6);
    expect(resolutionZFloor(0, 2355 * 2)).toBeCloseTo(2 * 2355 / 2.3548 / 299792.458, 6);
  });

  it('widens an error in quadrature, and the floor stands alone when no error was given', () => {
    expect(widenByResolution(3e-4, 4e-4)).toBeCloseTo(5e-4, 12);
    expect(widenByResolution(2e-5, 4e-4)).toBeGreaterThanOrEqual(4e-4);
    expect(widenByResolution(null, 4e-4)).toBe(4e-4);
  });
});
