import { filterListSchema } from '@contracts/targets';
import type { FilterInfo } from '@contracts/targets';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { targetKeys } from './keys';

export async function getFilters(campaignId: number, signal?: AbortSignal): Promise<FilterInfo[]> {
  const { filters } = await api.get(`/api/campaigns/${campaignId}/filters`, filterListSchema, signal);
  return filters;
}

export const getFiltersQueryOptions = (campaignId: number) =>
  queryOptions({ queryKey: targetKeys.filters(campaignId), queryFn: ({ signal }) => getFilters(campaignId, signal), staleTime: 60_000 });

export const useFilters = (campaignId: number) => useQuery(getFiltersQueryOptions(campaignId));
