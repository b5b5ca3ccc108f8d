import { queryOptions, useQuery } from '@tanstack/react-query';
import { fetchBinary } from '@/lib/spectrum-data';
import { inspectKeys } from './keys';

/** The best-fit model of solution `rank` (1 = top) on the spectrum's pixels: float32, NaN outside the fit. */
export const getSolutionModel = (spectrumId: number, rank: number, signal?: AbortSignal): Promise<Float32Array> =>
  fetchBinary(`/api/spectra/${spectrumId}/solutions/${rank}/model`, (b) => new Float32Array(b), 'The solution model', signal);

export const getSolutionModelQueryOptions = (spectrumId: number, rank: number) =>
  queryOptions({
    queryKey: inspectKeys.model(spectrumId, rank),
    queryFn: ({ signal }) => getSolutionModel(spectrumId, rank, signal),
    // A scan result never changes in place (a re-scan is a new record), so neither does its model.
    staleTime: Infinity,
  });

export const useSolutionModel = (spectrumId: number, rank: number | null) =>
  useQuery({ ...getSolutionModelQueryOptions(spectrumId, rank ?? 1), enabled: rank !== null });
