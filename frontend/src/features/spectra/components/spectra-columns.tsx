import type { SpectrumRow } from '@contracts/ingest';
import { Link } from 'react-router-dom';
import { createColumnHelper, rowPaginationFeature, rowSortingFeature, tableFeatures } from '@tanstack/react-table';
import { Badge } from '@/components/ui/badge';
import { FilePath } from '@/components/ui/file-path';
import { formatCount, formatRedshift, formatRedshiftError } from '@/lib/format';
import { CLASS_LABELS, CLASS_TONES, isSpectrumClass } from './spectrum-class';

// Sorting and paging are done by the server; the table only holds their state.
export const spectraFeatures = tableFeatures({ rowSortingFeature, rowPaginationFeature });
const helper = createColumnHelper<typeof spectraFeatures, SpectrumRow>();

const LINK_METHODS: Record<string, string> = {
  'file-name': 'by file name',
  'object-keyword': 'by OBJECT keyword',
  position: 'by position',
  manual: 'by hand',
};

function TargetCell({ row }: { row: SpectrumRow }) {
  if (!row.target) return <span className="italic text-ink-500">not linked</span>;
  return (
    <span className="flex flex-col">
      <span className="num font-medium">{row.target.catalogueId}</span>
      {row.linkMethod ? <span className="text-xs text-ink-500">{LINK_METHODS[row.linkMethod] ?? row.linkMethod}</span> : null}
    </span>
  );
}

function RedshiftCell({ row }: { row: SpectrumRow }) {
  if (row.zBest === null) return <span className="text-ink-400">—</span>;
  return (
    <span className="num whitespace-nowrap">
      {formatRedshift(row.zBest)}
      {row.zBestErr !== null ? <span className="text-ink-500"> ± {formatRedshiftError(row.zBestErr)}</span> : null}
    </span>
  );
}

/** Column ids are the server's sort keys, so a header click maps straight onto `sort=`. */
export const spectraColumns = helper.columns([
  helper.accessor((r) => r.target?.catalogueId, { id: 'target', header: 'Target', cell: (c) => <TargetCell row={c.row.original} /> }),
  helper.accessor('fileName', {
    id: 'fileName',
    header: 'File',
    // The file name opens the spectrum on the inspection screen.
    cell: (c) => (
      <Link to={`/spectra/${c.row.original.id}`} className="text-blueend-600 hover:underline">
        <FilePath path={c.getValue()} />
      </Link>
    ),
  }),
  helper.accessor('instrument', { id: 'instrument', header: 'Instrument', cell: (c) => c.getValue() ?? <span className="text-ink-400">—</span> }),
  helper.display({
    id: 'pixels',
    // Headings are set in capitals; the symbols keep their case so λ and σ do not turn into Λ and Σ.
    header: () => (
      <>
        Pixels · <span className="normal-case">λ</span> range (Å)
      </>
    ),
    cell: (c) => {
      const r = c.row.original;
      return (
        <span className="num whitespace-nowrap">
          {formatCount(r.pixels)} · {r.wavelengthMin.toFixed(0)}–{r.wavelengthMax.toFixed(0)}
        </span>
      );
    },
  }),
  helper.accessor('snrMedian', {
    id: 'snr',
    header: 'S/N',
    sortDescFirst: true,
    cell: (c) => <span className="num">{c.getValue() === null ? '—' : c.getValue()!.toFixed(1)}</span>,
  }),
  helper.accessor('scanState', {
    id: 'scanState',
    header: 'Scan',
    enableSorting: false,
    cell: (c) => <Badge tone={c.getValue() === 'scanned' ? 'success' : 'ink'}>{c.getValue()}</Badge>,
  }),
  helper.accessor('zBest', { id: 'z', header: () => (
      <>
        Top <span className="normal-case">z ± σ</span>
      </>
    ), cell: (c) => <RedshiftCell row={c.row.original} /> }),
  helper.accessor('spectrumClass', {
    id: 'class',
    header: 'Class',
    cell: (c) => {
      const v = c.getValue();
      if (v === null) return <span className="text-ink-400">—</span>;
      return isSpectrumClass(v) ? <Badge tone={CLASS_TONES[v]}>{CLASS_LABELS[v]}</Badge> : <Badge>{v}</Badge>;
    },
  }),
  helper.accessor('readingsDone', {
    id: 'readings',
    header: 'Readings',
    enableSorting: false,
    // Counts only: who read what stays blind here.
    cell: (c) => {
      const { readingsDone, readingsAssigned } = c.row.original;
      if (readingsAssigned === 0) return <span className="text-ink-500">not assigned</span>;
      return (
        <span className="num" title={`${readingsDone} of ${readingsAssigned} assigned readings saved`}>
          {readingsDone} / {readingsAssigned}
        </span>
      );
    },
  }),
]);

export const NUMERIC_COLUMNS = new Set(['snr', 'z']);
