import type { Reading } from '@contracts/readings';
import type { ReactNode } from 'react';
import { useNavigate } from 'react-router-dom';
import { useQueue } from '../api/get-queue';
import { useSpectrumDetail } from '../api/get-spectrum-detail';
import type { SpectrumDetail } from '../api/schemas';
import { savedFlash, useSavedFlash } from '../hooks/use-saved-flash';
import { InspectHeader } from './inspect-header';
import { InspectScreen } from './inspect-screen';

/**
 * One spectrum by id (from the spectra list or an image family). When it is in the reader's
 * unread queue, next/previous and "save and next" follow the queue.
 */
export function SpectrumInspector({ spectrumId, aside }: { spectrumId: number; aside?: (detail: SpectrumDetail) => ReactNode }) {
  const detail = useSpectrumDetail(spectrumId);
  const navigate = useNavigate();
  const flash = useSavedFlash();
  const campaign = detail.data?.campaign ?? null;
  const hasQueue = campaign !== null && (campaign.myRole === 'reader' || campaign.myRole === 'lead');
  const queue = useQueue(hasQueue ? campaign.id : null);
  const items = queue.data ?? [];
  const index = items.findIndex((q) => q.id === spectrumId);
  const nextId = index >= 0 ? (items[index + 1]?.id ?? null) : null;
  const previousId = index > 0 ? items[index - 1]!.id : null;

  const onSaved = (reading: Reading, d: SpectrumDetail) => {
    // Saved from a queue item: carry on with the queue; otherwise stay and show the saved reading.
    if (nextId !== null) navigate(`/campaigns/${d.campaign.id}/inspect?spectrum=${nextId}`, { state: savedFlash(reading, d), flushSync: true });
    else navigate(`/spectra/${spectrumId}`, { state: savedFlash(reading, d), replace: true });
  };

  return (
    <InspectScreen
      spectrumId={spectrumId}
      nextId={nextId}
      aside={aside}
      header={(d) => <InspectHeader detail={d} campaign={campaign} flash={flash} />}
      nav={{
        position: index >= 0 ? `${index + 1} of ${items.length} unread in your queue` : hasQueue ? 'Not in your unread queue' : 'Read-only view',
        // Prefetched: drawn in this task rather than as a transition over several frames.
        onNext: nextId !== null ? () => navigate(`/spectra/${nextId}`, { flushSync: true }) : null,
        onPrevious: previousId !== null ? () => navigate(`/spectra/${previousId}`, { flushSync: true }) : null,
        onSaved,
      }}
    />
  );
}
