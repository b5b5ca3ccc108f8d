import type { Grade } from '@contracts/grades';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { useConfirmedHistory } from '../api/get-confirmed-history';
import { ConfirmedHistory } from './confirmed-history';
import { CorrectionForm } from './correction-form';

/** The spectrum's released value and its full history; leads may supersede it with a correction. */
export function ReleasedValue({ spectrumId, isLead, scheme }: { spectrumId: number; isLead: boolean; scheme: Grade[] }) {
  const history = useConfirmedHistory(spectrumId);
  if (history.isPending) return <Loading label="Loading the confirmed value…" />;
  if (history.isError) return <ErrorNotice error={history.error} />;
  const current = history.data.find((r) => r.isCurrent);
  return (
    <div className="flex flex-col gap-3">
      {history.data.length === 0 ? (
        <p className="text-sm text-ink-500">Not confirmed yet: it needs two agreeing readings or a lead's settlement.</p>
      ) : (
        <ConfirmedHistory history={history.data} scheme={scheme} />
      )}
      {isLead && current ? <CorrectionForm spectrumId={spectrumId} current={current} scheme={scheme} /> : null}
    </div>
  );
}
