import { queryOptions, useQuery } from '@tanstack/react-query';
import { decodeScanCurves } from '@contracts/scan-curves-binary';
import { fetchBinary } from '@/lib/spectrum-data';
import { chi2Strip } from '../utils/chi2-strip-data';
import type { Chi2StripData } from '../utils/chi2-strip-data';
import { inspectKeys } from './keys';

/** Curves arrive packed per template (float32); the strip wants one columnar table per class, built once here. */
export const getScanCurves = async (spectrumId: number, signal?: AbortSignal): Promise<Chi2StripData> =>
  chi2Strip((await fetchBinary(`/api/spectra/${spectrumId}/scan-curves`, decodeScanCurves, 'The χ²(z) curves', signal)).curves);

export const getScanCurvesQueryOptions = (spectrumId: number) =>
  queryOptions({ queryKey: inspectKeys.curves(spectrumId), queryFn: ({ signal }) => getScanCurves(spectrumId, signal), staleTime: 5 * 60_000 });

export const useScanCurves = (spectrumId: number) => useQuery(getScanCurvesQueryOptions(spectrumId));
