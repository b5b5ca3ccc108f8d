import { TARGET_FIELDS } from '@contracts/targets';
import type { BandMapping, TargetField } from '@contracts/targets';
import { Table, tdClass, thClass } from '@/components/ui/table';
import type { CataloguePreview as Preview } from '../hooks/use-catalogue-preview';
import type { MappingFormValues } from './mapping-schema';

const SHORT: Record<TargetField, string> = {
  id: 'id',
  ra: 'RA',
  dec: 'Dec',
  magnitude: 'mag',
  photoZ: 'photo-z',
  photoZLow: 'photo-z low',
  photoZHigh: 'photo-z high',
  imageFamily: 'family',
  priority: 'priority',
};

/** The first rows as the file has them; each mapped column says which field it fills. */
export function CataloguePreviewTable({ preview, mapping, bands = [] }: { preview: Preview; mapping: MappingFormValues; bands?: BandMapping[] }) {
  const bandOf = (column: string) => {
    const b = bands.find((x) => x.flux === column || x.err === column);
    return b ? `${b.filter} ${b.flux === column ? 'flux' : 'error'}` : undefined;
  };
  const fieldOf = (column: string) => {
    const f = TARGET_FIELDS.find((x) => mapping[x] === column);
    return f ? SHORT[f] : bandOf(column);
  };
  return (
    <Table caption={`First ${preview.rows.length} rows of the catalogue`}>
      <thead>
        <tr>
          {preview.columns.map((c) => {
            const field = fieldOf(c);
            return (
              <th key={c} scope="col" className={`${thClass} whitespace-nowrap normal-case ${field ? 'bg-ember-50' : ''}`}>
                <span className="num text-ink-800">{c}</span>
                <span className={`block text-xs font-medium ${field ? 'text-ember-700' : 'text-ink-400'}`}>{field ? `→ ${field}` : 'kept as extra'}</span>
              </th>
            );
          })}
        </tr>
      </thead>
      <tbody>
        {preview.rows.map((row, i) => (
          <tr key={i}>
            {preview.columns.map((c) => (
              <td key={c} className={`${tdClass} num whitespace-nowrap`}>
                {row[c] ?? ''}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
