import { assumptionEntries, gradeEntries } from './assumptionEntries';
import { buildExportTable, type Cell } from './buildExportTable';
import type { ExportColumn } from './confirmedColumns';
import type { ConfirmedRow, ExportAssumptions } from './types';
import { xmlText } from './xmlText';

/** Namespace fixed for all VOTable 1.x versions from 1.3 on (VOTable REC 1.4/1.5, §"namespace"). */
export const VOTABLE_NAMESPACE = 'http://www.ivoa.net/xml/VOTable/v1.3';

const isAscii = (v: Cell) => typeof v !== 'string' || /^[\x00-\x7f]*$/.test(v);

/**
 * VOTable 1.4 `char` holds ASCII only, so a text column with any other character is declared
 * `unicodeChar` (same TABLEDATA text, different binary encoding).
 */
function fieldType(col: ExportColumn, values: Cell[]): string {
  if (col.kind !== 'string') return `datatype="${col.kind}"`;
  return `datatype="${values.every(isAscii) ? 'char' : 'unicodeChar'}" arraysize="*"`;
}

function field(col: ExportColumn, values: Cell[], assumptions: ExportAssumptions): string {
  const unit = col.unit ? ` unit="${col.unit}"` : '';
  const ref = col.name === 'ra' || col.name === 'dec' ? ' ref="J2000"' : '';
  // The grade scheme belongs to the grade column: VALUES/OPTION is VOTable's own list of codes.
  const options =
    col.name === 'grade_code'
      ? `<VALUES>${assumptions.gradeScheme.map((g) => `<OPTION name="${xmlText(g.label)}" value="${xmlText(g.code)}"/>`).join('')}</VALUES>`
      : '';
  return `      <FIELD name="${col.name}" ${fieldType(col, values)}${unit} ucd="${col.ucd}"${ref}><DESCRIPTION>${xmlText(col.description)}</DESCRIPTION>${options}</FIELD>\n`;
}

/** An empty TD is a null in TABLEDATA, for numbers and text alike (VOTable 1.3+, from memory). */
const td = (v: Cell) => (v === null ? '<TD/>' : `<TD>${xmlText(String(v))}</TD>`);

/**
 * The confirmed redshift table as an IVOA VOTable 1.4 document with TABLEDATA serialisation: the
 * assumptions as RESOURCE INFO elements, one FIELD per column with datatype, unit and UCD, and the
 * grade scheme as VALUES/OPTION of the grade column.
 */
export function toVotable(rows: readonly ConfirmedRow[], assumptions: ExportAssumptions): string {
  const table = buildExportTable(rows, assumptions);
  const infos = [...assumptionEntries(assumptions), ...gradeEntries(assumptions)]
    .map(([name, value]) => `    <INFO name="${xmlText(name)}" value="${xmlText(value)}"/>\n`)
    .join('');
  const fields = table.columns.map((col, i) => field(col, table.cells.map((r) => r[i]!), assumptions)).join('');
  const data = table.cells.map((r) => `        <TR>${r.map(td).join('')}</TR>\n`).join('');
  return (
    '<?xml version="1.0" encoding="UTF-8"?>\n' +
    `<VOTABLE version="1.4" xmlns="${VOTABLE_NAMESPACE}">\n` +
    '  <RESOURCE type="results" name="confirmed_redshifts">\n' +
    `    <DESCRIPTION>Redward confirmed redshifts of campaign ${xmlText(assumptions.campaign)}</DESCRIPTION>\n` +
    infos +
    '    <COOSYS ID="J2000" system="eq_FK5" equinox="J2000"/>\n' +
    `    <TABLE name="confirmed_redshifts" nrows="${table.cells.length}">\n` +
    fields +
    '      <DATA>\n        <TABLEDATA>\n' +
    data +
    '        </TABLEDATA>\n      </DATA>\n    </TABLE>\n  </RESOURCE>\n</VOTABLE>\n'
  );
}
