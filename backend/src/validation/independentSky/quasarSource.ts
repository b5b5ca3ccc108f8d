import { addLine, type FineGrid } from './fineGrid';
import { applyIgm } from './igmForest';
import { C_KMS } from './physics';
import type { Random } from './random';
import { REST } from './restLines';

/** How a quasar line moves with the object's outflow: high-ionisation lines share the blueshift. */
type Kind = 'high' | 'low' | 'narrow' | 'lya';

/**
 * Broad and narrow lines: rest vacuum λ, flux relative to Lyα = 100 (from memory after the SDSS
 * composite of Vanden Berk et al. 2001, AJ 122, 549, Table 2; each perturbed by 0.25 dex per
 * object), and how the line moves. The blueshift share of each high-ionisation line follows the
 * usual ordering (C IV, N V and He II most, Si IV less, C III] least; from memory: Richards et al.
 * 2011; Meyer et al. 2019).
 */
const LINES: Array<{ rest: number; rel: number; kind: Kind; share?: number }> = [
  { rest: REST.oVI, rel: 9, kind: 'high', share: 1 },
  { rest: REST.lyAlpha, rel: 100, kind: 'lya' },
  { rest: REST.nV, rel: 2.5, kind: 'high', share: 1 },
  { rest: REST.oISiII, rel: 1.7, kind: 'low' },
  { rest: REST.cII1335, rel: 0.6, kind: 'low' },
  { rest: REST.siIVoIV, rel: 8.9, kind: 'high', share: 0.8 },
  { rest: REST.cIV, rel: 25, kind: 'high', share: 1 },
  { rest: REST.heII, rel: 2.5, kind: 'high', share: 1.2 },
  { rest: REST.cIII, rel: 16, kind: 'high', share: 0.4 },
  { rest: REST.mgII, rel: 14.7, kind: 'low' },
  { rest: REST.neV, rel: 1, kind: 'narrow' },
  { rest: REST.oIIblend, rel: 0.4, kind: 'narrow' },
  { rest: REST.hGamma, rel: 4, kind: 'low' },
  { rest: REST.hBeta, rel: 8.6, kind: 'low' },
  { rest: REST.oIII4960, rel: 1.0, kind: 'narrow' },
  { rest: REST.oIII5008, rel: 3.0, kind: 'narrow' },
  { rest: REST.hAlpha, rel: 31, kind: 'low' },
];

/**
 * The blueshift (km/s, positive = toward us) of a quasar's high-ionisation lines: log-normal with
 * median 1400 km/s and σ = 0.6 in ln (most between ≈ 800 and 2500), 15 % near rest (0–500),
 * capped at 5000. C IV blueshifts of luminous quasars run from ~0 to ≳ 5000 km/s with a typical
 * ~1000–2000 at z > 6 (from memory: Meyer et al. 2019; Schindler et al. 2020).
 */
export function drawBlueshift(random: Random): number {
  if (random.chance(0.15)) return random.uniform(0, 500);
  return Math.min(5000, 1400 * Math.exp(0.6 * random.gauss()));
}

export interface QuasarDraw {
  subclass: string;
  /** The C IV blueshift drawn, km/s. */
  blueshiftKms: number;
}

/**
 * A quasar of our own at redshift z (systemic; the truth): power law f_ν ∝ ν^α, α ~ N(−0.45, 0.3),
 * turning redder (α = −2.0) past 5000 Å rest (host and hot dust; from memory after Vanden Berk
 * et al. 2001), a broad 2200–4000 Å bump of 10–30 % (Fe II and Balmer continuum, as one smooth
 * shape), broad lines of FWHM 2500–8000 km/s, high-ionisation lines blueshifted (drawBlueshift ×
 * the line's share), low-ionisation lines at systemic ± 150 km/s, narrow lines (σ 150–400 km/s)
 * at systemic ± 50 km/s. Then the stochastic IGM (igmForest.ts); above z = 5.7 a Gunn–Peterson
 * trough with a proximity zone of 2–7 proper Mpc.
 */
export function quasar(g: FineGrid, z: number, random: Random): QuasarDraw {
  const alpha = -0.45 + 0.3 * random.gauss();
  const bump = random.uniform(0.1, 0.3);
  const shape = (rest: number) => {
    const blue = (Math.min(rest, 5000) / 1450) ** (-2 - alpha);
    const red = rest > 5000 ? (rest / 5000) ** (-2 + 2.0) : 1;
    return blue * red * (1 + bump * Math.exp(-0.5 * ((rest - 3000) / 500) ** 2));
  };
  for (let i = 0; i < g.lambda.length; i++) g.flux[i] = shape(g.lambda[i]! / (1 + z));
  const blueshift = drawBlueshift(random);
  const fwhm = random.logUniform(2500, 8000);
  const lyaEw = random.logUniform(40, 150);
  const lyaFlux = lyaEw * shape(REST.lyAlpha);
  const narrowSigma = random.uniform(150, 400);
  for (const line of LINES) {
    const flux = (line.rel / 100) * lyaFlux * 10 ** (0.25 * random.gauss()) * (1 + z);
    let v = 0;
    let sigma = fwhm / 2.355;
    if (line.kind === 'high') {
      v = -blueshift * (line.share ?? 1);
      sigma *= 1 + 0.2 * (blueshift / 2000); // blueshifted lines are broader (from memory)
    } else if (line.kind === 'low') v = 150 * random.gauss();
    else if (line.kind === 'narrow') {
      v = 50 * random.gauss();
      sigma = narrowSigma;
    }
    const center = line.rest * (1 + z) * (1 + v / C_KMS);
    if (line.kind === 'lya') {
      // Lyα as a narrower core and a broad base.
      addLine(g, center, sigma * 0.5, 0.4 * flux);
      addLine(g, center, sigma * 1.3, 0.6 * flux);
    } else addLine(g, center, sigma, flux);
  }
  const highZ = z > 5.7;
  const proximityMpc = highZ ? random.uniform(2, 7) : undefined;
  applyIgm(g, { z, proximityMpc, troughFloor: highZ ? 0.001 : undefined }, random);
  return { subclass: highZ ? 'quasar-gp-trough' : z > 2 ? 'quasar-forest' : 'quasar', blueshiftKms: blueshift };
}
