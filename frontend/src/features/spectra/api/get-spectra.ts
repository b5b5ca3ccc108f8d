import { spectraPageSchema } from '@contracts/ingest';
import type { SpectraPage, SpectraQuery } from '@contracts/ingest';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { spectraKeys } from './keys';

const toSearch = (query: SpectraQuery) => {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== '') params.set(key, String(value));
  }
  const s = params.toString();
  return s ? `?${s}` : '';
};

export const getSpectra = (campaignId: number, query: SpectraQuery, signal?: AbortSignal): Promise<SpectraPage> =>
  api.get(`/api/campaigns/${campaignId}/spectra${toSearch(query)}`, spectraPageSchema, signal);

export const getSpectraQueryOptions = (campaignId: number, query: SpectraQuery) =>
  queryOptions({
    queryKey: spectraKeys.list(campaignId, query),
    queryFn: ({ signal }) => getSpectra(campaignId, query, signal),
    // The current page stays on screen while the next one loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });

export const useSpectra = (campaignId: number, query: SpectraQuery) => useQuery(getSpectraQueryOptions(campaignId, query));

/** Only the total matters for counts; one row keeps the answer small. */
export const useSpectraCount = (campaignId: number, linked?: 'yes' | 'no') =>
  useQuery({ ...getSpectraQueryOptions(campaignId, { page: 1, pageSize: 1, ...(linked ? { linked } : {}) }), select: (p) => p.total });
