import { readingQueueSchema } from '@contracts/readings';
import type { QueueItem } from '@contracts/readings';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { inspectKeys } from './keys';

export const getQueue = (campaignId: number, signal?: AbortSignal): Promise<QueueItem[]> =>
  api.get(`/api/me/queue?campaign=${campaignId}`, readingQueueSchema, signal);

export const getQueueQueryOptions = (campaignId: number) =>
  queryOptions({ queryKey: inspectKeys.queue(campaignId), queryFn: ({ signal }) => getQueue(campaignId, signal) });

/** Disabled for observers, who have no queue (the server answers 403). */
export const useQueue = (campaignId: number | null) =>
  useQuery({ ...getQueueQueryOptions(campaignId ?? 0), enabled: campaignId !== null });
