import { confirmedPageSchema } from '@contracts/release';
import type { ConfirmedPage } from '@contracts/release';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { confirmedSearch } from '../hooks/use-confirmed-query';
import type { ConfirmedFilters } from '../hooks/use-confirmed-query';
import { confirmedKeys } from './keys';

export const getConfirmed = (campaignId: number, query: ConfirmedFilters, signal?: AbortSignal): Promise<ConfirmedPage> =>
  api.get(`/api/campaigns/${campaignId}/confirmed?${confirmedSearch(query, 'json')}`, confirmedPageSchema, signal);

export const getConfirmedQueryOptions = (campaignId: number, query: ConfirmedFilters) =>
  queryOptions({
    queryKey: confirmedKeys.list(campaignId, query),
    queryFn: ({ signal }) => getConfirmed(campaignId, query, signal),
    // The current page stays while the next loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });

export const useConfirmed = (campaignId: number, query: ConfirmedFilters) => useQuery(getConfirmedQueryOptions(campaignId, query));

/** The counts by state ride on every page; one row keeps the answer small when only they are wanted. */
export const useSpectrumStates = (campaignId: number) =>
  useQuery({ ...getConfirmedQueryOptions(campaignId, { page: 1, pageSize: 1 }), select: (p) => p.states });
