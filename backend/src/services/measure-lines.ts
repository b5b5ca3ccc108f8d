import { eq } from 'drizzle-orm';
import type { CombLines } from '../contracts/line-measurements';
import { spectra } from '../db/schema';
import { AppError } from '../http/errors';
import { linesForClass } from '../spectra/linesForClass';
import { lineFwhmForClass, measureCombLines, type LineMeasurement } from '../spectra/measureCombLines';
import { resolutionElement, resolutionZFloor } from '../spectra/resolutionElement';
import { toVacuumArray } from '../spectra/toVacuum';
import type { FluxUnit } from '../spectra/types';
import type { ServiceContext } from './context';
import { readStoredSpectrum } from './spectrum-data';

/** Integrated flux unit: the f_λ unit times Å, else the file's unit (or "arbitrary") × Å. */
function integratedUnit(unit: FluxUnit): string {
  if (unit.quantity === 'f-lambda') return 'erg s⁻¹ cm⁻²';
  return `${unit.unit} × Å`;
}

/** Fluxes in the normalised unit (file value × scale); EWs, ratios and S/N do not depend on it. */
function scaled(m: LineMeasurement, scale: number): LineMeasurement {
  return scale === 1 ? m : { ...m, flux: m.flux === null ? null : m.flux * scale, fluxErr: m.fluxErr === null ? null : m.fluxErr * scale };
}

/**
 * Measures the comb's lines of a stored spectrum at z, from the stored file (read each time, so
 * nothing cached can go stale: the reader drags the comb and asks again). `cls` is the class of
 * the solution or reading: only the lines its templates draw are measured (all for 'unknown' or
 * none given), and quasars get broad-line windows.
 */
export function measureSpectrumLines(ctx: ServiceContext, spectrumId: number, z: number, cls?: string): CombLines {
  const row = ctx.db.select({ sha256: spectra.sha256, fileName: spectra.fileName }).from(spectra).where(eq(spectra.id, spectrumId)).get()!;
  const spectrum = readStoredSpectrum(ctx, row);
  const wavelength = spectrum.meta.medium === 'air' ? toVacuumArray(spectrum.wavelength) : spectrum.wavelength;
  if (wavelength.length < 2) throw new AppError(422, 'spectrum_unreadable', `${row.fileName} has fewer than two pixels: there is no line to measure.`);
  const resolution = resolutionElement(wavelength);
  const lines = measureCombLines(
    { wavelength, flux: spectrum.flux, ivar: spectrum.ivar, mask: spectrum.mask },
    { z, lines: linesForClass(cls ?? 'unknown'), resolutionFwhmKms: resolution.fwhmKms, lineFwhmKms: lineFwhmForClass(cls ?? 'galaxy') },
  );
  return {
    z,
    fluxUnit: integratedUnit(spectrum.fluxUnit),
    resolution,
    zErrFloor: resolutionZFloor(z, resolution.fwhmKms),
    lines: lines.map((m) => scaled(m, spectrum.fluxUnit.scale)),
  };
}
