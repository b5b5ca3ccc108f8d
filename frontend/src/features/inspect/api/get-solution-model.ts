import { queryOptions, useQuery } from '@tanstack/react-query';
import { fetchBinary } from '@/lib/spectrum-data';
import { inspectKeys } from './keys';

/**
 * The best-fit model of solution `rank` (1 = top) of scan `scanId` on the spectrum's pixels:
 * float32, NaN outside the fit. The URL names the scan, so neither the browser's cache nor ours
 * can show one scan's model over another's solutions after a re-scan.
 */
export const getSolutionModel = (spectrumId: number, scanId: number, rank: number, signal?: AbortSignal): Promise<Float32Array> =>
  fetchBinary(`/api/spectra/${spectrumId}/solutions/${rank}/model?scan=${scanId}`, (b) => new Float32Array(b), 'The solution model', signal);

export const getSolutionModelQueryOptions = (spectrumId: number, scanId: number, rank: number) =>
  queryOptions({
    queryKey: inspectKeys.model(spectrumId, scanId, rank),
    queryFn: ({ signal }) => getSolutionModel(spectrumId, scanId, rank, signal),
    // A scan result never changes in place (a re-scan is a new record with a new id), so neither does its model.
    staleTime: Infinity,
  });

/** The model of a solution of the spectrum's current scan; idle while either is unknown. */
export const useSolutionModel = (spectrumId: number, scanId: number | null, rank: number | null) =>
  useQuery({ ...getSolutionModelQueryOptions(spectrumId, scanId ?? 0, rank ?? 1), enabled: scanId !== null && rank !== null });
