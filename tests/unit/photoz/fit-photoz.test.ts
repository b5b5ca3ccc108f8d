import { describe, expect, it } from 'vitest';
import { loadShippedFilters, loadShippedTemplates } from '../../../backend/src/cli/photoz-data';
import { fitCatalogue, fitPhotoZ } from '../../../backend/src/photoz/fitPhotoZ';
import { buildModelGrid } from '../../../backend/src/photoz/modelGrid';

const bands = ['acs_wfc_f435w', 'acs_wfc_f606w', 'acs_wfc_f775w', 'acs_wfc_f850lp', 'wfc3_ir_f125w', 'wfc3_ir_f160w'];
const grid = buildModelGrid(loadShippedTemplates(), loadShippedFilters(bands));
const nz = grid.redshift.z.length;
const model = (id: string, z: number) => {
  const t = grid.galaxyIds.indexOf(id);
  const k = grid.redshift.z.findIndex((v) => v >= z);
  const m = Array.from(grid.galaxy.subarray((t * nz + k) * bands.length, (t * nz + k + 1) * bands.length));
  const peak = Math.max(...m);
  return { z: grid.redshift.z[k]!, flux: m.map((v) => (50 * v) / peak) };
};

describe('fitPhotoZ', () => {
  it('uses non-detections as measurements: the blue zeros of a z ≈ 6 dropout rule out the low-z solution', () => {
    const { z, flux } = model('lbg-beta-2.0', 6);
    const err = flux.map(() => 3);
    const withZeros = fitPhotoZ(grid, flux, err);
    expect(Math.abs(withZeros.z - z)).toBeLessThan(0.1);
    expect(withZeros.pLowZ).toBeLessThan(1e-3);
    // The same source with its three blue bands not observed (NaN) knows much less.
    const blind = fitPhotoZ(grid, flux.map((f, b) => (b < 3 ? NaN : f)), err);
    expect(blind.bands).toBe(3);
    expect(blind.z95[1] - blind.z95[0]).toBeGreaterThan(withZeros.z95[1] - withZeros.z95[0]);
    expect(withZeros.bands).toBe(6);
  });

  it('clips amplitudes at zero: an all-negative source gets the zero model\'s χ² for every template', () => {
    const flux = bands.map(() => -6);
    const err = bands.map(() => 3);
    const r = fitPhotoZ(grid, flux, err, { errorFloor: 0 });
    expect(r.galaxyChi2).toBeCloseTo(bands.length * 4, 9);
    expect(r.starChi2).toBeCloseTo(bands.length * 4, 9);
    expect(r.class).toBe('star'); // a tie goes to the star
  });

  it('puts a 4000 Å-break galaxy at low z with interloper odds above one half, and P(z) integrates to 1', () => {
    const { z, flux } = model('lowz-old', 1.2);
    const r = fitPhotoZ(grid, flux, flux.map((f) => 0.02 * f + 0.5), { withPosterior: true });
    expect(Math.abs(r.z - z) / (1 + z)).toBeLessThan(0.02);
    expect(r.pLowZ).toBeGreaterThan(0.5);
    expect(r.z68[0]).toBeLessThanOrEqual(r.z);
    let mass = 0;
    const e = grid.redshift.edges;
    r.posterior!.forEach((p, k) => (mass += p * (e[k + 1]! - e[k]!)));
    expect(mass).toBeCloseTo(1, 9);
  });

  it('fitCatalogue gives the same answers as one fit per source', () => {
    const a = model('lbg-beta-1.6-lya50', 4.5);
    const b = model('lowz-spiral-ebv0.50', 0.8);
    const flux = Float64Array.from([...a.flux, ...b.flux]);
    const err = flux.map(() => 2);
    const cols = fitCatalogue(grid, flux, err, 2);
    const one = fitPhotoZ(grid, b.flux, b.flux.map(() => 2));
    expect(cols.z[1]).toBe(one.z);
    expect([cols.z95[2], cols.z95[3]]).toEqual(one.z95);
    expect(grid.galaxyIds[cols.galaxyTemplate[1]!]).toBe(one.galaxyTemplate);
    // Lyα strength and the break position trade off inside one band, so the volume prior and the
    // template error move this noiseless dropout by ≈ 0.14 along that valley: 3 % in 1 + z.
    expect(Math.abs(cols.z[0]! - a.z) / (1 + a.z)).toBeLessThan(0.03);
  });

  describe('the break rule: no detected Lyman break, no dropout', () => {
    const ten = ['acs_wfc_f435w', 'acs_wfc_f606w', 'acs_wfc_f775w', 'acs_wfc_f850lp', 'wfc3_ir_f105w', 'wfc3_ir_f125w', 'wfc3_ir_f140w', 'wfc3_ir_f160w', 'spitzer_irac_ch1', 'spitzer_irac_ch2'];
    const g10 = buildModelGrid(loadShippedTemplates(), loadShippedFilters(ten));
    // A flat f_ν of 100 ± 10 in every band, F435W given as `blue`.
    const fit = (blue: number, options = {}) => fitPhotoZ(g10, ten.map((_, b) => (b === 0 ? blue : 100)), ten.map(() => 10), options);

    it('a flat source whose F435W is 1.5σ low stays below z = 2 (without the rule the noise reads as a partial forest drop at z ≈ 2.6)', () => {
      expect(fit(85).z).toBeLessThan(2);
      expect(fit(85, { breakDeltaChi2: 0 }).z).toBeGreaterThan(2.5);
      expect(fit(85).pLowZ).toBeCloseTo(fit(85, { breakDeltaChi2: 0 }).pLowZ, 12); // P(z) untouched
    });

    it('a 7σ drop in F435W is a break: z ≈ 3.5 with or without the rule', () => {
      const r = fit(30);
      expect(r.z).toBeGreaterThan(3.2);
      expect(r.z).toBeLessThan(4);
      expect(r.z).toBe(fit(30, { breakDeltaChi2: 0 }).z);
      expect(r.pLowZ).toBeLessThan(0.01);
    });
  });
});
