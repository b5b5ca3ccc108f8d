import { Loading } from '@/components/ui/loading';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { ProgressBar } from '@/components/ui/progress-bar';
import { formatCount } from '@/lib/format';
import { usePhotoZJob } from '../api/get-photo-z-job';

/**
 * Progress of the photo-z job a large catalogue import queued: the targets and fluxes are
 * already stored; their photometric redshifts appear in the table as the job ends.
 */
export function PhotoZJobProgress({ campaignId, jobId }: { campaignId: number; jobId: number }) {
  const job = usePhotoZJob(campaignId, jobId);
  if (job.isPending) return <Loading label="Loading the photo-z job…" />;
  if (job.isError) return <ErrorNotice error={job.error} title={`Photo-z job ${jobId} could not be loaded`} />;
  const j = job.data;
  const failedBatches = j.errors.length;
  return (
    <div className="flex flex-col gap-2">
      <ProgressBar
        label={`Photometric redshifts (job ${j.id})`}
        value={j.done}
        max={j.total}
        tone={j.state === 'failed' || failedBatches > 0 ? 'danger' : 'blue'}
        valueText={`${formatCount(j.done)} of ${formatCount(j.total)} batches of targets fitted`}
      />
      {j.state === 'done' && failedBatches === 0 ? (
        <Notice tone="success" role="status">
          Every photometric redshift is computed; the table shows them.
        </Notice>
      ) : null}
      {j.state === 'queued' || j.state === 'running' ? (
        <p className="text-sm text-ink-500">The targets and their fluxes are stored; you can leave this page, the fit goes on.</p>
      ) : null}
      {failedBatches > 0 ? (
        <Notice tone="danger" role="alert" title="Some targets could not be fitted">
          {j.errors.map((e) => `${e.file}: ${e.message}`).join(' ')}
        </Notice>
      ) : null}
      {j.failure ? (
        <Notice tone="danger" role="alert" title="The photo-z job stopped with an error">
          {j.failure}
        </Notice>
      ) : null}
      {j.state === 'cancelled' ? (
        <Notice tone="warning" role="status">
          Cancelled: targets fitted so far keep their photo-z, the others have none.
        </Notice>
      ) : null}
    </div>
  );
}
