import { jobFilesSchema } from '@contracts/ingest';
import type { JobFiles } from '@contracts/ingest';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { jobKeys } from './keys';

export const getJobFiles = (jobId: number, signal?: AbortSignal): Promise<JobFiles> => api.get(`/api/jobs/${jobId}/files`, jobFilesSchema, signal);

/** What became of each file of a job; asked for once the job has ended (and again when readers are assigned). */
export const getJobFilesQueryOptions = (jobId: number) => queryOptions({ queryKey: jobKeys.files(jobId), queryFn: ({ signal }) => getJobFiles(jobId, signal) });

export const useJobFiles = (jobId: number, enabled: boolean) => useQuery({ ...getJobFilesQueryOptions(jobId), enabled });
