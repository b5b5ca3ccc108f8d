import { SPECTRUM_STATES } from '@contracts/release';
import type { ConfirmedPage } from '@contracts/release';
import { Stats } from '@/components/ui/stats';
import { formatCount } from '@/lib/format';

/** Where every spectrum of the campaign stands on the way to release. */
export function StateCounts({ states }: { states: ConfirmedPage['states'] }) {
  return (
    <Stats
      label="Spectra by state"
      stats={SPECTRUM_STATES.map((s) => ({ term: s, value: formatCount(states[s] ?? 0), attention: s === 'disagreement' && (states[s] ?? 0) > 0 }))}
    />
  );
}
