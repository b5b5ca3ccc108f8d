import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from './api-client';

/*
 * The rest-frame line list the comb draws. Shared here because the inspection screen and the
 * settlement page both draw combs; it mirrors GET /api/line-list (no contract schema yet).
 */

export const lineKindSchema = z.enum(['emission', 'absorption', 'band', 'break']);
export type LineKind = z.infer<typeof lineKindSchema>;

export const lineListSchema = z.object({
  medium: z.literal('vacuum'),
  unit: z.literal('Angstrom'),
  lines: z.array(z.object({ name: z.string(), species: z.string(), rest: z.number(), kind: lineKindSchema, source: z.string(), widthA: z.number().optional() })),
});
export type CombLine = z.infer<typeof lineListSchema>['lines'][number];

export const lineListKey = () => ['line-list'] as const;

export const getLineList = async (signal?: AbortSignal): Promise<CombLine[]> => (await api.get('/api/line-list', lineListSchema, signal)).lines;

export const getLineListQueryOptions = () =>
  // The list ships with the server; it cannot change while the page is open.
  queryOptions({ queryKey: lineListKey(), queryFn: ({ signal }) => getLineList(signal), staleTime: Infinity });

export const useLineList = () => useQuery(getLineListQueryOptions());
