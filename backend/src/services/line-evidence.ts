import type { StoredLineMeasurements } from '../contracts/line-measurements';
import { AppError } from '../http/errors';
import { widenByResolution } from '../spectra/resolutionElement';
import type { ServiceContext } from './context';
import { measureSpectrumLines } from './measure-lines';

/**
 * What a reading, a settlement or a correction stores beside its z: its error widened by the
 * resolution floor of the spectrum at that z, and the measurements of the lines it names, taken
 * from the stored file by the server (never from numbers a client sends). A file that can no
 * longer be read keeps the given error and stores no measurements: the value itself is not lost.
 */
export function lineEvidence(
  ctx: ServiceContext,
  spectrumId: number,
  value: { z: number; zErr: number | null; spectrumClass: string; lines: string[] },
): { zErr: number | null; lineMeasurements: StoredLineMeasurements | null } {
  let measured;
  try {
    measured = measureSpectrumLines(ctx, spectrumId, value.z, value.spectrumClass);
  } catch (err) {
    if (err instanceof AppError && err.code === 'spectrum_unreadable') return { zErr: value.zErr, lineMeasurements: null };
    throw err;
  }
  const used = new Set(value.lines);
  return {
    zErr: widenByResolution(value.zErr, measured.zErrFloor),
    lineMeasurements: { ...measured, lines: measured.lines.filter((m) => used.has(m.name)) },
  };
}
