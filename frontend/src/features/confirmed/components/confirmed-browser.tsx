import type { Grade } from '@contracts/grades';
import { PastLastPage } from '@/components/ui/past-last-page';
import { EmptyState } from '@/components/ui/empty-state';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { Pager } from '@/components/ui/pager';
import { Panel } from '@/components/ui/panel';
import { formatCount } from '@/lib/format';
import { useConfirmed } from '../api/get-confirmed';
import { useFamilies } from '../api/get-families';
import { useConfirmedQuery } from '../hooks/use-confirmed-query';
import { Assumptions } from './assumptions';
import { ConfirmedFiltersBar } from './confirmed-filters';
import { ConfirmedTable } from './confirmed-table';
import { Downloads } from './downloads';
import { StateCounts } from './state-counts';

const PAGE_SIZES = [25, 50, 100, 200] as const;

/** State counts, assumptions, filters, the server-paged table and the downloads, driven by the URL. */
export function ConfirmedBrowser({ campaignId, scheme }: { campaignId: number; scheme: Grade[] }) {
  const { query, update } = useConfirmedQuery();
  const page = useConfirmed(campaignId, query);
  const families = useFamilies(campaignId);
  const filtered = query.grade !== undefined || query.class !== undefined || query.family !== undefined;

  if (page.isPending) return <Loading label="Loading confirmed redshifts…" />;
  if (page.isError) return <ErrorNotice error={page.error} title="The confirmed table could not be loaded" />;
  const { rows, total, states, assumptions } = page.data;

  const body = () => {
    if (total === 0 && !filtered) return <EmptyState title="Nothing confirmed yet">A redshift is released when two readings agree or a lead settles a disagreement.</EmptyState>;
    if (rows.length === 0 && total > 0) {
      return <PastLastPage page={query.page} onFirstPage={() => update({ page: 1 })} />;
    }
    if (rows.length === 0) return <EmptyState title="No confirmed redshift matches these filters." />;
    return <ConfirmedTable rows={rows} total={total} query={query} onQuery={update} />;
  };

  return (
    <div className="flex flex-col gap-5" aria-busy={page.isFetching || undefined}>
      <Panel title="Where the spectra stand">
        <StateCounts states={states} />
      </Panel>
      <Panel title="Assumptions">
        <Assumptions assumptions={assumptions} />
      </Panel>
      <Panel title="Released values" actions={<Downloads campaignId={campaignId} query={query} />}>
        <div className="flex flex-col gap-4">
          <ConfirmedFiltersBar query={query} onChange={update} scheme={scheme} families={families.data?.families.map((f) => f.family) ?? []} />
          <p role="status" className="text-sm text-ink-600">
            <span className="num">{formatCount(total)}</span> confirmed {total === 1 ? 'redshift' : 'redshifts'}
            {filtered ? (total === 1 ? ' matches' : ' match') : ''}. Downloads carry the same filters and every page.
          </p>
          {body()}
          {total > 0 ? (
            <Pager
              page={query.page}
              pageCount={Math.ceil(total / query.pageSize)}
              pageSize={query.pageSize}
              pageSizes={PAGE_SIZES}
              onPage={(p) => update({ page: p })}
              onPageSize={(pageSize) => update({ pageSize })}
            />
          ) : null}
        </div>
      </Panel>
    </div>
  );
}
