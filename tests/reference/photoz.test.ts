import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { FILTER_DIR, loadShippedFilters, loadShippedTemplates, shippedFilterNames } from '../../backend/src/cli/photoz-data';
import { calzetti2000K } from '../../backend/src/photoz/dust';
import { fitPhotoZ } from '../../backend/src/photoz/fitPhotoZ';
import { photoZIgm } from '../../backend/src/photoz/igm';
import { buildModelGrid, redshiftGrid, type RedshiftGrid } from '../../backend/src/photoz/modelGrid';
import { abMagnitude, AB_ZERO_POINT_NJY, bandAverageFnu, bandSampler, C_ANGSTROM_PER_S, effectiveWavelength, fnuFromFlambda } from '../../backend/src/photoz/photometry';
import { DEFAULT_IGM_MODEL, meanIgmTransmission } from '../../backend/src/spectra/igmTransmission';

const sharedReadme = join(dirname(fileURLToPath(import.meta.url)), '..', '..', '..', 'shared', 'filters', 'README.md');

/**
 * Published λ_eff per filter stem, in Å. Source: the shared filter folder's README (its "Check
 * values" table, quoting the sedpy filter README, definitions of Fukugita et al. 1996, AJ 111,
 * 1748); without that folder, the same numbers as copied into line-lists/filters/README.md.
 */
function publishedEffectiveWavelengths(): Map<string, number> {
  const out = new Map<string, number>();
  const toA = (v: string) => {
    const m = /^([\d.]+)\s*(nm|μm)$/.exec(v.trim());
    if (!m) throw new Error(`cannot read wavelength "${v}"`);
    return Number(m[1]) * (m[2] === 'nm' ? 10 : 1e4);
  };
  if (existsSync(sharedReadme)) {
    for (const line of readFileSync(sharedReadme, 'utf8').split('\n')) {
      const m = /\[`([^`]+)`\]\([^)]+\)\|([^|]+)\|/.exec(line);
      if (m) out.set(m[1]!, toA(m[2]!));
    }
  } else {
    for (const line of readFileSync(join(FILTER_DIR, 'README.md'), 'utf8').split('\n')) {
      const cells = line.split('|').map((c) => c.trim());
      const stem = /^`([^`]+)`$/.exec(cells[1] ?? '')?.[1];
      if (stem && cells[3] && cells[3] !== '—') out.set(stem, toA(cells[3]));
    }
  }
  return out;
}

describe('shipped filter curves', () => {
  const published = publishedEffectiveWavelengths();
  const names = [...shippedFilterNames()].sort();

  it('every published filter is shipped (53 curves, 47 with a published λ_eff)', () => {
    expect(names).toHaveLength(53);
    expect(published.size).toBe(47);
    for (const stem of published.keys()) expect(names).toContain(stem);
  });

  for (const stem of names) {
    const lam = published.get(stem);
    it.skipIf(lam === undefined)(`${stem}: λ_eff within 0.5 % of the published ${lam} Å (sedpy README via ../shared/filters/README.md; Fukugita et al. 1996 definition)`, () => {
      const [curve] = loadShippedFilters([stem]);
      const ours = effectiveWavelength(curve!);
      expect(Math.abs(ours / lam! - 1)).toBeLessThan(0.005);
    });
  }
});

describe('AB photometry (Oke & Gunn 1983, ApJ 266, 713)', () => {
  const curves = loadShippedFilters([...shippedFilterNames()].sort());
  // A flat f_ν of 3631 Jy, given as f_λ = f_ν c / λ² in erg s⁻¹ cm⁻² Å⁻¹ (3631 Jy = 3.631e-20 erg s⁻¹ cm⁻² Hz⁻¹).
  const lam = Float64Array.from({ length: 40000 }, (_, i) => 1000 * Math.exp((i * Math.log(80)) / 39999));
  const flambda = Float64Array.from(lam, (l) => (3.631e-20 * C_ANGSTROM_PER_S) / (l * l));
  const fnuNJy = Float64Array.from(lam, (l, i) => (fnuFromFlambda(flambda[i]!, l) / 1e-23) * 1e9);

  it('a flat f_ν of 3631 Jy has magnitude 0 in every band (curve samples and resampled band)', () => {
    for (const c of curves) {
      const { fnu, covered } = bandAverageFnu(c, lam, fnuNJy);
      expect(covered).toBeCloseTo(1, 12);
      expect(Math.abs(abMagnitude(fnu))).toBeLessThan(1e-9);
      const s = bandSampler(c);
      let sum = 0;
      for (let i = 0; i < s.wavelength.length; i++) sum += s.weight[i]! * AB_ZERO_POINT_NJY;
      expect(Math.abs(abMagnitude(sum))).toBeLessThan(1e-9);
    }
  });

  it('a flat f_ν source has zero colour between any two bands, at any brightness (AB definition)', () => {
    for (const level of [1, 27.3, 1e4]) {
      const flat = new Float64Array(lam.length).fill(level);
      const mags = curves.map((c) => abMagnitude(bandAverageFnu(c, lam, flat).fnu));
      for (const m of mags) expect(Math.abs(m - mags[0]!)).toBeLessThan(1e-9);
      expect(mags[0]).toBeCloseTo(-2.5 * Math.log10(level / 3631e9), 9);
    }
  });

  it('a source with f_ν ∝ λ has the colour of its effective wavelengths, to first order (common practice)', () => {
    // m1 − m2 = −2.5 log10(⟨λ⟩1/⟨λ⟩2); with the photon-counting weights ⟨λ⟩ is the T dλ/λ mean of λ, close to λ_eff.
    const [f435, f160] = loadShippedFilters(['acs_wfc_f435w', 'wfc3_ir_f160w']);
    const lin = Float64Array.from(lam);
    const colour = abMagnitude(bandAverageFnu(f435!, lam, lin).fnu) - abMagnitude(bandAverageFnu(f160!, lam, lin).fnu);
    const expected = -2.5 * Math.log10(effectiveWavelength(f435!) / effectiveWavelength(f160!));
    expect(Math.abs(colour - expected)).toBeLessThan(0.01);
  });
});

describe('physics the photometric fit uses', () => {
  it('its IGM is the engine default, Inoue et al. (2014, MNRAS 442, 1805; values of tests/reference/igm.test.ts)', () => {
    // reference-values.md §3 Lyα-only check values, as in igm.test.ts
    for (const [z, l, t] of [[3.0, 4500, 0.73994], [6.2, 8000, 0.038248]] as const) {
      expect(Math.abs(photoZIgm(l, z) - t) / t).toBeLessThan(1e-4);
    }
    for (const [z, l] of [[3.0, 3850], [4.0, 5000], [7.5, 9000]] as const) expect(photoZIgm(l, z)).toBe(meanIgmTransmission(l, z, 'inoue2014'));
    expect(DEFAULT_IGM_MODEL).toBe('inoue2014');
  });

  it('Calzetti et al. (2000, ApJ 533, 682) k\'(λ): R\'_V = 4.05 at 5500 Å and ≈ 10.3 at 1500 Å (from memory)', () => {
    expect(calzetti2000K(5500)).toBeCloseTo(4.05, 2);
    expect(calzetti2000K(1500)).toBeCloseTo(10.33, 1);
    expect(calzetti2000K(22000)).toBeGreaterThan(0);
    expect(calzetti2000K(30000)).toBeLessThan(calzetti2000K(22000));
  });
});

describe('recovery from noiseless fluxes (property)', () => {
  // Ten HST + Spitzer bands of a deep legacy field (common practice).
  const bands = ['acs_wfc_f435w', 'acs_wfc_f606w', 'acs_wfc_f775w', 'acs_wfc_f850lp', 'wfc3_ir_f105w', 'wfc3_ir_f125w', 'wfc3_ir_f140w', 'wfc3_ir_f160w', 'spitzer_irac_ch1', 'spitzer_irac_ch2'];
  const set = loadShippedTemplates();
  const curves = loadShippedFilters(bands);
  const grid = buildModelGrid(set, curves, redshiftGrid());
  const galaxies = set.templates.filter((t) => t.class === 'galaxy');

  /**
   * Noiseless fluxes of template t at redshift z, built through an independent one-node grid; 100
   * at peak, errors of 1. Fitted with the likelihood alone (flat prior, no template error, no
   * break rule): the property is about the grid and the fit's arithmetic, and the template
   * error's normalisation term, the volume prior and the break rule are meant to move a best z
   * where the data leave it free.
   */
  const observe = (ti: number, z: number) => {
    const one: RedshiftGrid = { z: Float64Array.of(z), edges: Float64Array.of(z, z), dlnOnePlusZ: 0 };
    const truth = buildModelGrid({ grid: set.grid, templates: [galaxies[ti]!] }, curves, one).galaxy;
    let peak = 0;
    for (const v of truth) peak = Math.max(peak, v);
    const flux = Array.from(truth, (v) => (100 * v) / peak);
    return fitPhotoZ(grid, flux, flux.map(() => 1), { prior: 'flat', templateErrorScale: 0, breakDeltaChi2: 0 });
  };
  // Where a template's z is observable: its Lyman break redward of F435W's blue edge (z ≥ 3) for
  // the power laws, which have no other feature; the 4000 Å break inside F435W…IRAC (z ≤ 3.5) for the composites.
  const range = (ti: number): [number, number] => (galaxies[ti]!.kind === 'lyman-break' ? [3, 11.5] : [0.05, 3.5]);
  const arb = fc.tuple(fc.integer({ min: 0, max: galaxies.length - 1 }), fc.double({ min: 0, max: 1, noNaN: true }));

  it('any galaxy template at any grid redshift where its break lies in the bands comes back within one grid step', () => {
    fc.assert(
      fc.property(arb, ([ti, u]) => {
        const [lo, hi] = range(ti);
        const kLo = grid.redshift.z.findIndex((z) => z >= lo);
        const kHi = grid.redshift.z.findLastIndex((z) => z <= hi);
        const z = grid.redshift.z[kLo + Math.round(u * (kHi - kLo))]!;
        const r = observe(ti, z);
        const step = (1 + z) * Math.expm1(grid.redshift.dlnOnePlusZ);
        expect(Math.abs(r.z - z), `${galaxies[ti]!.id} at z = ${z}: fitted ${r.z} (${r.galaxyTemplate})`).toBeLessThanOrEqual(step);
        expect(r.class).toBe('galaxy');
      }),
      { numRuns: 200, seed: 20260412 },
    );
  });

  it('between grid nodes the z comes back within 3 % in 1 + z (Lyα strength and break position trade off inside one band)', () => {
    fc.assert(
      fc.property(arb, ([ti, u]) => {
        const [lo, hi] = range(ti);
        const z = lo + u * (hi - lo);
        const r = observe(ti, z);
        expect(Math.abs(r.z - z) / (1 + z), `${galaxies[ti]!.id} at z = ${z}: fitted ${r.z} (${r.galaxyTemplate})`).toBeLessThan(0.03);
      }),
      { numRuns: 200, seed: 20260413 },
    );
  });
});
