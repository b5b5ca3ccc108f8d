import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { chi2Strip } from '../utils/chi2-strip-data';
import type { Chi2StripData } from '../utils/chi2-strip-data';
import { inspectKeys } from './keys';
import { scanCurvesSchema } from './schemas';

/** Curves arrive as JSON per template; the strip wants one columnar table per class, built once here. */
export const getScanCurves = async (spectrumId: number, signal?: AbortSignal): Promise<Chi2StripData> =>
  chi2Strip((await api.get(`/api/spectra/${spectrumId}/scan-curves`, scanCurvesSchema, signal)).curves);

export const getScanCurvesQueryOptions = (spectrumId: number) =>
  queryOptions({ queryKey: inspectKeys.curves(spectrumId), queryFn: ({ signal }) => getScanCurves(spectrumId, signal), staleTime: 5 * 60_000 });

export const useScanCurves = (spectrumId: number) => useQuery(getScanCurvesQueryOptions(spectrumId));
