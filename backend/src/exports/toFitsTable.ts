import { DERIVED_NOTE, LINES_NOTE, LYA_NOTE, NULL_NOTE, photoZPriorEntries, ROUNDING_NOTE } from './assumptionEntries';
import { buildExportTable, type Cell } from './buildExportTable';
import type { ColumnKind, ExportColumn } from './confirmedColumns';
import { fitsAscii } from './fitsAscii';
import { commentaryCards, headerBytes, valueCards } from './fitsCards';
import type { ConfirmedRow, ExportAssumptions } from './types';

/** Binary-table storage per kind (FITS 4.0 Table 18): K int64, J int32, D float64, A characters. */
const FORM: Record<Exclude<ColumnKind, 'string'>, { code: string; bytes: number }> = {
  long: { code: 'K', bytes: 8 },
  int: { code: 'J', bytes: 4 },
  double: { code: 'D', bytes: 8 },
};

/** Null integers carry the most negative value of their type, declared as TNULLn. */
const TNULL: Record<'long' | 'int', bigint> = { long: -(2n ** 63n), int: -(2n ** 31n) };

interface Layout {
  col: ExportColumn;
  tform: string;
  width: number;
  offset: number;
  /** ASCII text of each row for character columns. */
  text?: (string | null)[];
}

function layOut(columns: readonly ExportColumn[], cells: Cell[][]): Layout[] {
  let offset = 0;
  return columns.map((col, i) => {
    let layout: Layout;
    if (col.kind === 'string') {
      const text = cells.map((r) => (r[i] === null ? null : fitsAscii(String(r[i]))));
      // Width = longest value, at least 1: a zero-width 'A' column is legal but trips many readers.
      const width = Math.max(1, ...text.map((t) => t?.length ?? 0));
      layout = { col, tform: `${width}A`, width, offset, text };
    } else {
      const f = FORM[col.kind];
      layout = { col, tform: f.code, width: f.bytes, offset };
    }
    offset += layout.width;
    return layout;
  });
}

function tableHeader(layouts: Layout[], rowWidth: number, rows: number, a: ExportAssumptions): string[] {
  const c = a.cosmology;
  const cards = [
    ...valueCards('XTENSION', 'BINTABLE', 'binary table extension'),
    ...valueCards('BITPIX', 8, '8-bit bytes'),
    ...valueCards('NAXIS', 2, '2-dimensional binary table'),
    ...valueCards('NAXIS1', rowWidth, 'width of a row in bytes'),
    ...valueCards('NAXIS2', rows, 'number of rows'),
    ...valueCards('PCOUNT', 0, 'no heap'),
    ...valueCards('GCOUNT', 1, 'one group'),
    ...valueCards('TFIELDS', layouts.length, 'number of columns'),
    ...valueCards('EXTNAME', 'CONFIRMED', 'confirmed redshifts'),
  ];
  layouts.forEach((l, i) => {
    const n = i + 1;
    cards.push(...valueCards(`TTYPE${n}`, l.col.name, l.col.description));
    cards.push(...valueCards(`TFORM${n}`, l.tform));
    if (l.col.unit) cards.push(...valueCards(`TUNIT${n}`, l.col.unit));
    if (l.col.kind === 'long' || l.col.kind === 'int') cards.push(...valueCards(`TNULL${n}`, TNULL[l.col.kind], 'null value'));
  });
  cards.push(
    ...valueCards('CAMPAIGN', a.campaign, 'Redward campaign'),
    ...valueCards('WAVEMED', 'VACUUM', 'wavelengths are vacuum wavelengths'),
    ...valueCards('COSMO', c.name, 'cosmology of the derived columns'),
    ...valueCards('COSMO_H0', c.h0, '[km/s/Mpc] Hubble constant'),
    ...valueCards('COSMO_OM', c.omegaM, 'matter density Omega_m'),
    ...valueCards('COSMO_OL', c.omegaLambda, 'dark energy density Omega_Lambda'),
    ...valueCards('COSMOFLT', true, 'flat universe'),
    ...valueCards('ZTOLER', a.tolerance, 'agreement tolerance on |dz|/(1+z)'),
    ...valueCards('DATE', fitsDate(a.exportedAt), 'export time (UTC)'),
    ...valueCards('SOFTWARE', a.software, 'software that wrote this file'),
  );
  for (const g of a.gradeScheme) cards.push(...commentaryCards('COMMENT', `Grade ${g.code} = ${g.label}: ${g.meaning}`));
  cards.push(
    ...commentaryCards('COMMENT', `Derived columns: ${DERIVED_NOTE}.`),
    ...commentaryCards('COMMENT', `Rounding: ${ROUNDING_NOTE}.`),
    ...commentaryCards('COMMENT', `Lines: ${LINES_NOTE}.`),
    ...commentaryCards('COMMENT', `Caveat: ${LYA_NOTE}.`),
    ...commentaryCards('COMMENT', `Nulls: NaN in D columns, TNULLn in K and J columns, a leading NUL in A columns; ${NULL_NOTE}.`),
    ...(a.photometricRedshift ? commentaryCards('COMMENT', `z_phot columns: filters ${a.photometricRedshift.filters}; ${a.photometricRedshift.templates}; ${a.photometricRedshift.method}.`) : []),
    ...photoZPriorEntries(a).flatMap(([key, value]) => commentaryCards('COMMENT', `${key === 'photo_z_prior' ? 'Prior' : 'Prior records'}: ${value}.`)),
    ...commentaryCards('COMMENT', "Text is ASCII: accents dropped (NFKD), tabs and line breaks become spaces, other characters '?'."),
  );
  return cards;
}

/** DATE takes 'YYYY-MM-DDThh:mm:ss[.sss]' in UTC without a zone letter (FITS 4.0 §4.4.2.1). */
const fitsDate = (iso: string) => new Date(iso).toISOString().replace('Z', '');

function tableData(layouts: Layout[], cells: Cell[][], rowWidth: number): Uint8Array {
  // Zero fill doubles as the data padding of the last block (FITS 4.0 §3.3.2).
  const out = new Uint8Array(Math.ceil((rowWidth * cells.length) / 2880) * 2880);
  const view = new DataView(out.buffer);
  cells.forEach((row, r) => {
    const base = r * rowWidth;
    layouts.forEach((l, i) => {
      const at = base + l.offset;
      const v = row[i]!;
      if (l.text) {
        const t = l.text[r];
        // Null text stays all NUL; text shorter than the field is padded with spaces.
        if (t !== null && t !== undefined) for (let k = 0; k < l.width; k++) out[at + k] = k < t.length ? t.charCodeAt(k) : 0x20;
      } else if (l.col.kind === 'double') view.setFloat64(at, v === null ? NaN : (v as number));
      else if (l.col.kind === 'long') view.setBigInt64(at, v === null ? TNULL.long : BigInt(v as number));
      else view.setInt32(at, v === null ? Number(TNULL.int) : (v as number));
    });
  });
  return out;
}

/**
 * The confirmed redshift table as a FITS 4.0 file: an empty primary HDU, then one BINTABLE
 * extension whose header carries the columns (TTYPEn, TFORMn, TUNITn, TNULLn) and the assumptions
 * (CAMPAIGN, WAVEMED, COSMO*, ZTOLER, DATE, SOFTWARE and COMMENT cards), and whose data are
 * big-endian rows. Text columns are ASCII per `fitsAscii`.
 */
export function toFitsTable(rows: readonly ConfirmedRow[], assumptions: ExportAssumptions): Uint8Array {
  const table = buildExportTable(rows, assumptions);
  const layouts = layOut(table.columns, table.cells);
  const rowWidth = layouts.reduce((sum, l) => sum + l.width, 0);
  const primary = headerBytes([
    ...valueCards('SIMPLE', true, 'conforms to FITS standard'),
    ...valueCards('BITPIX', 8, 'no primary data'),
    ...valueCards('NAXIS', 0, 'no primary data'),
    ...valueCards('EXTEND', true, 'the table follows as an extension'),
  ]);
  const header = headerBytes(tableHeader(layouts, rowWidth, table.cells.length, assumptions));
  const data = tableData(layouts, table.cells, rowWidth);
  const out = new Uint8Array(primary.length + header.length + data.length);
  out.set(primary, 0);
  out.set(header, primary.length);
  out.set(data, primary.length + header.length);
  return out;
}
