import { useState } from 'react';
import { EmptyState } from '@/components/ui/empty-state';
import { TextField } from '@/components/ui/field';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { formatCount } from '@/lib/format';
import { useDebouncedValue } from '@/lib/use-debounced-value';
import { useTargets } from '../api/get-targets';
import { TargetsTable } from './targets-table';

/** Search (on the server, by catalogue id) and the sortable table of targets. */
export function TargetsList({ campaignId }: { campaignId: number }) {
  const [search, setSearch] = useState('');
  const q = useDebouncedValue(search.trim());
  const targets = useTargets(campaignId, q);

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <TextField label="Search targets" type="search" value={search} onChange={(e) => setSearch(e.target.value)} fieldClassName="w-full max-w-xs" />
        {targets.data ? (
          <p role="status" className="text-sm text-ink-600">
            <span className="num">{formatCount(targets.data.length)}</span> {targets.data.length === 1 ? 'target' : 'targets'}
            {q ? (targets.data.length === 1 ? ' matches' : ' match') : ''}
          </p>
        ) : null}
      </div>
      {targets.isPending ? (
        <Loading label="Loading targets…" />
      ) : targets.isError ? (
        <ErrorNotice error={targets.error} title="Targets could not be loaded" />
      ) : targets.data.length === 0 ? (
        q ? (
          <EmptyState title={`No target matches “${q}”.`} />
        ) : (
          <EmptyState title="No targets yet — import a catalogue (CSV or TSV) to link spectra to them." />
        )
      ) : (
        <TargetsTable targets={targets.data} />
      )}
    </div>
  );
}
