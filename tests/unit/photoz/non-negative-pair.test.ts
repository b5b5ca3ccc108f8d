import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { loadShippedFilters, loadShippedTemplates } from '../../../backend/src/cli/photoz-data';
import { fitPhotoZ } from '../../../backend/src/photoz/fitPhotoZ';
import { buildModelGrid } from '../../../backend/src/photoz/modelGrid';
import { interiorPairReduction, solveNonNegativePair } from '../../../backend/src/photoz/nonNegativePair';
import { NO_TEMPLATE_PAIRS } from '../../../backend/src/photoz/templatePairs';

/** Normal-equation sums of fluxes F against models M1, M2 with weights w. */
function sums(f: number[], m1: number[], m2: number[], w: number[]) {
  let n1 = 0, n2 = 0, d1 = 0, d2 = 0, c = 0, ff = 0;
  f.forEach((v, b) => {
    n1 += w[b]! * v * m1[b]!; n2 += w[b]! * v * m2[b]!;
    d1 += w[b]! * m1[b]! ** 2; d2 += w[b]! * m2[b]! ** 2; c += w[b]! * m1[b]! * m2[b]!; ff += w[b]! * v * v;
  });
  return { n1, n2, d1, d2, c, ff };
}
const chi2 = (f: number[], m1: number[], m2: number[], w: number[], a1: number, a2: number) => f.reduce((s, v, b) => s + w[b]! * (v - a1 * m1[b]! - a2 * m2[b]!) ** 2, 0);

describe('two non-negative amplitudes', () => {
  // A red and a blue shape through ten bands.
  const red = [0.05, 0.2, 0.5, 0.8, 1, 1.2, 1.3, 1.4, 1.1, 0.8];
  const blue = [1, 1, 0.95, 0.9, 0.85, 0.8, 0.75, 0.7, 0.5, 0.4];
  const w = red.map((_, b) => 1 / (0.01 + 0.001 * b));

  it('recovers the amplitudes of a noiseless sum, with χ² ≈ 0', () => {
    const f = red.map((r, b) => 3 * r + 0.5 * blue[b]!);
    const s = sums(f, red, blue, w);
    const sol = solveNonNegativePair(s.n1, s.n2, s.d1, s.d2, s.c);
    expect(sol.a1).toBeCloseTo(3, 10);
    expect(sol.a2).toBeCloseTo(0.5, 10);
    expect(s.ff - sol.reduction).toBeCloseTo(0, 8);
    expect(interiorPairReduction(s.n1, s.n2, s.d1, s.d2, s.c)).toBeCloseTo(sol.reduction, 10);
  });

  it('a source that needs a negative blue amplitude gets the red template alone (interior reduction 0)', () => {
    const f = red.map((r, b) => 3 * r - 0.5 * blue[b]!);
    const s = sums(f, red, blue, w);
    const sol = solveNonNegativePair(s.n1, s.n2, s.d1, s.d2, s.c);
    expect(sol.a2).toBe(0);
    expect(sol.a1).toBeCloseTo(s.n1 / s.d1, 12);
    expect(interiorPairReduction(s.n1, s.n2, s.d1, s.d2, s.c)).toBe(0);
    // Non-negative least squares with the red amplitude alone does strictly worse than the unconstrained 3, −0.5 fit.
    expect(chi2(f, red, blue, w, sol.a1, 0)).toBeGreaterThan(1e-6);
  });

  it('property: amplitudes are never negative, and no non-negative pair on a grid beats the solution', () => {
    const pos = fc.array(fc.double({ min: 0.01, max: 2, noNaN: true }), { minLength: 6, maxLength: 6 });
    const any = fc.array(fc.double({ min: -2, max: 3, noNaN: true }), { minLength: 6, maxLength: 6 });
    fc.assert(fc.property(pos, pos, any, pos, (m1, m2, f, w6) => {
      const s = sums(f, m1, m2, w6);
      const sol = solveNonNegativePair(s.n1, s.n2, s.d1, s.d2, s.c);
      expect(sol.a1).toBeGreaterThanOrEqual(0);
      expect(sol.a2).toBeGreaterThanOrEqual(0);
      const best = chi2(f, m1, m2, w6, sol.a1, sol.a2);
      expect(best).toBeCloseTo(s.ff - sol.reduction, 6);
      for (let i = 0; i <= 20; i++) for (let j = 0; j <= 20; j++) {
        expect(best).toBeLessThanOrEqual(chi2(f, m1, m2, w6, 0.25 * i, 0.25 * j) + 1e-9);
      }
      const interior = interiorPairReduction(s.n1, s.n2, s.d1, s.d2, s.c);
      expect(interior === 0 || Math.abs(interior - sol.reduction) <= 1e-9 * Math.max(1, sol.reduction)).toBe(true);
    }), { numRuns: 300 });
  });
});

describe('fitPhotoZ with template pairs', () => {
  const ten = ['acs_wfc_f435w', 'acs_wfc_f606w', 'acs_wfc_f775w', 'acs_wfc_f850lp', 'wfc3_ir_f105w', 'wfc3_ir_f125w', 'wfc3_ir_f140w', 'wfc3_ir_f160w', 'spitzer_irac_ch1', 'spitzer_irac_ch2'];
  const set = loadShippedTemplates();
  const curves = loadShippedFilters(ten);
  const grid = buildModelGrid(set, curves);
  const single = buildModelGrid(set, curves, undefined, NO_TEMPLATE_PAIRS);
  const nz = grid.redshift.z.length;
  const at = (id: string, k: number) => Array.from(grid.galaxy.subarray((grid.galaxyIds.indexOf(id) * nz + k) * ten.length, (grid.galaxyIds.indexOf(id) * nz + k + 1) * ten.length));

  it('the grid pairs old/early/spiral with star-forming templates up to z = 2.5 and nothing else', () => {
    const ids = Array.from({ length: grid.pairs.length / 2 }, (_, p) => [grid.galaxyIds[grid.pairs[2 * p]!]!, grid.galaxyIds[grid.pairs[2 * p + 1]!]!]);
    expect(ids.length).toBe(11 * 9);
    for (const [a, b] of ids) {
      expect(a).toMatch(/^lowz-(old|early|spiral)/);
      expect(b).toMatch(/^lowz-starforming/);
    }
    expect(grid.redshift.z[grid.pairNz - 1]!).toBeLessThanOrEqual(2.5);
    expect(grid.redshift.z[grid.pairNz]!).toBeGreaterThan(2.5);
    expect(single.pairs.length).toBe(0);
  });

  it('a noiseless old + dusty star-forming sum at z ≈ 1.2 is found as that pair, with χ² far below any single template', () => {
    const k = grid.redshift.z.findIndex((v) => v >= 1.2);
    const old = at('lowz-old-ebv0.20', k);
    const sf = at('lowz-starforming-ebv0.50', k);
    const scale = 100 / Math.max(...old);
    const flux = old.map((v, b) => scale * (v + 0.6 * sf[b]! * (Math.max(...old) / Math.max(...sf))));
    const err = flux.map((f) => 0.005 * Math.abs(f) + 0.1);
    const r = fitPhotoZ(grid, flux, err, { errorFloor: 0, templateErrorScale: 0, prior: 'flat' });
    const one = fitPhotoZ(single, flux, err, { errorFloor: 0, templateErrorScale: 0, prior: 'flat' });
    expect(Math.abs(r.z - grid.redshift.z[k]!)).toBeLessThanOrEqual(0.02);
    expect(r.galaxyChi2).toBeLessThan(1e-6);
    expect(one.galaxyChi2).toBeGreaterThan(5);
    expect(r.galaxyMix?.templates).toEqual(['lowz-old-ebv0.20', 'lowz-starforming-ebv0.50']);
    expect(r.galaxyMix!.shares[0] + r.galaxyMix!.shares[1]).toBeCloseTo(1, 12);
    expect(r.galaxyMix!.shares.every((s) => s > 0)).toBe(true);
    expect(r.galaxyTemplate).toBe(r.galaxyMix!.shares[0] >= r.galaxyMix!.shares[1] ? 'lowz-old-ebv0.20' : 'lowz-starforming-ebv0.50');
    // pairs: false gives the one-template fit exactly.
    expect(fitPhotoZ(grid, flux, err, { errorFloor: 0, templateErrorScale: 0, prior: 'flat', pairs: false }).galaxyChi2).toBe(one.galaxyChi2);
  });
});
