import { csvRecord } from './csvField';
import type { FamilyCheck } from './familyTable';
import { commentHeader } from './toCsv';
import type { ExportAssumptions } from './types';

const COLUMNS: [name: string, meaning: string][] = [
  ['image_family', 'Image family (lensed source)'],
  ['n_confirmed', 'Images with a confirmed redshift'],
  ['n_unconfirmed', 'Images without a confirmed redshift'],
  ['z_mean', 'Mean confirmed redshift of the family; null when none is confirmed'],
  ['spread', '(max z - min z)/(1 + z_mean) over confirmed images'],
  ['discrepant', 'True when spread exceeds the agreement tolerance'],
  ['incomplete', 'True when an image has no confirmed redshift'],
  ['flagged', 'discrepant or incomplete'],
  ['members', "Confirmed images as target:z (spectrum id when no target), separated by ';'"],
  ['unconfirmed', "Unconfirmed images (target id, else spectrum id), separated by ';'"],
];

const memberName = (targetId: string | null, spectrumId: number | null) => targetId ?? (spectrumId === null ? '?' : `spectrum ${spectrumId}`);

/**
 * The image-family table as CSV, with the conventions of `toCsv`: `# key: value` comment header
 * (assumptions and column meanings), header row, empty field for null, True/False for flags.
 */
export function familyTableCsv(families: readonly FamilyCheck[], assumptions: ExportAssumptions): string {
  const header = commentHeader('Redward image families', [
    ['campaign', assumptions.campaign],
    ['agreement_tolerance', `${assumptions.tolerance} in |dz|/(1+z)`],
    ['exported_at', assumptions.exportedAt],
    ['software', assumptions.software],
    ...COLUMNS.map(([name, meaning]): [string, string] => [`column.${name}`, meaning]),
  ]);
  const records = families.map((f) =>
    csvRecord([
      f.family,
      f.members.length,
      f.unconfirmed.length,
      f.meanZ,
      f.spread,
      f.discrepant,
      f.incomplete,
      f.flagged,
      f.members.map((m) => `${memberName(m.targetId, m.spectrumId)}:${m.z}`).join(';') || null,
      f.unconfirmed.map((u) => memberName(u.targetId, u.spectrumId)).join(';') || null,
    ]),
  );
  return header + csvRecord(COLUMNS.map(([name]) => name)) + records.join('');
}
