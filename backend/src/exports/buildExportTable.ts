import { checkExportInput } from './checkExportInput';
import { CONFIRMED_COLUMNS, type ExportColumn } from './confirmedColumns';
import { cosmicColumns } from './cosmicColumns';
import type { ConfirmedRow, ExportAssumptions } from './types';
import { asciiUnit, formatLinesMeasured, lyaCaveat } from './lineEvidence';
import { roundToError } from '../spectra/roundToError';

/** A cell: numbers for int/long/double columns, strings for string columns, null when absent. */
export type Cell = number | string | null;

/** The confirmed rows flattened to the export columns, shared by every writer. */
export interface ExportTable {
  columns: readonly ExportColumn[];
  cells: Cell[][];
}

/** Empty text carries no information and no format below can tell it from a missing value. */
const text = (s: string | null): string | null => (s === null || s === '' ? null : s);

/**
 * Checks the input and lays the rows out as the columns of CONFIRMED_COLUMNS, with the derived
 * lookback time and luminosity distance, z rounded to its error (roundToError) and the lines with
 * their measurements in one field. Convention shared by all formats: an empty string or an
 * empty list is written as null.
 */
export function buildExportTable(rows: readonly ConfirmedRow[], assumptions: ExportAssumptions): ExportTable {
  checkExportInput(rows, assumptions);
  const cells = rows.map((r): Cell[] => {
    const derived = cosmicColumns(r.z, assumptions.cosmology);
    // z to the digits its error supports; the error rounded up, so it never falls below its floor.
    const rounded = r.zErr !== null && r.zErr > 0 ? roundToError(r.z, r.zErr) : null;
    return [
      r.id,
      text(r.targetId),
      r.spectrumId,
      text(r.fileName),
      r.ra,
      r.dec,
      rounded ? rounded.value : r.z,
      rounded ? rounded.error : r.zErr,
      r.zErrFloor,
      r.gradeCode,
      text(r.gradeLabel),
      r.spectrumClass,
      text(r.lines.join(';')),
      formatLinesMeasured(r.lineMeasurements),
      r.lineFluxUnit === null || r.lineMeasurements.length === 0 ? null : asciiUnit(r.lineFluxUnit),
      lyaCaveat(r.spectrumClass, r.lines, r.lineMeasurements),
      r.photoZ,
      r.photoZLow,
      r.photoZHigh,
      text(r.imageFamily),
      text(r.readers.join(';')),
      r.confirmedBy,
      text(r.confirmedAt),
      r.supersedes,
      derived.lookbackGyr,
      derived.luminosityMpc,
      r.interloperZ,
      r.interloperDeltaChi2,
      r.starDeltaChi2,
      r.zPhot ?? null,
      r.zPhotLow ?? null,
      r.zPhotHigh ?? null,
      r.zPhotPLowZ ?? null,
    ];
  });
  return { columns: CONFIRMED_COLUMNS, cells };
}
