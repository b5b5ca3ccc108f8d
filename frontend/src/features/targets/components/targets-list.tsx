import { useState } from 'react';
import { EmptyState } from '@/components/ui/empty-state';
import { SelectField, TextField } from '@/components/ui/field';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { formatCount } from '@/lib/format';
import { useDebouncedValue } from '@/lib/use-debounced-value';
import { useTargets } from '../api/get-targets';
import { PHOTO_Z_KINDS, photoZKindMatches, type PhotoZKind } from './photo-z-words';
import { TargetPhotometryPanel } from './target-photometry-panel';
import { TargetsTable } from './targets-table';

/** Search (on the server, by catalogue id), a filter by computed photo-z, the sortable table and one target's photometry. */
export function TargetsList({ campaignId }: { campaignId: number }) {
  const [search, setSearch] = useState('');
  const [kind, setKind] = useState<PhotoZKind>('all');
  const [selected, setSelected] = useState<number | null>(null);
  const q = useDebouncedValue(search.trim());
  const targets = useTargets(campaignId, q);
  const shown = targets.data?.filter((t) => photoZKindMatches(t.photoZFit, kind)) ?? [];

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div className="flex flex-wrap items-end gap-3">
          <TextField label="Search targets" type="search" value={search} onChange={(e) => setSearch(e.target.value)} fieldClassName="w-72 max-w-full" />
          <SelectField label="Photometric redshift" value={kind} onChange={(e) => setKind(e.target.value as PhotoZKind)} fieldClassName="w-96 max-w-full">
            {Object.entries(PHOTO_Z_KINDS).map(([k, label]) => (
              <option key={k} value={k}>
                {label}
              </option>
            ))}
          </SelectField>
        </div>
        {targets.data ? (
          <p role="status" className="text-sm text-ink-600">
            <span className="num">{formatCount(shown.length)}</span> {shown.length === 1 ? 'target' : 'targets'}
            {q || kind !== 'all' ? (shown.length === 1 ? ' matches' : ' match') : ''}
          </p>
        ) : null}
      </div>
      {selected !== null ? <TargetPhotometryPanel campaignId={campaignId} targetId={selected} onClose={() => setSelected(null)} /> : null}
      {targets.isPending ? (
        <Loading label="Loading targets…" />
      ) : targets.isError ? (
        <ErrorNotice error={targets.error} title="Targets could not be loaded" />
      ) : shown.length === 0 ? (
        q || kind !== 'all' ? (
          <EmptyState title={q ? `No target matches “${q}”${kind !== 'all' ? ' in this group' : ''}.` : 'No target in this group.'} />
        ) : (
          <EmptyState title="No targets yet — import a catalogue (CSV or TSV) to link spectra to them." />
        )
      ) : (
        <TargetsTable targets={shown} selectedId={selected} onSelect={setSelected} />
      )}
    </div>
  );
}
