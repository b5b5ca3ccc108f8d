import { describe, expect, it } from 'vitest';
import { toVacuum } from '../../backend/src/spectra/toVacuum';
import { toAir } from '../../backend/src/spectra/toAir';
import { igmTransmission } from '../../backend/src/spectra/igmTransmission';
import { ageClosedForm, cosmicTimes, PLANCK18 } from '../../backend/src/spectra/flatLcdm';

describe('air ↔ vacuum (Morton 2000, ApJS 130, 403; IAU convention)', () => {
  it('reproduces published pairs', () => {
    // [O III] air 5006.843 → vac 5008.240: NIST-level value (reference-values.md §2, D; SDSS 5008.239, C2)
    expect(toVacuum(5006.843)).toBeCloseTo(5008.2397, 3);
    // Hβ air 4861.363 → 4862.721: astrolibR airtovac example (reference-values.md §2, C)
    expect(toVacuum(4861.363)).toBeCloseTo(4862.721, 3);
    // Kr air 6056.125 → 6057.8019: IDL astrolib AIRTOVAC documentation example (reference-values.md §2, C)
    expect(toVacuum(6056.125)).toBeCloseTo(6057.8019, 3);
    // vac 2000 → air 1999.352 (IDL VACTOAIR example 1999.353, C; Morton gives 1999.3520, D)
    expect(toAir(2000)).toBeCloseTo(1999.352, 3);
    // Hα air 6562.801 → 6564.614: SDSS vacuum table (reference-values.md §2, C2)
    expect(toVacuum(6562.801)).toBeCloseTo(6564.614, 2);
  });

  it('matches the SDSS air/vacuum set to ≤ 0.005 Å', () => {
    // SDSS vacwavelength page pairs quoted in reference-values.md §2 (C2)
    const pairs: Array<[number, number]> = [
      [4861.363, 4862.721], [4958.911, 4960.295], [5006.843, 5008.239], [6548.05, 6549.86],
      [6562.801, 6564.614], [6583.45, 6585.27], [6716.44, 6718.29], [6730.82, 6732.68],
    ];
    for (const [air, vac] of pairs) expect(Math.abs(toVacuum(air) - vac)).toBeLessThan(0.005);
  });

  it('round-trips to 1e-4 Å across the optical and near-IR (common practice)', () => {
    for (let lam = 2000; lam <= 25000; lam += 137) expect(Math.abs(toAir(toVacuum(lam)) - lam)).toBeLessThan(1e-4);
  });

  it('leaves wavelengths below 2000 Å alone (IAU: vacuum quoted below 2000 Å; NIST ASD header, C)', () => {
    expect(toVacuum(1215.67)).toBe(1215.67);
    expect(toAir(1548.187)).toBe(1548.187);
  });
});

describe('IGM transmission, Madau (1995, ApJ 441, 18)', () => {
  // Check values computed from the paper's formula in reference-values.md §3 (D, from C/C2 inputs)
  const cases: Array<[number, number, number]> = [
    [3.0, 4500, 0.7167],
    [6.2, 8000, 0.08729],
    [3.0, 3850, 0.60705],
    [3.0, 3500, 0.2867],
    [4.0, 5000, 0.41178],
  ];
  for (const [z, lam, t] of cases) {
    it(`z=${z} at ${lam} Å → T=${t}`, () => {
      expect(Math.abs(igmTransmission(lam, z) - t) / t).toBeLessThan(2e-4);
    });
  }
  it('is 1 redward of Lyα and drops where Lyβ blanketing adds (Madau 1995, common practice)', () => {
    expect(igmTransmission(1216 * 4 + 1, 3)).toBe(1);
    expect(igmTransmission(3850, 3)).toBeLessThan(igmTransmission(4500, 3));
    expect(igmTransmission(3000, 3)).toBeLessThan(0.1);
  });
});

describe('flat ΛCDM (Hogg 1999; Planck 2018 VI abstract H0=67.4, Ωm=0.315)', () => {
  // reference-values.md §4 worked example and table (D, scipy quad at 1e-12)
  it('age today and at z = 6.2, lookback time', () => {
    expect(cosmicTimes(0).ageGyr).toBeCloseTo(13.7962, 3);
    const t = cosmicTimes(6.2);
    expect(t.ageGyr).toBeCloseTo(0.8911, 3);
    expect(t.lookbackGyr).toBeCloseTo(12.9051, 3);
  });
  it('distances at z = 1 and 3 (reference-values.md §4 table, D)', () => {
    expect(cosmicTimes(1).comovingMpc).toBeCloseTo(3401.26, 1);
    expect(cosmicTimes(1).luminosityMpc).toBeCloseTo(6802.53, 1);
    expect(cosmicTimes(3).comovingMpc).toBeCloseTo(6506.06, 1);
    expect(cosmicTimes(3).luminosityMpc).toBeCloseTo(26024.25, 1);
    const other = cosmicTimes(3, { h0: 70, omegaM: 0.3 });
    expect(other.luminosityMpc).toBeCloseTo(25422.74, 1);
  });
  it('numerical age agrees with the closed form to 1e-6 Gyr (closed form: reference-values.md §4, M, checked there numerically)', () => {
    for (const z of [0, 0.5, 1, 2.7, 6.2, 9, 20]) {
      expect(Math.abs(cosmicTimes(z).ageGyr - ageClosedForm(z))).toBeLessThan(1e-6);
      expect(Math.abs(cosmicTimes(z, { h0: 70, omegaM: 0.3 }).ageGyr - ageClosedForm(z, { h0: 70, omegaM: 0.3 }))).toBeLessThan(1e-6);
    }
  });
  it('angular scale at z = 1 follows from D_A (D_A = D_C/(1+z), Hogg 1999)', () => {
    const t = cosmicTimes(1, PLANCK18);
    expect(t.kpcPerArcsec).toBeCloseTo((3401.26 / 2) * 1000 / 206264.806, 2);
  });
});
