import Papa from 'papaparse';
import type { CatalogueRowError, ColumnMapping, TargetField } from '../contracts/targets';
import { parseDec, parseRa } from './parse-coordinates';
import { guessBandMapping, readBandFluxes, type BandFlux } from './read-band-fluxes';

export interface CatalogueTarget {
  catalogueId: string;
  ra: number | null;
  dec: number | null;
  magnitude: number | null;
  photoZ: number | null;
  photoZLow: number | null;
  photoZHigh: number | null;
  imageFamily: string | null;
  priority: number | null;
  extra: Record<string, string>;
  /** Band fluxes by the mapping's `bands` (empty when it has none). */
  photometry: BandFlux[];
}

// Column names catalogues commonly use for each field (lower case, punctuation removed).
const GUESSES: Record<TargetField, string[]> = {
  id: ['id', 'catalogueid', 'catalogid', 'objid', 'objectid', 'object', 'name', 'targetid', 'target', 'source', 'sourceid'],
  ra: ['ra', 'radeg', 'raj2000', 'alpha', 'ra2000'],
  dec: ['dec', 'decdeg', 'dej2000', 'decj2000', 'delta', 'dec2000'],
  magnitude: ['mag', 'magnitude', 'm', 'magab', 'f160w', 'f814w', 'imag', 'rmag', 'hmag'],
  photoZ: ['photoz', 'zphot', 'zphoto', 'photz', 'zp', 'zpeak', 'zbest', 'zml'],
  photoZLow: ['photozlow', 'zphotlow', 'zphotl68', 'zl68', 'l68', 'zlo', 'photozmin', 'zmin', 'zphotlo'],
  photoZHigh: ['photozhigh', 'zphothigh', 'zphotu68', 'zu68', 'u68', 'zhi', 'photozmax', 'zmax', 'zphothi'],
  imageFamily: ['family', 'imagefamily', 'system', 'imagesystem', 'multipleimage', 'msys', 'arcfamily'],
  priority: ['priority', 'prio', 'rank', 'pri'],
};

const squash = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, '');

/** Proposes a mapping from column names; the person confirms or corrects it in the UI. */
export function guessMapping(columns: string[], knownFilters: readonly string[] = []): ColumnMapping | null {
  const mapping: Partial<Record<TargetField, string>> & Pick<ColumnMapping, 'bands'> = {};
  const bands = guessBandMapping(columns, knownFilters);
  const taken = new Set<string>(bands.flatMap((b) => [b.flux, b.err]));
  for (const field of Object.keys(GUESSES) as TargetField[]) {
    const column = columns.find((c) => !taken.has(c) && GUESSES[field].includes(squash(c)));
    if (column) {
      mapping[field] = column;
      taken.add(column);
    }
  }
  if (!mapping.id) return null;
  if ((mapping.ra === undefined) !== (mapping.dec === undefined)) {
    delete mapping.ra;
    delete mapping.dec;
  }
  if (bands.length > 0) mapping.bands = bands;
  return mapping as ColumnMapping;
}

export interface ParsedCatalogue {
  columns: string[];
  records: Record<string, string>[];
  errors: CatalogueRowError[];
}

/** Splits a CSV/TSV catalogue (delimiter sniffed, `#` comment lines skipped) into named columns. */
export function parseCatalogueText(text: string): ParsedCatalogue {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: 'greedy',
    comments: '#',
    transformHeader: (h) => h.trim(),
  });
  const columns = (parsed.meta.fields ?? []).filter((c) => c !== '');
  const errors: CatalogueRowError[] = parsed.errors
    .filter((e) => e.code !== 'UndetectableDelimiter')
    .map((e) => ({ line: (e.row ?? 0) + 2, column: null, message: e.message }));
  return { columns, records: parsed.data, errors };
}

const MAX_ERRORS = 200;

/**
 * Turns catalogue rows into targets by the mapping, checking each row. Errors name the line as
 * the file shows it (header = line 1). Columns not mapped are kept as extra. Band filters must be
 * in `knownFilters` when it is given.
 */
export function readCatalogueRows(
  parsed: ParsedCatalogue,
  mapping: ColumnMapping,
  knownFilters?: ReadonlySet<string>,
): { targets: CatalogueTarget[]; errors: CatalogueRowError[] } {
  const errors: CatalogueRowError[] = [...parsed.errors];
  const { bands = [], ...fields } = mapping;
  for (const [field, column] of Object.entries(fields)) {
    if (!parsed.columns.includes(column)) errors.push({ line: 1, column, message: `The catalogue has no column "${column}" (mapped to ${field}).` });
  }
  for (const band of bands) {
    for (const column of [band.flux, band.err]) {
      if (!parsed.columns.includes(column)) errors.push({ line: 1, column, message: `The catalogue has no column "${column}" (mapped to the ${band.filter} band).` });
    }
    if (knownFilters && !knownFilters.has(band.filter)) {
      errors.push({ line: 1, column: band.flux, message: `"${band.filter}" is neither a shipped filter nor one of this campaign's own curves.` });
    }
  }
  if (errors.length > 0) return { targets: [], errors };

  const mapped = new Set([...Object.values(fields), ...bands.flatMap((b) => [b.flux, b.err])]);
  const seen = new Map<string, number>();
  const out: CatalogueTarget[] = [];
  parsed.records.forEach((record, index) => {
    if (errors.length >= MAX_ERRORS) return;
    const line = index + 2;
    const fail = (column: string | undefined, message: string) => errors.push({ line, column: column ?? null, message });
    const cell = (field: TargetField) => (fields[field] === undefined ? '' : (record[fields[field]!] ?? '').trim());
    const number = (field: TargetField, check?: (v: number) => string | null): number | null => {
      const raw = cell(field);
      if (raw === '' || /^(nan|null|none|-|--|n\/a)$/i.test(raw)) return null;
      const v = Number(raw);
      if (!Number.isFinite(v)) {
        fail(mapping[field], `"${raw}" is not a number.`);
        return null;
      }
      const problem = check?.(v);
      if (problem) fail(mapping[field], problem);
      return v;
    };

    const id = cell('id');
    if (!id) return fail(mapping.id, 'The catalogue id is empty.');
    const firstLine = seen.get(id);
    if (firstLine !== undefined) return fail(mapping.id, `The id "${id}" already appears on line ${firstLine}.`);
    seen.set(id, line);

    let ra: number | null = null;
    let dec: number | null = null;
    if (mapping.ra && mapping.dec) {
      const rawRa = cell('ra');
      const rawDec = cell('dec');
      if (rawRa || rawDec) {
        ra = parseRa(rawRa);
        dec = parseDec(rawDec);
        if (ra === null) fail(mapping.ra, `"${rawRa}" is not a right ascension (degrees 0–360 or hh:mm:ss).`);
        if (dec === null) fail(mapping.dec, `"${rawDec}" is not a declination (degrees −90…90 or ±dd:mm:ss).`);
      }
    }
    const nonNegative = (v: number) => (v < 0 ? 'A redshift cannot be negative.' : v > 20 ? 'A photometric redshift above 20 is not plausible.' : null);
    const photoZ = number('photoZ', nonNegative);
    const photoZLow = number('photoZLow', nonNegative);
    const photoZHigh = number('photoZHigh', nonNegative);
    if (photoZLow !== null && photoZHigh !== null && photoZLow > photoZHigh) {
      fail(mapping.photoZLow, `The 68 % range is reversed (${photoZLow} > ${photoZHigh}).`);
    } else if (photoZ !== null && ((photoZLow !== null && photoZ < photoZLow) || (photoZHigh !== null && photoZ > photoZHigh))) {
      fail(mapping.photoZ, `The photometric redshift ${photoZ} lies outside its own 68 % range.`);
    }
    const priority = number('priority', (v) => (Number.isInteger(v) ? null : 'The priority must be a whole number.'));
    const extra: Record<string, string> = {};
    for (const c of parsed.columns) if (!mapped.has(c) && record[c] !== undefined && record[c] !== '') extra[c] = record[c]!;
    out.push({
      catalogueId: id,
      ra,
      dec,
      magnitude: number('magnitude'),
      photoZ,
      photoZLow,
      photoZHigh,
      imageFamily: cell('imageFamily') || null,
      priority,
      extra,
      photometry: readBandFluxes(record, bands, (column, message) => fail(column, message)),
    });
  });
  return { targets: out, errors };
}
