import { assumptionEntries, columnEntries, gradeEntries, type Entry } from './assumptionEntries';
import { buildExportTable } from './buildExportTable';
import { csvRecord } from './csvField';
import type { ConfirmedRow, ExportAssumptions } from './types';

/** A comment line must stay one line, or its tail would be read as data. */
const oneLine = (s: string) => s.replace(/[\r\n\u2028\u2029\u0085]+/g, ' ');

/** `# key: value` lines, the comment header every Redward CSV starts with. */
export function commentHeader(title: string, entries: readonly Entry[]): string {
  return [`# ${title}`, ...entries.map(([k, v]) => `# ${k}: ${oneLine(v)}`)].map((l) => l + '\n').join('');
}

/**
 * The confirmed redshift table as CSV: a `# key: value` comment header with every assumption, the
 * grade scheme and each column's meaning and unit, then a header row and one record per row.
 * Reads back with papaparse `{ comments: '#', header: true }`.
 */
export function toCsv(rows: readonly ConfirmedRow[], assumptions: ExportAssumptions): string {
  const table = buildExportTable(rows, assumptions);
  const header = commentHeader('Redward confirmed redshifts', [
    ...assumptionEntries(assumptions),
    ...gradeEntries(assumptions),
    ...columnEntries(table.columns),
  ]);
  return header + csvRecord(table.columns.map((c) => c.name)) + table.cells.map(csvRecord).join('');
}
