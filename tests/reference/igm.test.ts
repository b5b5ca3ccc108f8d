import { describe, expect, it } from 'vitest';
import { inoue2014OpticalDepth, inoue2014Transmission } from '../../backend/src/spectra/igmInoue2014';
import { igmTransmission, meanIgmTransmission } from '../../backend/src/spectra/igmTransmission';

// Inoue, Shimizu, Iwata & Tanaka 2014, MNRAS 442, 1805. Table 2 and the continuum fits as
// transcribed in igmInoue2014.ts (C2: secondary copies named there). The Madau (1995) check
// values 1–5 of reference-values.md §3 live in physics.test.ts.

const LY_ALPHA = 1215.67;
const LY_BETA = 1025.72;
/** Lyα row of Table 2 (C2): A_LAF,1..3 and A_DLA,1..2. */
const LYA = { laf: [1.69e-2, 2.354e-3, 1.026e-4], dla: [1.617e-4, 5.39e-5] } as const;

/** The Lyα terms alone, straight from the paper's piecewise form, for r = λ_obs/λ_α. */
function lyAlphaDepth(r: number, dla2: number = LYA.dla[1]): number {
  const laf = r < 2.2 ? LYA.laf[0] * r ** 1.2 : r < 5.7 ? LYA.laf[1] * r ** 3.7 : LYA.laf[2] * r ** 5.5;
  const dla = r < 3 ? LYA.dla[0] * r ** 2 : dla2 * r ** 3;
  return laf + dla;
}

const relErr = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('Inoue et al. (2014): Lyα-only check values of reference-values.md §3', () => {
  it('z_s = 3 at 4500 Å: only Lyα contributes, τ = 0.30119, T = 0.73994', () => {
    // Lyβ reaches only λ_β(1+z) = 1025.72 × 4 = 4102.9 Å < 4500, and the continuum only
    // 911.8 × 4 = 3647.2 Å, so the whole model must equal the Lyα term.
    expect(LY_BETA * 4).toBeLessThan(4500);
    expect(inoue2014OpticalDepth(4500, 3)).toBeCloseTo(lyAlphaDepth(4500 / LY_ALPHA), 12);
    // D: r = 4500/1215.67 = 3.70166; LAF 2.354e-3 × r^3.7 (126.785) = 0.298452;
    // DLA (r ≥ 3) 5.390e-5 × r³ (50.7213) = 0.0027339; τ = 0.301186, T = e^−τ = 0.739940.
    expect(relErr(inoue2014OpticalDepth(4500, 3), 0.301186)).toBeLessThan(1e-5);
    expect(relErr(inoue2014Transmission(4500, 3), 0.73994)).toBeLessThan(1e-5);
  });

  it('z_s = 6.2 at 8000 Å: only Lyα contributes, τ = 3.26366, T = 0.038248', () => {
    // Lyβ reaches 1025.72 × 7.2 = 7385.2 Å < 8000.
    expect(LY_BETA * 7.2).toBeLessThan(8000);
    expect(inoue2014OpticalDepth(8000, 6.2)).toBeCloseTo(lyAlphaDepth(8000 / LY_ALPHA), 12);
    // D: r = 6.58073 ≥ 5.7, LAF 1.026e-4 × r^5.5 (31 659.6) = 3.248299; DLA 5.390e-5 × r³
    // (284.99) = 0.015361; τ = 3.263659, T = 0.038248.
    expect(relErr(inoue2014OpticalDepth(8000, 6.2), 3.263659)).toBeLessThan(1e-5);
    expect(relErr(inoue2014Transmission(8000, 6.2), 0.038248)).toBeLessThan(1e-4);
  });

  it("the sheet's 0.7362 and 0.0372 follow only from its A_DLA,2 = 1.54539e-4, which is Lyβ's A_DLA,1", () => {
    // reference-values.md §3 (coefficients flagged M there) gives T = 0.7362 and 0.0372. Putting
    // its DLA value into the same Lyα formula reproduces both, so the whole difference is that one
    // coefficient. Both copies of Table 2 give 5.390e-5 for Lyα and 1.545e-4 as Lyβ's A_DLA,1,
    // and only 5.390e-5 makes the DLA term continuous at 3λ_α: 1.617e-4 × 9 = 1.4553e-3 =
    // 5.390e-5 × 27 (D).
    expect(Math.exp(-lyAlphaDepth(4500 / LY_ALPHA, 1.54539e-4))).toBeCloseTo(0.7362, 4);
    expect(Math.exp(-lyAlphaDepth(8000 / LY_ALPHA, 1.54539e-4))).toBeCloseTo(0.0372, 4);
    expect(relErr(LYA.dla[0] * 9, LYA.dla[1] * 27)).toBeLessThan(1e-4);
    expect(inoue2014Transmission(4500, 3)).not.toBeCloseTo(0.7362, 3);
  });
});

describe('Inoue et al. (2014): full model, worked by hand (D, from the C2 Table 2 and fits)', () => {
  it('z_s = 3 at 3850 Å: Lyα, Lyβ and Lyγ (λ_j > 3850/4 = 962.5 Å), no continuum', () => {
    // Lyα r = 3.16698: LAF 2.354e-3 r^3.7 = 0.167569, DLA 5.390e-5 r³ = 0.001712
    // Lyβ r = 3.75346: LAF 6.536e-4 r^3.7 = 0.087239, DLA 5.151e-5 r³ = 0.002724
    // Lyγ r = 3.95872: LAF 3.119e-4 r^3.7 = 0.050695, DLA 4.992e-5 r³ = 0.003097
    // (Lyδ reaches 949.743 × 4 = 3799 Å < 3850.) τ = 0.313036, T = 0.731224.
    expect(relErr(inoue2014OpticalDepth(3850, 3), 0.313036)).toBeLessThan(1e-5);
    expect(relErr(inoue2014Transmission(3850, 3), 0.731224)).toBeLessThan(1e-5);
  });

  it('z_s = 4 at 5000 Å: Lyα and Lyβ', () => {
    // Lyα r = 4.11296: LAF 2.354e-3 r^3.7 = 0.440735, DLA 5.390e-5 r³ = 0.003750
    // Lyβ r = 4.87462: LAF 6.536e-4 r^3.7 = 0.229453, DLA 5.151e-5 r³ = 0.005966
    // (Lyγ reaches 4862.7 Å; the continuum 4559 Å.) τ = 0.679905, T = 0.506665.
    expect(relErr(inoue2014OpticalDepth(5000, 4), 0.679905)).toBeLessThan(1e-5);
    expect(relErr(inoue2014Transmission(5000, 4), 0.506665)).toBeLessThan(1e-5);
  });

  it('z_s = 3 at 3500 Å, below the Lyman limit 911.8 × 4 = 3647.2 Å: all 39 lines plus the continuum', () => {
    // Series (every λ_j × 4 > 3500 and every λ_j < 3500; r from 2.879 for Lyα to 3.836 for j = 40,
    // so LAF uses A_j2 r^3.7 throughout and DLA A_j1 r² for Lyα only, A_j2 r³ for the rest):
    //   Lyα 0.117771 + 0.001340, Lyβ 0.061314 + 0.002046, Lyγ 0.035630 + 0.002327,
    //   Lyδ 0.022910 + 0.002436, Lyε 0.015853 + 0.002476, j = 7…40 0.069869 + 0.073653;
    //   LAF 0.323346, DLA 0.084279.
    // Continuum, x = 3500/911.8 = 3.83856:
    //   LAF (1.2 ≤ z_s < 4.7, x ≥ 2.2): 2.55e-2 [4^1.6 x^2.1 − x^3.7] = 2.55e-2 [9.18959 × 16.8573
    //     − 145.0264] = 0.251964;
    //   DLA (z_s ≥ 2, x ≥ 3): 4.70e-2 × 64 − 1.78e-2 × 4^3.3 × x^−0.3 − 2.92e-2 x³
    //     = 3.008 − 1.78e-2 × 97.0059 × 0.667957 − 2.92e-2 × 56.5601 = 0.203097.
    // τ = 0.323346 + 0.084279 + 0.251964 + 0.203097 = 0.862685, T = 0.422027.
    // (Independent re-evaluation of the same table in Python agreed to 3e-15 over 20 000 points.)
    expect(relErr(inoue2014OpticalDepth(3500, 3), 0.862685)).toBeLessThan(1e-5);
    expect(relErr(inoue2014Transmission(3500, 3), 0.422027)).toBeLessThan(1e-5);
  });
});

describe('Inoue et al. (2014) against the observations it was built to match', () => {
  // The Lyα-forest effective optical depth at absorber redshift z_a is the model's Lyα term at
  // λ_obs = λ_α(1 + z_a) for a source just beyond z_a (z_s = z_a + 0.1: Lyβ and the continuum
  // cannot reach that far red).
  const tauEffModel = (za: number) => inoue2014OpticalDepth(LY_ALPHA * (1 + za), za + 0.1);
  // Faucher-Giguère et al. 2008, ApJ 681, 831: τ_eff = 0.0018 (1+z)^3.92 over 2 ≤ z ≤ 4.2, metals
  // left in (C: arXiv:0709.2382 abstract). The model is H I only; metals add ~6–9 % at z = 3 (same
  // abstract), one reason to allow 10 %.
  const tauFG08 = (z: number) => 0.0018 * (1 + z) ** 3.92;
  // Becker et al. 2013, MNRAS 430, 2067: τ_eff = 0.751 [(1+z)/4.5]^2.90 − 0.132 (from memory: M).
  const tauB13 = (z: number) => 0.751 * ((1 + z) / 4.5) ** 2.9 - 0.132;

  for (const za of [2.5, 3, 4]) {
    it(`Lyα-forest τ_eff at z = ${za} lies within 10 % of Faucher-Giguère 2008 and Becker 2013`, () => {
      // Model 0.2449 / 0.4010 / 0.9145; FG08 0.2444 / 0.4124 / 0.9891; B13 0.2303 / 0.4017 / 0.8874.
      expect(relErr(tauEffModel(za), tauFG08(za))).toBeLessThan(0.1);
      expect(relErr(tauEffModel(za), tauB13(za))).toBeLessThan(0.1);
    });
  }

  it('at z_s ≳ 6 almost nothing is transmitted blueward of Lyα', () => {
    // The paper's statement (M: not read here). Verified as: T < 0.1 at rest 1080–1215 Å for
    // z_s ≥ 6 (largest 0.091 at z_s = 6), mean over rest 1050–1170 Å below 0.07 at z_s = 6
    // (0.067), and T < 0.01 for z_s ≥ 7. Nearer Lyβ the z_s = 6 forest still passes up to 0.16
    // (rest 1026 Å, absorbers at z ≈ 4.9), so "≈ 0" is about the Lyα–Lyβ gap near the source.
    for (const zs of [6, 6.5, 7, 8]) {
      let max = 0;
      for (let rest = 1080; rest < LY_ALPHA; rest += 0.5) max = Math.max(max, inoue2014Transmission(rest * (1 + zs), zs));
      expect(max).toBeLessThan(zs >= 7 ? 0.01 : 0.1);
    }
    let sum = 0;
    let n = 0;
    for (let rest = 1050; rest <= 1170; rest += 0.5, n++) sum += inoue2014Transmission(rest * 7, 6);
    expect(sum / n).toBeLessThan(0.07);
  });
});

describe('Inoue (2014) vs Madau (1995): which transmits more, measured', () => {
  it('Inoue transmits less between Lyβ and Lyα at z_s ≈ 6 and beyond', () => {
    // 8000 Å at z_s = 6.2: Inoue 0.0382, Madau 0.0873; rest 1100 Å at z_s = 6: 0.0709 vs 0.1181;
    // at z_s = 7: 0.0041 vs 0.0337.
    expect(inoue2014Transmission(8000, 6.2)).toBeLessThan(igmTransmission(8000, 6.2) / 2);
    expect(inoue2014Transmission(1100 * 7, 6)).toBeLessThan(igmTransmission(1100 * 7, 6));
    expect(inoue2014Transmission(1100 * 8, 7)).toBeLessThan(igmTransmission(1100 * 8, 7) / 5);
  });

  it('but not everywhere at z_s = 6: at rest 1000 Å Inoue passes a little more (0.068 vs 0.058)', () => {
    expect(inoue2014Transmission(1000 * 7, 6)).toBeGreaterThan(igmTransmission(1000 * 7, 6));
  });

  it('Inoue transmits more below the Lyman limit at z_s ≈ 3', () => {
    // 3500 Å at z_s = 3: 0.4220 vs 0.2867 (Madau check value 4); 3300 Å: 0.2734 vs 0.1265.
    expect(inoue2014Transmission(3500, 3)).toBeGreaterThan(igmTransmission(3500, 3) + 0.1);
    expect(inoue2014Transmission(3300, 3)).toBeGreaterThan(2 * igmTransmission(3300, 3));
    expect(meanIgmTransmission(3500, 3)).toBe(inoue2014Transmission(3500, 3));
  });

  it('the two agree to a few per cent in the Lyα forest at z_s = 3–5 (rest 1100 Å)', () => {
    // Both are fits to the same forest: 0.7579/0.7348, 0.5315/0.5133, 0.2895/0.2856.
    for (const zs of [3, 4, 5]) {
      expect(relErr(inoue2014Transmission(1100 * (1 + zs), zs), igmTransmission(1100 * (1 + zs), zs))).toBeLessThan(0.04);
    }
  });
});
