import { jobProgressSchema } from '@contracts/ingest';
import type { JobProgress, JobState } from '@contracts/ingest';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { jobKeys } from './keys';

export const isJobFinished = (state: JobState) => state === 'done' || state === 'failed' || state === 'cancelled';

export const getJob = (jobId: number, signal?: AbortSignal): Promise<JobProgress> => api.get(`/api/jobs/${jobId}`, jobProgressSchema, signal);

/** `poll` is the fallback when the event stream cannot be opened: ask once a second until the job ends. */
export const getJobQueryOptions = (jobId: number, poll = false) =>
  queryOptions({
    queryKey: jobKeys.detail(jobId),
    queryFn: ({ signal }) => getJob(jobId, signal),
    refetchInterval: (query) => (poll && !(query.state.data && isJobFinished(query.state.data.state)) ? 1000 : false),
  });

export const useJob = (jobId: number, poll = false) => useQuery(getJobQueryOptions(jobId, poll));
