import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { inspectKeys } from './keys';
import { spectrumDetailSchema } from './schemas';
import type { SpectrumDetail } from './schemas';

export const getSpectrumDetail = (spectrumId: number, signal?: AbortSignal): Promise<SpectrumDetail> =>
  api.get(`/api/spectra/${spectrumId}`, spectrumDetailSchema, signal);

export const getSpectrumDetailQueryOptions = (spectrumId: number) =>
  queryOptions({
    queryKey: inspectKeys.detail(spectrumId),
    queryFn: ({ signal }) => getSpectrumDetail(spectrumId, signal),
    // Prefetched with the previous spectrum, often minutes before the reader moves on: kept fresh
    // that long so moving on neither asks again nor re-parses. The reader's own saves patch it; a
    // lead's change (e.g. a reassignment) is checked by the server when a reading is saved.
    staleTime: 5 * 60_000,
  });

export const useSpectrumDetail = (spectrumId: number) => useQuery(getSpectrumDetailQueryOptions(spectrumId));
