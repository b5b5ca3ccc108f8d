import type { Cell } from './buildExportTable';

/**
 * One CSV field (RFC 4180 quoting, as APE 6 requires for the ECSV body too): null is the empty
 * field; numbers use JavaScript's shortest round-trip form; text is quoted when it holds the
 * delimiter, a quote, a line break or outer spaces, or starts with '#' — unquoted, such a line
 * would be taken for a comment by papaparse (`comments: '#'`) and by ECSV readers.
 */
export function csvField(value: Cell | boolean): string {
  if (value === null) return '';
  if (typeof value === 'number') return String(value);
  if (typeof value === 'boolean') return value ? 'True' : 'False';
  const needsQuotes = value === '' || /[",\r\n]/.test(value) || value.startsWith('#') || value.trim() !== value;
  return needsQuotes ? `"${value.replaceAll('"', '""')}"` : value;
}

/** One CSV record; records end with '\n'. */
export function csvRecord(values: readonly (Cell | boolean)[]): string {
  return values.map(csvField).join(',') + '\n';
}
