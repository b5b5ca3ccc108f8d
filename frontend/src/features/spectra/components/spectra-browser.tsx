import type { ReactNode } from 'react';
import { PastLastPage } from '@/components/ui/past-last-page';
import { EmptyState } from '@/components/ui/empty-state';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { Pager } from '@/components/ui/pager';
import { formatCount } from '@/lib/format';
import { useSpectra } from '../api/get-spectra';
import { useLinkSpectrum } from '../api/link-spectrum';
import { useSpectraQuery } from '../hooks/use-spectra-query';
import type { LinkOption } from './link-target-cell';
import { SpectraFilters } from './spectra-filters';
import { SpectraTable } from './spectra-table';

const PAGE_SIZES = [25, 50, 100, 200] as const;

interface Props {
  campaignId: number;
  /** Given to leads only: the targets an unlinked spectrum can be linked to. */
  linkOptions?: LinkOption[] | undefined;
  onLinked?: () => void;
  /** Shown when the campaign has no spectra at all (for a lead, where to upload). */
  emptyHint?: ReactNode;
}

/** Filters, the server-paged table and the pager, all driven by the URL. */
export function SpectraBrowser({ campaignId, linkOptions, onLinked, emptyHint }: Props) {
  const { query, update } = useSpectraQuery();
  const spectra = useSpectra(campaignId, query);
  const link = useLinkSpectrum(campaignId, onLinked);
  const filtered = Boolean(query.q || query.class || query.linked);

  const body = () => {
    if (spectra.isPending) return <Loading label="Loading spectra…" />;
    if (spectra.isError) return <ErrorNotice error={spectra.error} title="Spectra could not be loaded" />;
    const { rows, total } = spectra.data;
    if (total === 0 && !filtered) return <EmptyState title="No spectra yet — upload a zip of FITS or text files">{emptyHint}</EmptyState>;
    if (rows.length === 0 && total > 0) {
      return <PastLastPage page={query.page} onFirstPage={() => update({ page: 1 })} />;
    }
    if (rows.length === 0) return <EmptyState title="No spectrum matches these filters." />;
    return (
      <SpectraTable
        rows={rows}
        total={total}
        query={query}
        onQuery={update}
        linkOptions={linkOptions}
        onLink={(spectrumId, targetId) => link.mutateAsync({ spectrumId, targetId })}
      />
    );
  };

  const total = spectra.data?.total ?? 0;
  return (
    <div className="flex flex-col gap-4" aria-busy={spectra.isFetching || undefined}>
      <SpectraFilters query={query} onChange={update} />
      {spectra.data ? (
        <p role="status" className="text-sm text-ink-600">
          <span className="num">{formatCount(total)}</span> {total === 1 ? 'spectrum' : 'spectra'}
          {filtered ? (total === 1 ? ' matches' : ' match') : ''}
        </p>
      ) : null}
      {body()}
      {total > 0 ? (
        <Pager
          page={query.page}
          pageCount={Math.ceil(total / query.pageSize)}
          pageSize={query.pageSize}
          pageSizes={PAGE_SIZES}
          onPage={(page) => update({ page })}
          onPageSize={(pageSize) => update({ pageSize })}
        />
      ) : null}
    </div>
  );
}
