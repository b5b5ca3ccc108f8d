import { spectrumDetailSchema } from '@contracts/spectra';
import type { Scan, Solution } from '@contracts/spectra';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { disagreementKeys } from './keys';

// Only the engine's ranked solutions are needed here; the spectrum detail's own contract parses them.
const detailScanSchema = spectrumDetailSchema.pick({ scan: true });
export type EngineSolution = Solution;
export type EngineScan = Scan;

export const getEngineSolutions = async (spectrumId: number, signal?: AbortSignal): Promise<EngineScan | null> =>
  (await api.get(`/api/spectra/${spectrumId}`, detailScanSchema, signal)).scan;

export const getEngineSolutionsQueryOptions = (spectrumId: number) =>
  queryOptions({ queryKey: disagreementKeys.solutions(spectrumId), queryFn: ({ signal }) => getEngineSolutions(spectrumId, signal) });

export const useEngineSolutions = (spectrumId: number) => useQuery(getEngineSolutionsQueryOptions(spectrumId));
