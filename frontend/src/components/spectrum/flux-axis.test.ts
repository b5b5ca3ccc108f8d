import { describe, expect, it } from 'vitest';
import { fluxAxis, fluxTicks } from './flux-axis';

const fLambda = (scale: number, raw: string) => ({ quantity: 'f-lambda' as const, scale, unit: 'erg s⁻¹ cm⁻² Å⁻¹', raw });

describe('fluxAxis', () => {
  it('scales 10⁻¹⁷-sized cgs f_λ (X-shooter tables) by a power of ten named in the label', () => {
    const a = fluxAxis(fLambda(1, 'erg/s/cm2/A'), 3.2e-17);
    expect(a.label).toBe('Flux density f_λ (10⁻¹⁷ erg s⁻¹ cm⁻² Å⁻¹)');
    expect(a.factor).toBeCloseTo(1e17, -5);
  });

  it("keeps a file's own readable power-of-ten scale (SDSS 1E-17 erg/cm^2/s/Ang)", () => {
    expect(fluxAxis(fLambda(1e-17, '1E-17 erg/cm^2/s/Ang'), 40)).toEqual({ factor: 1, label: 'Flux density f_λ (10⁻¹⁷ erg s⁻¹ cm⁻² Å⁻¹)' });
  });

  it('converts a non-decimal scale (per nm) to the named unit', () => {
    const a = fluxAxis(fLambda(0.1, 'erg s**(-1) cm**(-2) nm**(-1)'), 2e-16);
    expect(a.label).toBe('Flux density f_λ (10⁻¹⁷ erg s⁻¹ cm⁻² Å⁻¹)');
    expect(a.factor * 2e-16).toBeCloseTo(2, 9);
  });

  it('reads f_ν in mJy, µJy or nJy', () => {
    const a = fluxAxis({ quantity: 'f-nu', scale: 1e-6, unit: 'Jy', raw: 'uJy' }, 0.4);
    expect(a.label).toBe('Flux density f_ν (nJy)');
    expect(a.factor * 0.4).toBeCloseTo(400, 9);
    expect(fluxAxis({ quantity: 'f-nu', scale: 1, unit: 'Jy', raw: 'Jy' }, 0.02).label).toBe('Flux density f_ν (mJy)');
  });

  it('says "arbitrary units" without a unit, scaled when the numbers are tiny', () => {
    expect(fluxAxis(null, 12)).toEqual({ factor: 1, label: 'Flux (arbitrary units)' });
    expect(fluxAxis({ quantity: 'arbitrary', scale: 1, unit: 'arbitrary', raw: null }, 5e-17)).toEqual({ factor: 1e17, label: 'Flux (arbitrary units, ×10⁻¹⁷)' });
    expect(fluxAxis(null, 0).label).toBe('Flux (arbitrary units)');
  });

  it('names counts', () => {
    expect(fluxAxis({ quantity: 'counts', scale: 1, unit: 'ADU', raw: 'ADU' }, 1200)).toEqual({ factor: 1, label: 'Counts (ADU)' });
    expect(fluxAxis({ quantity: 'count-rate', scale: 1, unit: 'electrons s⁻¹', raw: 'e-/s' }, 3e5).label).toBe('Count rate (10⁵ electrons s⁻¹)');
  });
});

describe('fluxTicks', () => {
  it('gives several labelled ticks on a 10⁻¹⁷ range (uPlot alone gave a single "0")', () => {
    const { splits, labels } = fluxTicks(-0.4e-17, 3.1e-17, 1e17, 8);
    expect(labels).toEqual(['0', '0.5', '1.0', '1.5', '2.0', '2.5', '3.0']);
    expect(splits[2]).toBeCloseTo(1e-17, 30);
  });

  it('works with factor 1 and an empty range', () => {
    expect(fluxTicks(0, 100, 1, 5).labels).toEqual(['0', '20', '40', '60', '80', '100']);
    expect(fluxTicks(1, 1, 1, 5).splits).toEqual([]);
  });
});
