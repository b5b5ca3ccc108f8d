/** Why a photometry catalogue was refused: the column and the file line (1 = header) it concerns. */
export class CatalogueError extends Error {
  readonly column: string | null;
  readonly line: number | null;
  constructor(message: string, column: string | null = null, line: number | null = null) {
    super(message);
    this.name = 'CatalogueError';
    this.column = column;
    this.line = line;
  }
}

/** A catalogue's fluxes and errors, row-major in `bands` order (n × bands). NaN marks a band not observed for a source. */
export interface PhotometryTable {
  ids: string[];
  bands: string[];
  flux: Float64Array;
  err: Float64Array;
  /** The file line each source came from (1 = header). */
  lines: number[];
}

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Reads a parsed CSV (header row first) with an `id` column and, per band, `flux_<filter>` and
 * `err_<filter>` in one unit (the CLI's is nJy). Other columns are ignored. A zero or negative
 * flux with an error is a measurement (a non-detection) and is kept; a band whose flux and error
 * cells are both empty is "not observed" for that source (NaN). Refused, naming the column and
 * line: a filter not in `knownFilters`, a flux without its error column (or the reverse), a
 * non-numeric cell, one of the pair empty, an error that is not positive, a missing id.
 *
 * @param rows the CSV as rows of cells; rows[0] is the header; `lineOf(i)` gives row i's file line
 * @throws CatalogueError
 */
export function readPhotometryTable(rows: string[][], knownFilters: ReadonlySet<string>, lineOf: (row: number) => number = (i) => i + 1): PhotometryTable {
  const header = rows[0]?.map((h) => h.trim());
  if (!header || header.every((h) => h === '')) throw new CatalogueError('the catalogue is empty: it needs a header row with id, flux_<filter> and err_<filter> columns');
  const idCol = header.indexOf('id');
  if (idCol < 0) throw new CatalogueError(`no "id" column in the header (columns: ${header.join(', ')})`, 'id', lineOf(0));
  const fluxCols = new Map<string, number>();
  const errCols = new Map<string, number>();
  header.forEach((h, c) => {
    const m = /^(flux|err)_(.+)$/.exec(h);
    if (!m) return;
    const [, kind, filter] = m;
    if (!knownFilters.has(filter!)) {
      throw new CatalogueError(`column "${h}": unknown filter "${filter}" (a filter is the file stem of a curve in line-lists/filters, e.g. wfc3_ir_f160w)`, h, lineOf(0));
    }
    const map = kind === 'flux' ? fluxCols : errCols;
    if (map.has(filter!)) throw new CatalogueError(`column "${h}" appears twice`, h, lineOf(0));
    map.set(filter!, c);
  });
  for (const f of fluxCols.keys()) if (!errCols.has(f)) throw new CatalogueError(`column "flux_${f}" has no error column "err_${f}"`, `err_${f}`, lineOf(0));
  for (const f of errCols.keys()) if (!fluxCols.has(f)) throw new CatalogueError(`column "err_${f}" has no flux column "flux_${f}"`, `flux_${f}`, lineOf(0));
  const bands = [...fluxCols.keys()];
  if (bands.length === 0) throw new CatalogueError('no flux_<filter> / err_<filter> columns in the header', null, lineOf(0));

  const ids: string[] = [];
  const lines: number[] = [];
  const data = rows.slice(1).map((r, k) => ({ r, line: lineOf(k + 1) })).filter(({ r }) => !(r.length === 1 && r[0]!.trim() === ''));
  const nb = bands.length;
  const flux = new Float64Array(data.length * nb);
  const err = new Float64Array(data.length * nb);
  data.forEach(({ r, line }, i) => {
    const id = (r[idCol] ?? '').trim();
    if (id === '') throw new CatalogueError(`line ${line}: empty id`, 'id', line);
    if (r.length !== header.length) throw new CatalogueError(`line ${line} (id ${id}): ${r.length} cells where the header has ${header.length}`, null, line);
    ids.push(id);
    lines.push(line);
    bands.forEach((f, b) => {
      const fc = (r[fluxCols.get(f)!] ?? '').trim();
      const ec = (r[errCols.get(f)!] ?? '').trim();
      if (fc === '' && ec === '') {
        flux[i * nb + b] = NaN;
        err[i * nb + b] = NaN;
        return;
      }
      for (const [cell, col] of [[fc, `flux_${f}`], [ec, `err_${f}`]] as const) {
        if (cell === '') throw new CatalogueError(`line ${line} (id ${id}), column ${col}: empty while its ${col.startsWith('flux') ? 'error' : 'flux'} is given (leave both empty for a band not observed)`, col, line);
        if (!NUMBER.test(cell)) throw new CatalogueError(`line ${line} (id ${id}), column ${col}: "${cell.slice(0, 40)}" is not a number`, col, line);
      }
      const fv = Number(fc);
      const ev = Number(ec);
      if (!(ev > 0) || !Number.isFinite(ev)) throw new CatalogueError(`line ${line} (id ${id}), column err_${f}: the error must be positive, got ${ec}`, `err_${f}`, line);
      if (!Number.isFinite(fv)) throw new CatalogueError(`line ${line} (id ${id}), column flux_${f}: ${fc} is not a finite flux`, `flux_${f}`, line);
      flux[i * nb + b] = fv;
      err[i * nb + b] = ev;
    });
  });
  return { ids, bands, flux, err, lines };
}
