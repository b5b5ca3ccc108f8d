import { confirmedHistorySchema } from '@contracts/release';
import type { ConfirmedRedshift } from '@contracts/release';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { confirmedKeys } from './keys';

export const getConfirmedHistory = async (spectrumId: number, signal?: AbortSignal): Promise<ConfirmedRedshift[]> =>
  (await api.get(`/api/spectra/${spectrumId}/confirmed`, confirmedHistorySchema, signal)).history;

export const getConfirmedHistoryQueryOptions = (spectrumId: number) =>
  queryOptions({ queryKey: confirmedKeys.history(spectrumId), queryFn: ({ signal }) => getConfirmedHistory(spectrumId, signal) });

export const useConfirmedHistory = (spectrumId: number) => useQuery(getConfirmedHistoryQueryOptions(spectrumId));
