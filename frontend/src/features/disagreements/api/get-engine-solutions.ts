import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { disagreementKeys } from './keys';

/*
 * Only the engine's ranked solutions are needed here, so only they are parsed from the spectrum
 * detail (which has no shared contract yet); the rest of the answer is ignored.
 */
const solutionSchema = z.object({
  z: z.number(),
  zErr: z.number(),
  class: z.string(),
  deltaChi2: z.number().nullable(),
  lines: z.array(z.object({ name: z.string() })),
});
export type EngineSolution = z.infer<typeof solutionSchema>;

const detailSchema = z.object({
  scan: z.object({ engineVersion: z.string(), solutions: z.array(solutionSchema) }).nullable(),
});
export type EngineScan = NonNullable<z.infer<typeof detailSchema>['scan']>;

export const getEngineSolutions = async (spectrumId: number, signal?: AbortSignal): Promise<EngineScan | null> =>
  (await api.get(`/api/spectra/${spectrumId}`, detailSchema, signal)).scan;

export const getEngineSolutionsQueryOptions = (spectrumId: number) =>
  queryOptions({ queryKey: disagreementKeys.solutions(spectrumId), queryFn: ({ signal }) => getEngineSolutions(spectrumId, signal) });

export const useEngineSolutions = (spectrumId: number) => useQuery(getEngineSolutionsQueryOptions(spectrumId));
