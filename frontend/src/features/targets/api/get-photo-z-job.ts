import { jobProgressSchema } from '@contracts/ingest';
import type { JobProgress } from '@contracts/ingest';
import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { api } from '@/lib/api-client';
import { targetKeys } from './keys';

export const isPhotoZJobFinished = (job: JobProgress) => job.state === 'done' || job.state === 'failed' || job.state === 'cancelled';

/** The photo-z job of a large catalogue import, asked for once a second until it ends. */
export const getPhotoZJobQueryOptions = (jobId: number) =>
  queryOptions({
    queryKey: [...targetKeys.all(), 'photo-z-job', jobId] as const,
    queryFn: ({ signal }) => api.get(`/api/jobs/${jobId}`, jobProgressSchema, signal),
    refetchInterval: (query) => (query.state.data && isPhotoZJobFinished(query.state.data) ? false : 1000),
  });

/** Follows the job; when it ends, the campaign's target lists are refetched (they now carry the fits). */
export function usePhotoZJob(campaignId: number, jobId: number) {
  const queryClient = useQueryClient();
  const job = useQuery(getPhotoZJobQueryOptions(jobId));
  const finished = job.data ? isPhotoZJobFinished(job.data) : false;
  useEffect(() => {
    if (finished) void queryClient.invalidateQueries({ queryKey: targetKeys.lists(campaignId) });
  }, [finished, campaignId, queryClient]);
  return job;
}
