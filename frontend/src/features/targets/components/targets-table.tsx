import type { Target } from '@contracts/targets';
import { createColumnHelper, createSortedRowModel, rowSortingFeature, sortFn_alphanumeric, sortFn_basic, tableFeatures, useTable } from '@tanstack/react-table';
import { SortableTh } from '@/components/ui/sort-header';
import { Table, tdClass } from '@/components/ui/table';
import { formatDegrees } from '@/lib/format';
import { formatInterval, formatPercent } from './photo-z-words';

const features = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, basic: sortFn_basic },
});
const helper = createColumnHelper<typeof features, Target>();

/** Nulls become undefined so sortUndefined can keep blanks at the bottom; a blank is not a small number. */
const orBlank = <T,>(v: T | null) => v ?? undefined;
const num = (v: number | undefined, digits?: number) => (v === undefined ? '—' : digits === undefined ? String(v) : v.toFixed(digits));

/** Photo-z as the catalogue gives it, with its 68 % range when there is one. */
function photoZ(t: Target) {
  if (t.photoZ === null) return '—';
  const range = t.photoZLow !== null && t.photoZHigh !== null ? ` (${t.photoZLow}–${t.photoZHigh})` : '';
  return `${t.photoZ}${range}`;
}

const blankLast = { sortFn: 'basic', sortUndefined: 'last' } as const;

const columns = helper.columns([
  helper.accessor('catalogueId', { header: 'Catalogue id', sortFn: 'alphanumeric' }),
  helper.accessor((t) => orBlank(t.ra), { id: 'ra', header: 'RA (°)', ...blankLast, cell: (c) => formatDegrees(c.getValue() ?? null) }),
  helper.accessor((t) => orBlank(t.dec), { id: 'dec', header: 'Dec (°)', ...blankLast, cell: (c) => formatDegrees(c.getValue() ?? null) }),
  helper.accessor((t) => orBlank(t.magnitude), { id: 'magnitude', header: 'Magnitude', ...blankLast, cell: (c) => num(c.getValue(), 2) }),
  helper.accessor((t) => orBlank(t.photoZ), { id: 'photoZ', header: () => (
      <>
        Catalogue photo-<span className="normal-case">z</span> (68 %)
      </>
    ), ...blankLast, cell: (c) => photoZ(c.row.original) }),
  helper.accessor((t) => orBlank(t.photoZFit?.z), { id: 'zPhot', header: () => (
      <>
        Computed photo-<span className="normal-case">z</span> (95 %)
      </>
    ), ...blankLast, cell: (c) => {
      const fit = c.row.original.photoZFit;
      return fit ? `${fit.z.toFixed(2)} (${formatInterval(fit.z95)})` : '—';
    } }),
  helper.accessor((t) => orBlank(t.photoZFit?.pLowZ), { id: 'pLowZ', header: () => (
      <>
        P(<span className="normal-case">z</span> &lt; 2)
      </>
    ), ...blankLast, cell: (c) => (c.getValue() === undefined ? '—' : formatPercent(c.getValue()!)) }),
  helper.accessor((t) => orBlank(t.photoZFit?.class), { id: 'photoClass', header: 'Fits as', sortFn: 'alphanumeric', sortUndefined: 'last', cell: (c) => c.getValue() ?? '—' }),
  helper.accessor((t) => orBlank(t.imageFamily), { id: 'imageFamily', header: 'Image family', sortFn: 'alphanumeric', sortUndefined: 'last', cell: (c) => c.getValue() ?? '—' }),
  helper.accessor((t) => orBlank(t.priority), { id: 'priority', header: 'Priority', ...blankLast, cell: (c) => num(c.getValue()) }),
  helper.accessor('spectrumCount', { header: 'Spectra', sortFn: 'basic' }),
]);

const TEXT_COLUMNS = new Set(['catalogueId', 'imageFamily', 'photoClass']);

/**
 * The campaign's targets, sorted in the browser (the whole list is loaded). A target with
 * photometry opens its P(z) and SED from its id.
 */
export function TargetsTable({ targets, selectedId, onSelect }: { targets: Target[]; selectedId: number | null; onSelect: (targetId: number) => void }) {
  const table = useTable({
    features,
    columns,
    data: targets,
    getRowId: (t) => String(t.id),
    initialState: { sorting: [{ id: 'catalogueId', desc: false }] },
    enableMultiSort: false,
  });

  return (
    <Table caption="Targets" captionHidden>
      <thead>
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers.map((header) => (
              <SortableTh
                key={header.id}
                state={header.column.getIsSorted()}
                onToggle={header.column.getToggleSortingHandler()}
                alignRight={!TEXT_COLUMNS.has(header.column.id)}
              >
                <table.FlexRender header={header} />
              </SortableTh>
            ))}
          </tr>
        ))}
      </thead>
      <tbody>
        {table.getRowModel().rows.map((row) => (
          <tr key={row.id} className={`hover:bg-paper-100 ${row.original.id === selectedId ? 'bg-ember-50' : ''}`}>
            {row.getAllCells().map((cell) => (
              <td key={cell.id} className={`${tdClass} whitespace-nowrap ${TEXT_COLUMNS.has(cell.column.id) ? 'font-medium' : 'num text-right'}`}>
                {cell.column.id === 'catalogueId' && row.original.photoZFit ? (
                  <button type="button" onClick={() => onSelect(row.original.id)} aria-pressed={row.original.id === selectedId} className="text-blueend-600 underline hover:text-blueend-700">
                    {row.original.catalogueId}
                  </button>
                ) : (
                  <table.FlexRender cell={cell} />
                )}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
