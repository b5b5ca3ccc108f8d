import { confirmedRedshiftSchema } from '@contracts/release';
import type { ConfirmedRedshift } from '@contracts/release';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { confirmedKeys } from './keys';

const historySchema = z.object({ history: z.array(confirmedRedshiftSchema) });

export const getConfirmedHistory = async (spectrumId: number, signal?: AbortSignal): Promise<ConfirmedRedshift[]> =>
  (await api.get(`/api/spectra/${spectrumId}/confirmed`, historySchema, signal)).history;

export const getConfirmedHistoryQueryOptions = (spectrumId: number) =>
  queryOptions({ queryKey: confirmedKeys.history(spectrumId), queryFn: ({ signal }) => getConfirmedHistory(spectrumId, signal) });

export const useConfirmedHistory = (spectrumId: number) => useQuery(getConfirmedHistoryQueryOptions(spectrumId));
