import type { JobProgress } from '@contracts/ingest';
import { useEffect, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { ProgressBar } from '@/components/ui/progress-bar';
import { formatCount, formatDateTime } from '@/lib/format';
import { useCancelJob } from '../api/cancel-job';
import { isJobFinished, useJob } from '../api/get-job';
import { useJobEvents } from '../hooks/use-job-events';
import { JobFiles } from './job-files';
import { JobStateBadge } from './job-state-badge';
import { JobSummary } from './job-summary';

interface Props {
  jobId: number;
  /** Called once when the job reaches an end state, so pages can refresh lists it changed. */
  onFinished?: (job: JobProgress) => void;
}

/** Live progress of one ingest job (parse, link, scan per file), then its summary. */
export function JobProgressPanel({ jobId, onFinished }: Props) {
  const [streamFailed, setStreamFailed] = useState(false);
  const job = useJob(jobId, streamFailed);
  const running = job.data ? !isJobFinished(job.data.state) : false;
  useJobEvents(jobId, running && !streamFailed, () => setStreamFailed(true));
  const cancel = useCancelJob(jobId);

  const finishedFor = useRef<number | null>(null);
  useEffect(() => {
    if (job.data && isJobFinished(job.data.state) && finishedFor.current !== jobId) {
      finishedFor.current = jobId;
      onFinished?.(job.data);
    }
  }, [job.data, jobId, onFinished]);

  if (job.isPending) return <Loading label="Loading the job…" />;
  if (job.isError) return <ErrorNotice error={job.error} title={`Job ${jobId} could not be loaded`} />;

  const j = job.data;
  const finished = isJobFinished(j.state);
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-2 text-sm text-ink-600">
        <span>
          Job <span className="num">{j.id}</span>
        </span>
        <JobStateBadge state={j.state} />
        <span>
          started <span className="num">{formatDateTime(j.createdAt)}</span>
        </span>
        {j.finishedAt ? (
          <span>
            · ended <span className="num">{formatDateTime(j.finishedAt)}</span>
          </span>
        ) : null}
      </div>
      <ProgressBar
        label="Scan progress"
        value={j.done}
        max={j.total}
        tone={j.state === 'failed' ? 'danger' : 'blue'}
        valueText={`${formatCount(j.done)} of ${formatCount(j.total)} files parsed and scanned`}
      />
      {!finished ? (
        <div className="flex items-center gap-3">
          <Button variant="danger" pending={cancel.isPending} pendingLabel="Cancelling…" onClick={() => cancel.mutate()} disabled={cancel.isSuccess}>
            Cancel
          </Button>
          {cancel.isSuccess ? <span role="status" className="text-sm text-ink-600">Stopping after the files in progress…</span> : null}
          {streamFailed ? <span className="text-sm text-ink-500">Live updates unavailable; checking every second.</span> : null}
        </div>
      ) : null}
      <ErrorNotice error={cancel.error} />
      {j.failure ? (
        <Notice tone="danger" role="alert" title="The job stopped with an error">
          {j.failure}
        </Notice>
      ) : null}
      {j.state === 'cancelled' ? (
        <Notice tone="warning" role="status">
          Cancelled. Files already processed are kept; the rest were not read.
        </Notice>
      ) : null}
      {finished ? (
        <>
          <JobSummary job={j} />
          <JobFiles jobId={j.id} campaignId={j.campaignId} />
        </>
      ) : null}
    </div>
  );
}
