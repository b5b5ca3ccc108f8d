import { jobProgressSchema } from '@contracts/ingest';
import type { JobProgress } from '@contracts/ingest';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { jobKeys } from './keys';

export const cancelJob = (jobId: number): Promise<JobProgress> => api.post(`/api/jobs/${jobId}/cancel`, {}, jobProgressSchema);

export function useCancelJob(jobId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => cancelJob(jobId),
    onSuccess: (progress) => queryClient.setQueryData(jobKeys.detail(jobId), progress),
  });
}
