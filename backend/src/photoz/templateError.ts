import { LY_ALPHA_A, LYMAN_LIMIT_A } from './restTemplates';

/**
 * The template error function: how far, as a fraction of the flux, a real galaxy may sit from the
 * nearest of our templates at a given rest wavelength, beyond what the catalogue's errors and the
 * calibration floor carry. It is added in quadrature to each band's error at each trial redshift,
 * read at the band's rest wavelengths λ_obs / (1 + z), so a band that sees a poorly known part of
 * the spectrum counts for less there and only there. Shape (our numbers, common practice: small
 * where the templates are pinned by data and physics, large where they are a guess):
 *   - rest optical 3500 – 9000 Å: 3 % (stellar continua and the 4000 Å break are what our recipes
 *     are checked on, against the KC96 colours);
 *   - near-UV and far-UV: rising to 8 % at 1216 Å (dust-law and age variations move the UV slope);
 *   - the Lyman forest 912 – 1216 Å: 20 % (the sightline-to-sightline scatter of the mean IGM
 *     transmission in a broad band is of this order — from memory, and no template can know it);
 *     below 912 Å the same (almost nothing is transmitted; the value only bounds a model that
 *     predicts a little flux there);
 *   - near-infrared: rising from 3 % at 9000 Å to 20 % at 2 µm and 25 % beyond 3 µm (no template
 *     recipe here is constrained by data there: stellar near-IR bumps, TP-AGB light and hot dust
 *     vary from galaxy to galaxy by tens of per cent).
 * Piecewise linear in ln λ between those nodes.
 */
const NODES: Array<[restA: number, fraction: number]> = [
  [LYMAN_LIMIT_A, 0.2],
  [LY_ALPHA_A - 1, 0.2],
  [LY_ALPHA_A, 0.08],
  [3500, 0.03],
  [9000, 0.03],
  [20000, 0.2],
  [30000, 0.25],
];

export function templateErrorFraction(restA: number): number {
  if (restA <= NODES[0]![0]) return NODES[0]![1];
  for (let i = 1; i < NODES.length; i++) {
    const [l1, f1] = NODES[i]!;
    if (restA <= l1) {
      const [l0, f0] = NODES[i - 1]!;
      return f0 + ((f1 - f0) * Math.log(restA / l0)) / Math.log(l1 / l0);
    }
  }
  return NODES[NODES.length - 1]![1];
}
