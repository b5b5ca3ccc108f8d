import { combLinesResponseSchema, type CombLines } from '@contracts/line-measurements';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { inspectKeys } from './keys';
import type { Solution } from './schemas';

/**
 * The z the lines are measured at: a solution's exact z when the comb sits on it, else the comb
 * read to 5 decimals — the z a save would send (use-save-reading.ts), so what the form shows is
 * what the server stores.
 */
export const measuredZ = (trial: number, solutions: readonly Solution[]) => solutions.find((s) => s.z === trial)?.z ?? Math.round(trial * 1e5) / 1e5;

export const getCombLines = (spectrumId: number, z: number, cls: string, signal?: AbortSignal): Promise<CombLines> =>
  api.get(`/api/spectra/${spectrumId}/lines?z=${encodeURIComponent(String(z))}&class=${encodeURIComponent(cls)}`, combLinesResponseSchema, signal);

// The answer depends only on the stored file (never changed), z and class, all in the key: it never goes stale.
export const getCombLinesQueryOptions = (spectrumId: number, z: number, cls: string) =>
  queryOptions({ queryKey: inspectKeys.lines(spectrumId, z, cls), queryFn: ({ signal }) => getCombLines(spectrumId, z, cls, signal), staleTime: Infinity });

/** The comb's lines measured at z; while a new z is measured, the last answer stays on screen. */
export const useCombLines = (spectrumId: number, z: number, cls: string) => useQuery({ ...getCombLinesQueryOptions(spectrumId, z, cls), placeholderData: keepPreviousData });
