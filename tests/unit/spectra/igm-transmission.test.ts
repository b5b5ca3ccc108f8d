import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { inoue2014OpticalDepth, inoue2014Transmission } from '../../../backend/src/spectra/igmInoue2014';
import {
  DEFAULT_IGM_MODEL,
  igmTransmission,
  meanIgmTransmission,
  type IgmModel,
} from '../../../backend/src/spectra/igmTransmission';

const MODELS: IgmModel[] = ['inoue2014', 'madau1995'];
const wavelength = (min: number, max: number) => fc.double({ min, max, noNaN: true });
const redshift = (max: number) => fc.double({ min: 0, max, noNaN: true });

/**
 * Source redshifts where Inoue et al. (2014) switch fit: the Lyα-forest continuum at 1.2 and 4.7,
 * the DLA continuum at 2. The published three-figure coefficients do not join exactly there.
 */
const INOUE_SEAMS = [1.2, 2, 4.7];
const inouePiece = (z: number) => INOUE_SEAMS.filter((s) => z >= s).length;

describe('mean IGM transmission: properties of both models', () => {
  it('lies in [0, 1]', () => {
    fc.assert(
      fc.property(fc.constantFrom(...MODELS), wavelength(100, 40000), redshift(12), (model, lam, z) => {
        const t = meanIgmTransmission(lam, z, model);
        expect(t).toBeGreaterThanOrEqual(0);
        expect(t).toBeLessThanOrEqual(1);
      }),
      { numRuns: 2000 },
    );
  });

  it('is exactly 1 redward of Lyα at the source (Madau uses 1216 Å, Inoue 1215.67 Å)', () => {
    fc.assert(
      fc.property(fc.constantFrom(...MODELS), redshift(12), fc.double({ min: 1, max: 3, noNaN: true }), (model, z, f) => {
        expect(meanIgmTransmission(1216 * (1 + z) * f, z, model)).toBe(1);
      }),
      { numRuns: 1000 },
    );
  });

  it('Madau (1995) never rises with z_s at a fixed observed wavelength ≥ 912 Å', () => {
    fc.assert(
      fc.property(wavelength(912, 15000), redshift(10), redshift(10), (lam, za, zb) => {
        const [z1, z2] = za <= zb ? [za, zb] : [zb, za];
        expect(igmTransmission(lam, z2)).toBeLessThanOrEqual(igmTransmission(lam, z1) + 1e-12);
      }),
      { numRuns: 3000 },
    );
  });

  it('Inoue (2014) never rises with z_s within one piece of its fits, and by < 0.0075 across a seam', () => {
    fc.assert(
      fc.property(wavelength(912, 15000), redshift(10), redshift(10), (lam, za, zb) => {
        const [z1, z2] = za <= zb ? [za, zb] : [zb, za];
        const rise = inoue2014Transmission(lam, z2) - inoue2014Transmission(lam, z1);
        expect(rise).toBeLessThanOrEqual(inouePiece(z1) === inouePiece(z2) ? 1e-12 : 0.0075);
      }),
      { numRuns: 3000 },
    );
  });

  it('the only rise is the known seam at z_s = 4.7, where T steps up by 0.0074 just below 5.7 λ_L', () => {
    // τ_LC,LAF for 2.2 ≤ x < 5.7: [2.55e-2 × 5.7^1.6 − 5.22e-4 × 5.7^3.4 − 0.218] x^2.1
    // = 1.13e-3 x^2.1 more on the low side than on the high side (D), up to Δτ = 0.044 at
    // x → 5.7, i.e. T 0.1775 → 0.1849 at 5188.75 Å. At 1.2 the step is 0.0006; at 2 T falls.
    const step = (seam: number) => {
      let worst = 0;
      for (let lam = 912; lam < 12000; lam += 0.25) worst = Math.max(worst, inoue2014Transmission(lam, seam) - inoue2014Transmission(lam, seam - 1e-9));
      return worst;
    };
    expect(step(4.7)).toBeCloseTo(0.0074, 4);
    expect(step(1.2)).toBeLessThan(0.0006);
    expect(step(2)).toBe(0);
  });
});

describe('meanIgmTransmission', () => {
  it('defaults to Inoue et al. (2014) and dispatches to either model', () => {
    expect(DEFAULT_IGM_MODEL).toBe('inoue2014');
    expect(meanIgmTransmission(4500, 3)).toBe(inoue2014Transmission(4500, 3));
    expect(meanIgmTransmission(4500, 3, 'madau1995')).toBe(igmTransmission(4500, 3));
    expect(meanIgmTransmission(4500, 3, 'madau1995')).toBeCloseTo(0.7167, 4);
  });

  it('rejects a model name it does not know with a sentence', () => {
    expect(() => meanIgmTransmission(4500, 3, 'madau1996' as IgmModel)).toThrow(/Unknown IGM model 'madau1996'/);
  });
});

describe('inoue2014OpticalDepth at the edges of its domain', () => {
  it('is 0 for a source at or in front of the observer and NaN for NaN input', () => {
    expect(inoue2014OpticalDepth(3000, 0)).toBe(0);
    expect(inoue2014OpticalDepth(3000, -0.5)).toBe(0);
    expect(inoue2014OpticalDepth(Number.NaN, 3)).toBeNaN();
    expect(inoue2014OpticalDepth(3000, Number.NaN)).toBeNaN();
  });

  it('holds the continuum depth at its 911.8 Å value below the observed Lyman limit', () => {
    // Not in the paper (its fits start at λ_L); no series line reaches below 912.32 Å either.
    expect(inoue2014OpticalDepth(500, 3)).toBe(inoue2014OpticalDepth(911.8, 3));
    expect(inoue2014OpticalDepth(911.8 - 1e-9, 3)).toBeCloseTo(inoue2014OpticalDepth(911.8 + 1e-9, 3), 9);
    expect(inoue2014OpticalDepth(500, 3)).toBeGreaterThan(1);
  });
});
