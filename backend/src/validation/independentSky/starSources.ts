import type { FineGrid } from './fineGrid';
import { airToVacuum, planckShape } from './physics';
import type { Random } from './random';
import { readKesseli, readSpex, sedAt, type RealSed } from './readRealSed';
import { REST } from './restLines';

/** The real dwarf standards used (../shared/real-spectra/stars); the L3 is left out: its S/N is ≈ 0.2–1. */
export const OPTICAL_DWARFS = ['Kesseli2017_M0_+0.0_Dwarf.fits', 'Kesseli2017_M3_+0.0_Dwarf.fits', 'Kesseli2017_M5_+0.0_Dwarf.fits', 'Kesseli2017_M7_+0.0_Dwarf.fits', 'Kesseli2017_M9.fits', 'Kesseli2017_L0.fits'] as const;
export const INFRARED_DWARFS = ['SpeXstd_L2_10600_10957.fits', 'SpeXstd_L5_10351_10583.fits', 'SpeXstd_L8_10115_11254.fits', 'SpeXstd_T2_10017_10945.fits', 'SpeXstd_T5_10021_11106.fits', 'SpeXstd_T8_10126_10349.fits'] as const;

const cache = new Map<string, RealSed>();
/** A dwarf standard's SED (vacuum Å), read once. */
export function dwarfSed(file: string): RealSed {
  let s = cache.get(file);
  if (!s) cache.set(file, (s = file.startsWith('Kesseli') ? readKesseli(file) : readSpex(file)));
  return s;
}

/** Fills the grid with a real M/L/T dwarf at z = 0 (its own resolution; the caller adds noise). */
export function coolDwarf(g: FineGrid, file: string): string {
  const sed = dwarfSed(file);
  const hint = { i: 0 };
  for (let i = 0; i < g.lambda.length; i++) g.flux[i] = sedAt(sed, g.lambda[i]!, hint);
  return `dwarf-${/_(M\d|L\d|T\d)/.exec(file)?.[1] ?? file}`;
}

/**
 * Molecular band heads of carbon stars, standard-air Å: C2 Swan Δv = +1, 0, −1 at 4737, 5165, 5636
 * and Δv = −2 at 6191 (from memory), degrading to the blue; CN red-system heads at 6926, 7088,
 * 7874 and 8067 (from memory), degrading to the red.
 */
export const SWAN_HEADS_AIR = [4737, 5165, 5636, 6191] as const;
export const CN_HEADS_AIR = [6926, 7088, 7874, 8067] as const;

/**
 * A carbon star of our own at z = 0: a 2600–3400 K Planck continuum, C2 Swan bands as optical depth
 * τ₀·e^{−(λ_head − λ)/L} blueward of each head (τ₀ 0.6–1.5, L 80–200 Å), CN bands τ₀·e^{−(λ − λ_head)/L}
 * redward (τ₀ 0.3–0.8, L 60–120 Å), and Na D. Band heads converted from air to vacuum.
 */
export function carbonStar(g: FineGrid, random: Random): string {
  const t = random.uniform(2600, 3400);
  const bands = [
    ...SWAN_HEADS_AIR.map((h) => ({ head: airToVacuum(h), tau: random.uniform(0.6, 1.5), scale: random.uniform(80, 200), blue: true })),
    ...CN_HEADS_AIR.map((h) => ({ head: airToVacuum(h), tau: random.uniform(0.3, 0.8), scale: random.uniform(60, 120), blue: false })),
  ];
  const norm = planckShape(7000, t);
  for (let i = 0; i < g.lambda.length; i++) {
    const lam = g.lambda[i]!;
    let tau = 0;
    for (const b of bands) {
      const d = b.blue ? b.head - lam : lam - b.head;
      if (d >= 0) tau += b.tau * Math.exp(-d / b.scale);
    }
    for (const na of [REST.naD2, REST.naD1]) tau += 1.5 * Math.exp(-0.5 * ((lam - na) / 2.5) ** 2);
    g.flux[i] = (planckShape(lam, t) / norm) * Math.exp(-tau);
  }
  return 'carbon-star';
}
