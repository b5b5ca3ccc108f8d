import { absorbLine, addLine, type FineGrid } from './fineGrid';
import { applyIgm } from './igmForest';
import { C_KMS } from './physics';
import type { Random } from './random';
import { REST } from './restLines';

/**
 * Interstellar absorption lines of star-forming galaxies (rest vacuum Å); each gets a rest EW of
 * 1–3 Å (doublet members share it 2:1), σ 150–300 km/s, and the galaxy's outflow velocity.
 */
const ISM: Array<[number, number]> = [
  [REST.siII1260, 1], [REST.oI1302, 1], [REST.cII1334, 1],
  [REST.siIV1394, 2 / 3], [REST.siIV1403, 1 / 3], [REST.cIV1548, 2 / 3], [REST.cIV1551, 1 / 3],
];

export interface LymanBreakDraw {
  subclass: string;
  beta: number;
  lyaEw: number;
}

/**
 * A Lyman-break galaxy of our own at systemic redshift z: UV continuum f_λ ∝ λ^β (β in −2.6…−1.4),
 * 5–30 % of it escaping below the Lyman limit, interstellar absorption (ISM) blueshifted by
 * 150 ± 100 km/s, Lyα in emission in half of them (rest EW 3–50 Å, redshifted by 350 ± 150 km/s,
 * its blue side narrower) and in absorption (EW 5–15 Å) otherwise — velocities from memory after
 * Shapley et al. (2003, ApJ 588, 65) — then the stochastic IGM of igmForest.ts.
 */
export function lymanBreakGalaxy(g: FineGrid, z: number, random: Random): LymanBreakDraw {
  const beta = random.uniform(-2.6, -1.4);
  const escape = random.uniform(0.05, 0.3);
  for (let i = 0; i < g.lambda.length; i++) {
    const rest = g.lambda[i]! / (1 + z);
    g.flux[i] = (rest / 1500) ** beta * (rest < REST.lyLimit ? escape : 1);
  }
  const outflow = 150 + 100 * random.gauss();
  for (const [rest, share] of ISM) {
    const center = rest * (1 + z) * (1 - outflow / C_KMS);
    absorbLine(g, center, random.uniform(150, 300), random.uniform(1, 3) * share, z);
  }
  const emitter = random.chance(0.5);
  let lyaEw = 0;
  if (emitter) {
    lyaEw = random.uniform(3, 50);
    const v = 350 + 150 * random.gauss();
    const center = REST.lyAlpha * (1 + z) * (1 + v / C_KMS);
    addLine(g, center, random.uniform(150, 300), lyaEw * (REST.lyAlpha / 1500) ** beta * (1 + z), 0.4);
  } else absorbLine(g, REST.lyAlpha * (1 + z), 800, random.uniform(5, 15), z);
  applyIgm(g, { z }, random);
  return { subclass: emitter ? 'lyman-break-lya-emitter' : 'lyman-break-lya-absorber', beta, lyaEw };
}
