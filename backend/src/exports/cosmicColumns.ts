import { cosmicTimes } from '../spectra/flatLcdm';
import type { ExportAssumptions } from './types';

/** The two derived columns of an export row. */
export interface CosmicColumns {
  lookbackGyr: number;
  luminosityMpc: number | null;
}

/**
 * Lookback time (Gyr) and luminosity distance (Mpc) at z under the export's flat ΛCDM cosmology.
 * Stars sit at z ≈ 0 and may carry a slightly negative z from their own motion, where neither
 * quantity means anything cosmological: lookback is 0 and the distance null for z ≤ 0.
 * Values are rounded to 1e-5 Gyr and 1e-3 Mpc, far below the cosmology's own uncertainty, so the
 * text formats stay readable and all formats carry the same numbers.
 *
 * @example cosmicColumns(6.2, planck).lookbackGyr // 12.90512 for H0 = 67.4, Ω_m = 0.315
 */
export function cosmicColumns(z: number, cosmology: ExportAssumptions['cosmology']): CosmicColumns {
  if (z <= 0) return { lookbackGyr: 0, luminosityMpc: null };
  const t = cosmicTimes(z, { h0: cosmology.h0, omegaM: cosmology.omegaM });
  return { lookbackGyr: Math.round(t.lookbackGyr * 1e5) / 1e5, luminosityMpc: Math.round(t.luminosityMpc * 1e3) / 1e3 };
}
