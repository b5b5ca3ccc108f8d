import { absorbLine, addLine, type FineGrid } from './fineGrid';
import { planckShape } from './physics';
import type { Random } from './random';
import { readKc96, sedAt, type RealSed } from './readRealSed';
import { REST } from './restLines';

const kc96Cache = new Map<string, RealSed>();
function kc96(name: 'elliptical' | 's0' | 'bulge' | 'sa'): RealSed {
  let s = kc96Cache.get(name);
  if (!s) kc96Cache.set(name, (s = readKc96(name)));
  return s;
}

/**
 * A quiescent galaxy: the real KC96 elliptical, S0, bulge or Sa composite (gradual 4000 Å breaks of
 * old populations) at redshift z, tilted by (λ/5500)^t with t in −0.5…0.5 (dust, calibration).
 * Returns the subclass name and the composite's red end (rest Å): the bulge stops at 7550 Å, and
 * the spectrum's window must stop there too (past it the composite has no flux to give).
 */
export function quiescentGalaxy(g: FineGrid, z: number, random: Random): { subclass: string; redEndRest: number } {
  const name = random.pick(['elliptical', 's0', 'bulge', 'sa'] as const);
  const sed = kc96(name);
  const tilt = random.uniform(-0.5, 0.5);
  const hint = { i: 0 };
  for (let i = 0; i < g.lambda.length; i++) {
    const rest = g.lambda[i]! / (1 + z);
    g.flux[i] = sedAt(sed, rest, hint) * (rest / 5500) ** tilt;
  }
  return { subclass: `quiescent-kc96-${name}`, redEndRest: sed.wavelength[sed.wavelength.length - 1]! };
}

/** Rest vacuum Balmer lines with rest EWs (Å) of an A-star population (Hδ ≈ 5–9 Å in post-starbursts). */
const BALMER_ABSORPTION: Array<[number, number]> = [
  [REST.hAlpha, 0.6], [REST.hBeta, 0.85], [REST.hGamma, 1], [REST.hDelta, 1], [REST.hEpsilon, 0.9],
  [REST.h8, 0.8], [REST.h9, 0.7], [REST.h10, 0.55], [REST.h11, 0.45], [REST.h12, 0.35],
];

/**
 * A post-starburst galaxy of our own: an A-star population (9000–10 000 K Planck shape, Balmer
 * jump at 3646 Å with the flux blueward dropped to 35–60 % and eased over 3646–3720 Å where the
 * crowding high-order lines blend, Balmer absorption lines of σ ≈ 10 Å rest) plus 30–70 % (at
 * 5500 Å) of the KC96 elliptical for the old stars. The Balmer-break shape is the well-known A-star
 * signature (from memory; no fitted source).
 */
export function postStarburstGalaxy(g: FineGrid, z: number, random: Random): string {
  const old = kc96('elliptical');
  const temperature = random.uniform(9000, 10_000);
  const jump = random.uniform(0.35, 0.6);
  const oldShare = random.uniform(0.3, 0.7);
  const norm5500A = planckShape(5500, temperature);
  const norm5500Old = sedAt(old, 5500);
  const hint = { i: 0 };
  for (let i = 0; i < g.lambda.length; i++) {
    const rest = g.lambda[i]! / (1 + z);
    let young = planckShape(rest, temperature) / norm5500A;
    if (rest < REST.balmerLimit) young *= jump;
    else if (rest < 3720) young *= jump + (1 - jump) * ((rest - REST.balmerLimit) / (3720 - REST.balmerLimit)) ** 0.5;
    g.flux[i] = (1 - oldShare) * young + (oldShare * sedAt(old, rest, hint)) / norm5500Old;
  }
  const hDelta = random.uniform(5, 9);
  const sigmaKms = random.uniform(600, 900); // ≈ 10 Å at Hδ: pressure-broadened A-star lines
  for (const [rest, share] of BALMER_ABSORPTION) absorbLine(g, rest * (1 + z), sigmaKms, hDelta * share * (1 - oldShare * 0.5), z);
  absorbLine(g, REST.caK * (1 + z), 250, random.uniform(1.5, 4), z);
  return 'post-starburst';
}

/**
 * An emission-line galaxy of our own: continuum (λ/5500)^α with α in −2.3…−0.8 and a mild
 * 4000 Å step (5–25 %), weak stellar Balmer absorption (2–3 Å), and nebular lines with ratios
 * drawn per galaxy around textbook values (from memory: Case B Hα/Hβ = 2.86, Hγ/Hβ = 0.47,
 * Hδ/Hβ = 0.26 (Osterbrock & Ferland 2006); [O III] 5008/4960 = 2.98 and [N II] 6585/6550 = 2.94
 * (Storey & Zeippen 2000); [S II] and [O II] doublet ratios inside their density limits):
 * Balmer decrement 2.86–6 (dust), [N II]/Hα 0.05–0.6, [O III]/Hβ 0.1–6, [O II]/Hβ 0.5–4,
 * [S II]/Hα 0.1–0.45. Hα rest EW 10–300 Å; line σ uniform in 50–300 km/s.
 */
export function emissionLineGalaxy(g: FineGrid, z: number, random: Random): string {
  const alpha = random.uniform(-2.3, -0.8);
  const step = random.uniform(0.05, 0.25);
  const cont = (rest: number) => (rest / 5500) ** alpha * (1 - step / (1 + Math.exp((rest - 4000) / 30)));
  for (let i = 0; i < g.lambda.length; i++) g.flux[i] = cont(g.lambda[i]! / (1 + z));
  const stellar = random.uniform(2, 3);
  for (const rest of [REST.hBeta, REST.hGamma, REST.hDelta]) absorbLine(g, rest * (1 + z), 400, stellar, z);
  const sigma = random.uniform(50, 300);
  const hAlpha = random.logUniform(10, 300) * cont(REST.hAlpha);
  const decrement = random.uniform(2.86, 6);
  const hBeta = hAlpha / decrement;
  const dust = 2.86 / decrement;
  const nII = random.logUniform(0.05, 0.6) * hAlpha;
  const oIII = random.logUniform(0.1, 6) * hBeta;
  const oII = random.logUniform(0.5, 4) * hBeta * dust;
  const oIIRatio = random.uniform(0.8, 1.45); // 3730/3727
  const sII = random.logUniform(0.1, 0.45) * hAlpha;
  const sIIRatio = random.uniform(0.8, 1.4); // 6718/6733
  const lines: Array<[number, number]> = [
    [REST.hAlpha, hAlpha], [REST.nII6585, nII], [REST.nII6550, nII / 2.94],
    [REST.sII6718, (sII * sIIRatio) / (1 + sIIRatio)], [REST.sII6733, sII / (1 + sIIRatio)],
    [REST.oI6302, random.uniform(0.01, 0.08) * hAlpha], [REST.heI5877, 0.1 * hBeta],
    [REST.hBeta, hBeta], [REST.hGamma, 0.47 * hBeta * dust ** 0.4], [REST.hDelta, 0.26 * hBeta * dust ** 0.6],
    [REST.oIII5008, oIII], [REST.oIII4960, oIII / 2.98],
    [REST.oII3730, (oII * oIIRatio) / (1 + oIIRatio)], [REST.oII3727, oII / (1 + oIIRatio)],
    [REST.neIII, random.uniform(0.02, 0.3) * oII],
  ];
  for (const [rest, flux] of lines) addLine(g, rest * (1 + z), sigma, flux * (1 + z));
  return 'emission-line';
}
