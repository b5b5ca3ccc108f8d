import { describe, expect, it } from 'vitest';
import { cohensKappa } from '../../../backend/src/release/cohens-kappa';
import { photoZQuality } from '../../../backend/src/release/photo-z-quality';

describe("Cohen's κ", () => {
  it('matches the 2×2 worked example: 50 items, 20 yes/yes, 15 no/no, 5 and 10 split', () => {
    // p_o = 35/50 = 0.70; rater A says yes 25 times, B 30 times: p_e = 0.5·0.6 + 0.5·0.4 = 0.50; κ = 0.2/0.5 = 0.4
    // (the standard textbook illustration of Cohen 1960's formula; from memory)
    const a = [...Array(20).fill('y'), ...Array(5).fill('y'), ...Array(10).fill('n'), ...Array(15).fill('n')];
    const b = [...Array(20).fill('y'), ...Array(5).fill('n'), ...Array(10).fill('y'), ...Array(15).fill('n')];
    expect(cohensKappa(a, b)).toBeCloseTo(0.4, 12);
  });

  it('is 1 for perfect agreement, undefined when both raters use one category only', () => {
    expect(cohensKappa([4, 3, 2, 4], [4, 3, 2, 4])).toBe(1);
    expect(cohensKappa([4, 4], [4, 4])).toBeNull();
    expect(cohensKappa([], [])).toBeNull();
    expect(() => cohensKappa([1], [])).toThrow(/different numbers/);
  });
});

describe('photoZQuality', () => {
  it('finds outliers beyond |Δz|/(1+z) = 0.15 and computes σ_NMAD', () => {
    const q = photoZQuality([
      { zSpec: 1.0, zPhot: 1.1 }, // 0.05
      { zSpec: 2.0, zPhot: 1.94 }, // −0.02
      { zSpec: 0.5, zPhot: 0.5 }, // 0
      { zSpec: 6.0, zPhot: 1.2 }, // −0.686: a catastrophic outlier
    ]);
    expect(q.outliers).toEqual([3]);
    expect(q.outlierFraction).toBe(0.25);
    // Δz = [0.1, −0.06, 0, −4.8], median −0.03; |Δz − med|/(1+z) = [0.065, 0.01, 0.02, 0.68143]; median 0.0425; ×1.48 = 0.0629
    expect(q.sigmaNmad).toBeCloseTo(0.0629, 4);
  });
});
