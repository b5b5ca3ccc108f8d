import type { Reading } from '@contracts/readings';
import { useRef } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { useQueue } from '../api/get-queue';
import type { SpectrumDetail } from '../api/schemas';
import { savedFlash, useSavedFlash } from '../hooks/use-saved-flash';
import type { SavedFlash } from '../hooks/use-saved-flash';
import { InspectHeader } from './inspect-header';
import { InspectScreen } from './inspect-screen';

/**
 * A reader's queue, one spectrum at a time: `?spectrum=` names the one on screen (so reloads and
 * links keep the place), and without it the queue opens at its first unread spectrum.
 */
export function QueueInspector({ campaign }: { campaign: { id: number; name: string } }) {
  const queue = useQueue(campaign.id);
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const flash = useSavedFlash();
  const visited = useRef<number[]>([]);
  const header = (detail: SpectrumDetail | undefined) => <InspectHeader detail={detail} campaign={campaign} flash={flash} />;

  if (queue.isPending) return <Loading label="Loading your queue…" />;
  if (queue.isError) {
    return (
      <div className="mx-auto flex max-w-6xl flex-col gap-3 px-5 py-6">
        {header(undefined)}
        <ErrorNotice error={queue.error} title="Your reading queue is not available" />
      </div>
    );
  }

  const items = queue.data;
  const asked = Number(params.get('spectrum'));
  const currentId = Number.isInteger(asked) && asked > 0 ? asked : items[0]?.id;
  if (currentId === undefined) {
    return (
      <div className="mx-auto flex max-w-6xl flex-col gap-4 px-5 py-6">
        {header(undefined)}
        <EmptyState title="Queue empty — all assigned spectra are read">
          <Link to={`/campaigns/${campaign.id}`} className="text-blueend-600 hover:underline">
            Back to {campaign.name}
          </Link>
        </EmptyState>
      </div>
    );
  }

  if (visited.current.at(-1) !== currentId) visited.current.push(currentId);
  const index = items.findIndex((q) => q.id === currentId);
  const nextId = index >= 0 ? (items[index + 1]?.id ?? null) : (items.find((q) => q.id !== currentId)?.id ?? null);
  const earlier = visited.current.slice(0, -1).reverse().find((id) => id !== currentId);
  const previousId = index > 0 ? items[index - 1]!.id : (earlier ?? null);
  // The next spectrum is prefetched: draw it in this task, not as a transition spread over several frames.
  const open = (id: number | null, state?: SavedFlash) =>
    navigate(id === null ? `/campaigns/${campaign.id}/inspect` : `/campaigns/${campaign.id}/inspect?spectrum=${id}`, { state: state ?? null, flushSync: true });

  const onSaved = (reading: Reading, detail: SpectrumDetail) => open(nextId, savedFlash(reading, detail));

  return (
    <InspectScreen
      spectrumId={currentId}
      nextId={nextId}
      header={header}
      nav={{
        position:
          index >= 0 ? (
            <>
              <span className="num">{index + 1}</span> of <span className="num">{items.length}</span> unread in your queue
            </>
          ) : (
            'Not in your unread queue (already read, or not assigned to you)'
          ),
        onNext: nextId !== null ? () => open(nextId) : null,
        onPrevious: previousId !== null ? () => open(previousId) : null,
        onSaved,
      }}
    />
  );
}
