import { targetListSchema } from '@contracts/targets';
import type { Target } from '@contracts/targets';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { targetKeys } from './keys';

export async function getTargets(campaignId: number, q: string, signal?: AbortSignal): Promise<Target[]> {
  const search = q ? `?${new URLSearchParams({ q }).toString()}` : '';
  const { targets } = await api.get(`/api/campaigns/${campaignId}/targets${search}`, targetListSchema, signal);
  return targets;
}

export const getTargetsQueryOptions = (campaignId: number, q = '') =>
  queryOptions({
    queryKey: targetKeys.list(campaignId, q),
    queryFn: ({ signal }) => getTargets(campaignId, q, signal),
    // Keeps the table in place while a new search is on its way instead of flashing empty.
    placeholderData: keepPreviousData,
  });

export const useTargets = (campaignId: number, q = '') => useQuery(getTargetsQueryOptions(campaignId, q));
