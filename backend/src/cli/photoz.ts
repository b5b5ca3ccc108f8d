import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import Papa from 'papaparse';
import { FilterCurveError, parseFilterCurve, type FilterCurve } from '../photoz/filterCurve';
import { fitCatalogue, type PhotoZColumns } from '../photoz/fitPhotoZ';
import { buildModelGrid } from '../photoz/modelGrid';
import { CatalogueError, readPhotometryTable } from '../photoz/photometryCatalogue';
import { loadShippedFilters, loadShippedTemplates, shippedFilterNames } from './photoz-data';
import { fitCatalogueOnThreads } from './photoz-pool';

/**
 * `npm run photoz -- CATALOGUE.csv [--json] [--threads N] [--curve NAME=FILE ...]`
 * Photometric redshifts from a CSV with `id`, `flux_<filter>` and `err_<filter>` (nJy); filter =
 * a file stem in line-lists/filters, or a NAME given with --curve (a two-column text curve).
 * Prints one JSON line per source (--json) or a table. Exit 2 with a usage line on any bad input.
 */
const USAGE = 'Usage: npm run photoz -- CATALOGUE.csv [--json] [--threads N] [--curve NAME=FILE ...]';
const args = process.argv.slice(2);
let file: string | undefined;
let json = false;
let threads = 1;
const ownCurves: FilterCurve[] = [];
for (let i = 0; i < args.length; i++) {
  const a = args[i]!;
  if (a === '--json') json = true;
  else if (a === '--threads') {
    threads = Number(args[++i]);
    if (!Number.isInteger(threads) || threads < 1 || threads > 64) usage('--threads needs a whole number from 1 to 64');
  } else if (a === '--curve') {
    const spec = args[++i] ?? '';
    const eq = spec.indexOf('=');
    if (eq <= 0) usage('--curve needs NAME=FILE');
    const name = spec.slice(0, eq);
    if (!/^[A-Za-z0-9_.-]+$/.test(name)) usage(`--curve name "${name}" may hold only letters, digits, ".", "_" and "-"`);
    try {
      ownCurves.push(parseFilterCurve(readFileSync(spec.slice(eq + 1), 'utf8'), name));
    } catch (e) {
      usage(e instanceof FilterCurveError ? e.message : `cannot read ${spec.slice(eq + 1)}: ${(e as Error).message}`);
    }
  } else if (a.startsWith('--')) usage(`unknown option ${a}`);
  else if (file === undefined) file = a;
  else usage(`one catalogue at a time (got ${file} and ${a})`);
}
if (file === undefined) usage('no catalogue given');

let text: string;
try {
  text = readFileSync(file, 'utf8');
} catch (e) {
  usage(`cannot read ${file}: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}`);
}
const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { delimiter: ',', skipEmptyLines: false });
if (parsed.errors.length > 0) {
  const e = parsed.errors[0]!;
  usage(`${basename(file)}: CSV error on line ${(e.row ?? 0) + 1}: ${e.message}`);
}
const known = shippedFilterNames();
for (const c of ownCurves) {
  if (known.has(c.name)) usage(`--curve ${c.name}: a shipped filter already has that name`);
  known.add(c.name);
}
let table;
try {
  table = readPhotometryTable(parsed.data, known);
} catch (e) {
  if (e instanceof CatalogueError) usage(`${basename(file)}: ${e.message}`);
  throw e;
}
const own = new Map(ownCurves.map((c) => [c.name, c]));
const shipped = loadShippedFilters(table.bands.filter((b) => !own.has(b)));
const curves = table.bands.map((b) => own.get(b) ?? shipped.find((c) => c.name === b)!);
const grid = buildModelGrid(loadShippedTemplates(), curves);
const n = table.ids.length;
const cols: PhotoZColumns = threads > 1 && n > 1000
  ? await fitCatalogueOnThreads(grid, table.flux, table.err, n, threads)
  : fitCatalogue(grid, table.flux, table.err, n);

const r4 = (v: number) => (Number.isFinite(v) ? Number(v.toFixed(4)) : null);
const r3 = (v: number) => (Number.isFinite(v) ? Number(v.toFixed(3)) : null);
const out: string[] = [];
if (!json) out.push(['id', 'z', 'z68', 'z95', 'pLowZ', 'class', 'starChi2', 'galaxyChi2'].join('\t'));
for (let i = 0; i < n; i++) {
  const noData = cols.bands[i] === 0;
  const row = {
    id: table.ids[i]!,
    z: noData ? null : r4(cols.z[i]!),
    z68: noData ? null : [r4(cols.z68[2 * i]!), r4(cols.z68[2 * i + 1]!)],
    z95: noData ? null : [r4(cols.z95[2 * i]!), r4(cols.z95[2 * i + 1]!)],
    pLowZ: noData ? null : r4(cols.pLowZ[i]!),
    class: noData ? null : cols.isStar[i] ? 'star' : 'galaxy',
    starChi2: noData ? null : r3(cols.starChi2[i]!),
    galaxyChi2: noData ? null : r3(cols.galaxyChi2[i]!),
  };
  out.push(json ? JSON.stringify(row) : [row.id, row.z, row.z68?.join('–'), row.z95?.join('–'), row.pLowZ, row.class, row.starChi2, row.galaxyChi2].join('\t'));
}
process.stdout.write(out.join('\n') + '\n');

function usage(why: string): never {
  console.error(`${USAGE}\n  ${why}`);
  process.exit(2);
}
