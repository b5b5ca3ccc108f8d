import { DERIVED_NOTE, LINES_NOTE, LYA_NOTE, NULL_NOTE, photoZPriorEntries, ROUNDING_NOTE } from './assumptionEntries';
import { buildExportTable } from './buildExportTable';
import type { ColumnKind } from './confirmedColumns';
import { csvRecord } from './csvField';
import type { ConfirmedRow, ExportAssumptions } from './types';
import { yamlNumber, yamlString } from './yamlScalar';

/** ECSV datatypes (APE 6): ids as int64 so no database id can overflow a reader's integer. */
const ECSV_TYPE: Record<ColumnKind, string> = { int: 'int64', long: 'int64', double: 'float64', string: 'string' };

/**
 * The confirmed redshift table as ECSV 1.0 (Astropy APE 6): `# %ECSV 1.0`, `# ---`, a YAML header
 * with `datatype:` column entries, the assumptions under `meta:` and `schema: astropy-2.0`, then a
 * comma-separated body. Nulls are empty fields, which astropy reads as masked values; text is quoted
 * as CSV requires (line breaks stay inside quoted fields, as APE 6 allows).
 */
export function toEcsv(rows: readonly ConfirmedRow[], assumptions: ExportAssumptions): string {
  const table = buildExportTable(rows, assumptions);
  const a = assumptions;
  const c = a.cosmology;
  const yaml = [
    '%ECSV 1.0',
    '---',
    "delimiter: ','",
    'datatype:',
    ...table.columns.map((col) => {
      const unit = col.unit ? `, unit: ${col.unit}` : '';
      return `- {name: ${col.name}${unit}, datatype: ${ECSV_TYPE[col.kind]}, description: ${yamlString(col.description)}}`;
    }),
    'meta:',
    `  title: ${yamlString('Redward confirmed redshifts')}`,
    `  campaign: ${yamlString(a.campaign)}`,
    `  wavelengths: ${yamlString(a.wavelengths)}`,
    `  cosmology: {name: ${yamlString(c.name)}, H0: ${yamlNumber(c.h0)}, H0_unit: ${yamlString('km / (Mpc s)')}, Om0: ${yamlNumber(c.omegaM)}, Ode0: ${yamlNumber(c.omegaLambda)}, flat: true}`,
    `  agreement_tolerance: ${yamlNumber(a.tolerance)}`,
    `  agreement_tolerance_meaning: ${yamlString('|dz|/(1+z)')}`,
    '  grade_scheme:',
    ...a.gradeScheme.map((g) => `  - {code: ${yamlString(g.code)}, label: ${yamlString(g.label)}, meaning: ${yamlString(g.meaning)}}`),
    `  exported_at: ${yamlString(a.exportedAt)}`,
    `  software: ${yamlString(a.software)}`,
    `  derived_columns: ${yamlString(DERIVED_NOTE)}`,
    `  z_rounding: ${yamlString(ROUNDING_NOTE)}`,
    `  lines_measured: ${yamlString(LINES_NOTE)}`,
    `  lya_caveat: ${yamlString(LYA_NOTE)}`,
    `  nulls: ${yamlString(NULL_NOTE)}`,
    ...(a.photometricRedshift ? [`  photometric_redshift: {filters: ${yamlString(a.photometricRedshift.filters)}, templates: ${yamlString(a.photometricRedshift.templates)}, method: ${yamlString(a.photometricRedshift.method)}}`] : []),
    ...photoZPriorEntries(a).map(([key, value]) => `  ${key}: ${yamlString(value)}`),
    'schema: astropy-2.0',
  ];
  const header = yaml.map((line) => `# ${line}\n`).join('');
  return header + csvRecord(table.columns.map((col) => col.name)) + table.cells.map(csvRecord).join('');
}
