import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseFilterCurve, type FilterCurve } from '../photoz/filterCurve';
import { photoZTemplates, type TemplateSet } from '../photoz/analyticTemplates';

/** The shipped photo-z data, read from the repository's line-lists folder (the edge where files are read). */
const lineLists = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..', '..', 'line-lists');
export const FILTER_DIR = join(lineLists, 'filters');

/** File stems of the shipped filter curves. */
export function shippedFilterNames(): Set<string> {
  return new Set(readdirSync(FILTER_DIR).filter((f) => f.endsWith('.par')).map((f) => f.slice(0, -4)));
}

/** Reads and parses shipped curves by stem, in the order given. */
export function loadShippedFilters(names: string[]): FilterCurve[] {
  return names.map((n) => parseFilterCurve(readFileSync(join(FILTER_DIR, `${n}.par`), 'utf8'), n));
}

/** The photo-z templates: built in memory from our own recipes on first call (no file; see analyticTemplates.ts). */
export function loadShippedTemplates(): TemplateSet {
  return photoZTemplates();
}
