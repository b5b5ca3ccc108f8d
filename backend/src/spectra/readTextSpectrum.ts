import Papa from 'papaparse';
import { SpectrumReadError } from './errors';
import { angstromsPer, columnPreference, columnRole, guessAngstromsPer, unitInName, type ColumnRole } from './columnRoles';
import { finishSpectrum, type RawColumns } from './finishSpectrum';
import { fluxUnitFromText } from './parseFluxUnit';
import type { ReadOptions } from './readFitsSpectrum';
import type { Medium, Spectrum, SpectrumMeta } from './types';
import { checkPixelCount, checkWavelengths, MAX_PIXELS } from './spectrumLimits';

const COMMENT = /^\s*(#|!|%|;|\\|\||\/\/)/;
const MAX_COLUMNS = 64;

/**
 * Reads a text table (CSV, TSV or whitespace-separated; papaparse does the splitting) into a
 * spectrum. A header line — the first non-comment line when it is not numeric, or the last
 * comment line just before the data with the right number of names — names the columns; roles
 * and units are sniffed from names ("wave(A)", "lambda_nm", "ivar"...) and from comment text
 * ("... in Angstroms", "vacuum"). Without a header the columns are wavelength, flux, error.
 */
export function readTextSpectrum(bytes: Uint8Array, options: ReadOptions = {}): Spectrum {
  if (bytes.length === 0) throw new SpectrumReadError('empty-file', 'The file is empty.');
  for (let i = 0; i < Math.min(bytes.length, 4096); i++) {
    if (bytes[i] === 0) throw new SpectrumReadError('unknown-format', `Byte ${i} is a NUL: this is a binary file, not a text table.`);
  }
  // Counted on the bytes, before the text is decoded and split: a table of 10⁷ lines would take
  // gigabytes as JavaScript strings. Comment lines are allowed as many again as the pixel limit.
  let newlines = 0;
  for (let i = 0; i < bytes.length; i++) if (bytes[i] === 0x0a) newlines++;
  checkPixelCount(newlines + 1, 'Text table', 'lines, more than twice the pixel limit', 2 * MAX_PIXELS);
  const text = new TextDecoder('utf-8', { fatal: false }).decode(bytes);
  const lines = text.split(/\r\n|\n|\r/);
  const comments: string[] = [];
  const body: string[] = [];
  /** File line (1-based) of each body line, so errors can name it. */
  const bodyLines: number[] = [];
  let headerNames: string[] | undefined;
  let firstDataLine = -1;
  let headerLine = -1;
  let lastCommentLine = -1;
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i]!;
    if (line.trim() === '') continue;
    if (COMMENT.test(line)) {
      if (firstDataLine < 0) {
        comments.push(line.replace(COMMENT, '').trim());
        lastCommentLine = i + 1;
      }
      continue;
    }
    if (firstDataLine < 0) {
      firstDataLine = i + 1;
      if (!looksNumeric(line)) {
        headerNames = split(line);
        headerLine = i + 1;
        continue;
      }
    }
    body.push(line);
    bodyLines.push(i + 1);
  }
  if (body.length === 0) throw new SpectrumReadError('text-table', 'No data lines: every line is empty, a comment or a header.');
  checkPixelCount(body.length, 'Text table', 'data lines');
  const delimiter = /\t/.test(body[0]!) ? '\t' : /,/.test(body[0]!) ? ',' : /;/.test(body[0]!) ? ';' : ' ';
  const joined = delimiter === ' ' ? body.map((l) => l.trim().replace(/\s+/g, '\t')).join('\n') : body.join('\n');
  const parsed = Papa.parse<string[]>(joined, { delimiter: delimiter === ' ' ? '\t' : delimiter, skipEmptyLines: true, dynamicTyping: false });
  const rows = parsed.data;
  // papaparse keeps one row per body line unless a quoted field spans lines; then only a row count can be named.
  const rowLabel = (r: number) => (rows.length === body.length ? `line ${bodyLines[r]}` : `data row ${r + 1}`);
  const width = Math.min(MAX_COLUMNS, rows[0]?.length ?? 0);
  if (width < 2) throw new SpectrumReadError('text-table', `Line ${firstDataLine}: found ${width} column(s); a spectrum needs at least wavelength and flux.`);
  if (!headerNames) {
    const last = comments[comments.length - 1];
    const names = last ? split(last) : [];
    if (names.length === width && !looksNumeric(last!)) {
      headerNames = names;
      headerLine = lastCommentLine;
    }
  }
  const columns: Float64Array[] = [];
  for (let c = 0; c < width; c++) columns.push(new Float64Array(rows.length));
  let good = 0;
  for (let r = 0; r < rows.length; r++) {
    const row = rows[r]!;
    for (let c = 0; c < width; c++) columns[c]![r] = parseNumber(row[c]);
    if (Number.isFinite(columns[0]![r]!) && Number.isFinite(columns[1]![r]!)) good++;
  }
  if (good < rows.length / 2) {
    throw new SpectrumReadError('text-table', `Line ${firstDataLine} onward: fewer than half of the ${rows.length} data lines have numbers in the first two columns.`);
  }
  const roles = new Map<ColumnRole, number>();
  if (headerNames) {
    headerNames.slice(0, width).forEach((name, c) => {
      const role = columnRole(name.replace(/[([{].*$/, ''));
      const held = role && roles.get(role);
      if (role && (held === undefined || columnPreference(name) > columnPreference(headerNames[held]!))) roles.set(role, c);
    });
  }
  // A header that names known columns but no flux column (e.g. "wavelength,sky") is refused: taking
  // some other column as flux would scan a sky or error spectrum as if it were the object.
  if (headerNames && roles.size > 0 && !roles.has('flux')) {
    const named = headerNames.slice(0, width).join(', ');
    throw new SpectrumReadError('text-table', `Line ${headerLine}: the header names the columns ${named} but none of them is a flux column (expected a name such as flux, flam, f_lambda, fnu, counts or intensity).`);
  }
  if (!roles.has('wavelength') && !roles.has('logWavelength')) roles.set('wavelength', 0);
  if (!roles.has('flux')) roles.set('flux', roles.get('wavelength') === 0 || roles.get('logWavelength') === 0 ? 1 : 0);
  if (!headerNames && width >= 3 && !roles.has('error')) roles.set('error', 2);
  const wIndex = (roles.get('wavelength') ?? roles.get('logWavelength'))!;
  const wCol = columns[wIndex]!;
  const commentText = comments.join(' ').toLowerCase();
  const wName = headerNames?.[wIndex] ?? '';
  let factor = unitInName(wName) ?? unitFromComments(commentText);
  const mid = wCol[wCol.length >> 1]!;
  const wavelength = new Float64Array(wCol.length);
  if (roles.has('logWavelength') && !roles.has('wavelength')) {
    for (let i = 0; i < wCol.length; i++) wavelength[i] = 10 ** wCol[i]!;
  } else {
    factor ??= guessAngstromsPer(Math.abs(mid));
    for (let i = 0; i < wCol.length; i++) wavelength[i] = wCol[i]! * factor;
  }
  checkWavelengths(wavelength, 'Text table', rowLabel, wCol);
  const raw: RawColumns = { wavelength, flux: columns[roles.get('flux')!]! };
  const used: Record<string, string> = {};
  for (const [role, c] of roles) {
    used[role] = headerNames?.[c] ?? `column ${c + 1}`;
    if (role === 'error' || role === 'ivar' || role === 'variance' || role === 'mask' || role === 'sky') raw[role] = columns[c]!;
  }
  if (raw.ivar) delete raw.error;
  let medium: Medium = 'air';
  let mediumFrom: SpectrumMeta['mediumFrom'] = 'default';
  if (options.medium) {
    medium = options.medium;
    mediumFrom = 'override';
  } else if (/\bvac(uum)?\b/.test(commentText) || /vac/i.test(wName)) {
    medium = 'vacuum';
    mediumFrom = 'header';
  } else if (/\bair\b/.test(commentText) || /air/i.test(wName)) {
    mediumFrom = 'header';
  }
  const meta: Omit<SpectrumMeta, 'errorsEstimated'> = { source: 'text table', medium, mediumFrom, columns: used, warnings: [] };
  const unit = fluxUnitFromText(headerNames?.[roles.get('flux')!], comments);
  if (unit.raw !== null) meta.fluxUnit = unit.raw;
  return finishSpectrum(raw, meta, 'Text table');
}

function split(line: string): string[] {
  return line.trim().split(/[\s,;]+/).filter((t) => t !== '');
}

function looksNumeric(line: string): boolean {
  const tokens = split(line);
  return tokens.length > 0 && tokens.every((t) => Number.isFinite(parseNumber(t)) || /^(nan|inf|-inf)$/i.test(t));
}

function parseNumber(token: string | undefined): number {
  if (token === undefined) return NaN;
  const t = token.trim();
  if (t === '') return NaN;
  return Number(t.replace(/[dD]/, 'E'));
}

function unitFromComments(text: string): number | undefined {
  if (/\b(angstroms?|ångström|å)\b/.test(text)) return 1;
  if (/\b(nanometers?|nanometres?|nm)\b/.test(text)) return 10;
  if (/\b(microns?|micrometers?|µm|um)\b/.test(text)) return 1e4;
  return angstromsPer('') ?? undefined;
}
