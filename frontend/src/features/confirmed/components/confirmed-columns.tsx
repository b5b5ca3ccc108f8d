import type { ConfirmedPage } from '@contracts/release';
import { createColumnHelper, rowPaginationFeature, tableFeatures } from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import { formatDate, formatDegrees, formatRedshift, formatRedshiftError } from '@/lib/format';
import { CLASS_NAMES } from '@/lib/spectrum-class';

export type ConfirmedRow = ConfirmedPage['rows'][number];

// Paging and filtering are the server's; the table only holds the page state.
export const confirmedFeatures = tableFeatures({ rowPaginationFeature });
const helper = createColumnHelper<typeof confirmedFeatures, ConfirmedRow>();

const none = <span className="text-ink-400">—</span>;
const METHOD_TEXT = { agreement: 'readers agreed', settlement: 'settled by a lead', correction: 'corrected by a lead' } as const;

export const confirmedColumns = helper.columns([
  helper.accessor('targetId', {
    id: 'target',
    header: 'Target',
    // A link, so the row opens from the keyboard as well as by a click anywhere on it.
    cell: (c) => (
      <Link to={`/spectra/${c.row.original.spectrumId}`} className="num font-medium text-blueend-600 hover:underline">
        {c.getValue() ?? c.row.original.fileName}
      </Link>
    ),
  }),
  helper.accessor('ra', { id: 'ra', header: 'RA (°)', cell: (c) => <span className="num">{formatDegrees(c.getValue())}</span> }),
  helper.accessor('dec', { id: 'dec', header: 'Dec (°)', cell: (c) => <span className="num">{formatDegrees(c.getValue())}</span> }),
  helper.accessor('z', {
    id: 'z',
    header: () => <span className="normal-case">z ± σ</span>,
    cell: (c) => (
      <span className="num whitespace-nowrap">
        {formatRedshift(c.getValue())}
        {c.row.original.zErr !== null ? <span className="text-ink-500"> ± {formatRedshiftError(c.row.original.zErr)}</span> : null}
      </span>
    ),
  }),
  helper.accessor('gradeCode', {
    id: 'grade',
    header: 'Grade',
    cell: (c) => (
      <span className="whitespace-nowrap">
        <span className="num font-semibold">{c.getValue()}</span> {c.row.original.gradeLabel}
      </span>
    ),
  }),
  helper.accessor('spectrumClass', { id: 'class', header: 'Class', cell: (c) => CLASS_NAMES[c.getValue()] }),
  helper.accessor('lines', { id: 'lines', header: 'Lines', cell: (c) => (c.getValue().length ? <span className="text-sm">{c.getValue().join(', ')}</span> : none) }),
  helper.accessor('photoZ', {
    id: 'photoZ',
    header: 'Photo-z (68 %)',
    cell: (c) => {
      const r = c.row.original;
      if (r.photoZ === null) return none;
      return (
        <span className="num whitespace-nowrap">
          {r.photoZ.toFixed(3)}
          {r.photoZLow !== null && r.photoZHigh !== null ? (
            <span className="block text-xs text-ink-500">
              {r.photoZLow.toFixed(3)}–{r.photoZHigh.toFixed(3)}
            </span>
          ) : null}
        </span>
      );
    },
  }),
  helper.accessor('imageFamily', { id: 'family', header: 'Family', cell: (c) => c.getValue() ?? none }),
  helper.accessor('readers', { id: 'readers', header: 'Readers', cell: (c) => <span className="text-sm">{c.getValue().join(', ') || '—'}</span> }),
  helper.accessor('confirmedBy', {
    id: 'how',
    header: 'How confirmed',
    cell: (c) => (
      <span className="text-sm">
        {METHOD_TEXT[c.getValue()]}
        {c.row.original.supersedes !== null ? <span className="block text-xs text-ink-500">replaces record #{c.row.original.supersedes}</span> : null}
      </span>
    ),
  }),
  helper.accessor('confirmedAt', { id: 'date', header: 'Date', cell: (c) => <span className="num whitespace-nowrap">{formatDate(c.getValue())}</span> }),
]);

export const NUMERIC_COLUMNS = new Set(['ra', 'dec', 'z', 'photoZ']);
