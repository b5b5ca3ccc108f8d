import { functionalUpdate, useTable } from '@tanstack/react-table';
import type { PaginationState } from '@tanstack/react-table';
import { useNavigate } from 'react-router-dom';
import { Table, tdClass, thClass } from '@/components/ui/table';
import type { ConfirmedFilters } from '../hooks/use-confirmed-query';
import { confirmedColumns, confirmedFeatures, NUMERIC_COLUMNS } from './confirmed-columns';
import type { ConfirmedRow } from './confirmed-columns';

interface Props {
  rows: ConfirmedRow[];
  total: number;
  query: ConfirmedFilters;
  onQuery: (patch: Partial<ConfirmedFilters>) => void;
}

/** One server page of released values; a click on a row opens its spectrum. */
export function ConfirmedTable({ rows, total, query, onQuery }: Props) {
  const navigate = useNavigate();
  const pagination: PaginationState = { pageIndex: query.page - 1, pageSize: query.pageSize };
  const table = useTable({
    features: confirmedFeatures,
    columns: confirmedColumns,
    data: rows,
    getRowId: (r) => String(r.id),
    state: { pagination },
    onPaginationChange: (updater) => {
      const next = functionalUpdate(updater, pagination);
      onQuery({ page: next.pageIndex + 1, pageSize: next.pageSize });
    },
    manualPagination: true,
    rowCount: total,
  });

  return (
    <Table caption="Confirmed redshifts" captionHidden>
      <thead>
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers.map((header) => (
              <th key={header.id} scope="col" className={`${thClass} whitespace-nowrap ${NUMERIC_COLUMNS.has(header.column.id) ? 'text-right' : ''}`}>
                <table.FlexRender header={header} />
              </th>
            ))}
          </tr>
        ))}
      </thead>
      <tbody>
        {table.getRowModel().rows.map((row) => (
          <tr
            key={row.id}
            className="cursor-pointer hover:bg-paper-100"
            onClick={(e) => {
              // The target link handles its own click (and keyboard); anywhere else on the row opens the spectrum too.
              if ((e.target as HTMLElement).closest('a')) return;
              void navigate(`/spectra/${row.original.spectrumId}`);
            }}
          >
            {row.getAllCells().map((cell) => (
              <td key={cell.id} className={`${tdClass} ${NUMERIC_COLUMNS.has(cell.column.id) ? 'text-right' : ''}`}>
                <table.FlexRender cell={cell} />
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
