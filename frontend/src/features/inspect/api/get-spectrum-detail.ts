import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { inspectKeys } from './keys';
import { spectrumDetailSchema } from './schemas';
import type { SpectrumDetail } from './schemas';

export const getSpectrumDetail = (spectrumId: number, signal?: AbortSignal): Promise<SpectrumDetail> =>
  api.get(`/api/spectra/${spectrumId}`, spectrumDetailSchema, signal);

export const getSpectrumDetailQueryOptions = (spectrumId: number) =>
  queryOptions({ queryKey: inspectKeys.detail(spectrumId), queryFn: ({ signal }) => getSpectrumDetail(spectrumId, signal) });

export const useSpectrumDetail = (spectrumId: number) => useQuery(getSpectrumDetailQueryOptions(spectrumId));
