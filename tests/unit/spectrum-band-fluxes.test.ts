import { describe, expect, it } from 'vitest';
import type { FilterCurve } from '../../backend/src/photoz/filterCurve';
import { spectrumBandFluxes } from '../../backend/src/photoz/spectrumBandFluxes';
import { C_ANGSTROM_PER_S } from '../../backend/src/photoz/photometry';

// A box band 6000–7000 Å and one beyond the spectrum.
const box = (name: string, lo: number, hi: number): FilterCurve => ({ name, wavelength: Float64Array.from([lo - 1, lo, (lo + hi) / 2, hi, hi + 1]), transmission: Float64Array.from([0, 1, 1, 1, 0]) });
const n = 4000;
const wavelength = Float64Array.from({ length: n }, (_, i) => 5000 + i * 1);
const mask = new Uint8Array(n);

describe('spectrumBandFluxes', () => {
  it('gives a flat f_ν source of 100 nJy back as 100 nJy from f_λ in erg/s/cm²/Å, with the error of the mean', () => {
    // f_ν = 100 nJy = 1e-30 erg/s/cm²/Hz → f_λ = f_ν c / λ².
    const flux = Float64Array.from(wavelength, (l) => (1e-30 * C_ANGSTROM_PER_S) / (l * l));
    const sigma = Float64Array.from(wavelength, (l) => (1e-31 * C_ANGSTROM_PER_S) / (l * l)); // 10 nJy per pixel
    const ivar = Float64Array.from(sigma, (s) => 1 / (s * s));
    const [inBand, outside] = spectrumBandFluxes([box('b', 6000, 7000), box('far', 12000, 13000)], wavelength, flux, ivar, mask, { quantity: 'f-lambda', scale: 1 });
    expect(inBand!.flux).toBeCloseTo(100, 6);
    expect(inBand!.covered).toBeGreaterThan(0.99);
    // ≈ 1000 pixels of nearly equal weight: 10 nJy / √1000 ≈ 0.32 nJy.
    expect(inBand!.err).toBeGreaterThan(0.3);
    expect(inBand!.err).toBeLessThan(0.34);
    expect(outside!.covered).toBe(0);
    expect(Number.isNaN(outside!.flux)).toBe(true);
  });

  it('reads f_ν in Jy and skips masked pixels, counting them out of the coverage', () => {
    const flux = new Float64Array(n).fill(2e-7); // 200 nJy
    const ivar = new Float64Array(n).fill(1e16);
    const masked = Uint8Array.from(wavelength, (l) => (l >= 6000 && l < 6500 ? 1 : 0));
    const [b] = spectrumBandFluxes([box('b', 6000, 7000)], wavelength, flux, ivar, masked, { quantity: 'f-nu', scale: 1 });
    expect(b!.flux).toBeCloseTo(200, 6);
    expect(b!.covered).toBeGreaterThan(0.45);
    expect(b!.covered).toBeLessThan(0.55);
  });
});
