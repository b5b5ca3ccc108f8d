import { queryOptions, useQuery } from '@tanstack/react-query';
import { lineListResponseSchema, type LineListResponse } from '@contracts/line-list';
import { api } from './api-client';

/*
 * The rest-frame line list the comb draws (GET /api/line-list, parsed with the server's own
 * contract). Shared here because the inspection screen and the settlement page both draw combs.
 */

export type { LineKind } from '@contracts/line-list';
export type CombLine = LineListResponse['lines'][number];

export const lineListKey = () => ['line-list'] as const;

export const getLineList = async (signal?: AbortSignal): Promise<CombLine[]> => (await api.get('/api/line-list', lineListResponseSchema, signal)).lines;

export const getLineListQueryOptions = () =>
  // The list ships with the server; it cannot change while the page is open.
  queryOptions({ queryKey: lineListKey(), queryFn: ({ signal }) => getLineList(signal), staleTime: Infinity });

export const useLineList = () => useQuery(getLineListQueryOptions());
