import { DEFAULT_IGM_MODEL, meanIgmTransmission } from '../spectra/igmTransmission';

/**
 * The one place the photometric fit takes its mean intergalactic transmission from: the spectral
 * engine's own module and default model, so photometric and spectroscopic redshifts see the same
 * IGM (Inoue et al. 2014 today; values checked in tests/reference/igm.test.ts).
 *
 * @param observedAngstrom observed wavelength, Å
 * @param zSource source redshift
 * @returns mean transmission, 0…1
 */
export function photoZIgm(observedAngstrom: number, zSource: number): number {
  return meanIgmTransmission(observedAngstrom, zSource, DEFAULT_IGM_MODEL);
}

/** Which IGM model photoZIgm uses, for provenance in outputs and docs. */
export const PHOTOZ_IGM_MODEL = DEFAULT_IGM_MODEL === 'inoue2014' ? 'Inoue et al. (2014)' : 'Madau (1995)';
