import { Stats } from '@/components/ui/stats';
import { formatCount } from '@/lib/format';
import { useSpectraCount } from '../api/get-spectra';

/** The campaign's data at a glance; counts come from the list's own totals. */
export function SpectraCounts({ campaignId }: { campaignId: number }) {
  const all = useSpectraCount(campaignId);
  const unlinked = useSpectraCount(campaignId, 'no');
  const show = (n: number | undefined, failed: boolean) => (failed ? '?' : n === undefined ? '…' : formatCount(n));
  return (
    <Stats
      label="Campaign data"
      stats={[
        { term: 'Spectra', value: show(all.data, all.isError) },
        { term: 'Not linked', value: show(unlinked.data, unlinked.isError), attention: (unlinked.data ?? 0) > 0 },
      ]}
    />
  );
}
