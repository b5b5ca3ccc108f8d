import { SPECTRA_SORT_KEYS } from '@contracts/ingest';
import type { SpectrumRow } from '@contracts/ingest';
import { functionalUpdate, useTable } from '@tanstack/react-table';
import type { PaginationState, SortingState } from '@tanstack/react-table';
import { SortableTh } from '@/components/ui/sort-header';
import { Table, tdClass, thClass } from '@/components/ui/table';
import type { SpectraQueryState } from '../hooks/use-spectra-query';
import { LinkTargetCell } from './link-target-cell';
import type { LinkOption } from './link-target-cell';
import { NUMERIC_COLUMNS, spectraColumns, spectraFeatures } from './spectra-columns';

type SortKey = (typeof SPECTRA_SORT_KEYS)[number];
const isSortKey = (id: string): id is SortKey => (SPECTRA_SORT_KEYS as readonly string[]).includes(id);

interface Props {
  rows: SpectrumRow[];
  total: number;
  query: SpectraQueryState;
  onQuery: (patch: Partial<SpectraQueryState>) => void;
  /** Targets a lead may link an unlinked spectrum to; absent for other roles. */
  linkOptions: LinkOption[] | undefined;
  onLink: (spectrumId: number, targetId: number) => Promise<unknown>;
}

/** One server page of spectra; sort clicks and page moves are written to the URL, which refetches. */
export function SpectraTable({ rows, total, query, onQuery, linkOptions, onLink }: Props) {
  const sorting: SortingState = [{ id: query.sort, desc: query.dir === 'desc' }];
  const pagination: PaginationState = { pageIndex: query.page - 1, pageSize: query.pageSize };

  const table = useTable({
    features: spectraFeatures,
    columns: spectraColumns,
    data: rows,
    getRowId: (r) => String(r.id),
    state: { sorting, pagination },
    onSortingChange: (updater) => {
      const next = functionalUpdate(updater, sorting)[0];
      if (next && isSortKey(next.id)) onQuery({ sort: next.id, dir: next.desc ? 'desc' : 'asc' });
    },
    onPaginationChange: (updater) => {
      const next = functionalUpdate(updater, pagination);
      onQuery({ page: next.pageIndex + 1, pageSize: next.pageSize });
    },
    manualSorting: true,
    manualPagination: true,
    rowCount: total,
    enableMultiSort: false,
    // The server always sorts by something; a third click flips the order instead of clearing it.
    enableSortingRemoval: false,
  });

  return (
    <Table caption="Spectra" captionHidden>
      <thead>
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers.map((header) => (
              <SortableTh
                key={header.id}
                state={header.column.getIsSorted()}
                onToggle={header.column.getCanSort() ? header.column.getToggleSortingHandler() : undefined}
                alignRight={NUMERIC_COLUMNS.has(header.column.id)}
              >
                <table.FlexRender header={header} />
              </SortableTh>
            ))}
            {linkOptions ? (
              <th scope="col" className={thClass}>
                <span className="sr-only">Link</span>
              </th>
            ) : null}
          </tr>
        ))}
      </thead>
      <tbody>
        {table.getRowModel().rows.map((row) => (
          <tr key={row.id} className="hover:bg-paper-100">
            {row.getAllCells().map((cell) => (
              <td key={cell.id} className={`${tdClass} ${NUMERIC_COLUMNS.has(cell.column.id) ? 'text-right' : ''}`}>
                <table.FlexRender cell={cell} />
              </td>
            ))}
            {linkOptions ? (
              <td className={`${tdClass} whitespace-nowrap`}>
                {row.original.target ? null : <LinkTargetCell spectrum={row.original} options={linkOptions} onLink={onLink} />}
              </td>
            ) : null}
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
