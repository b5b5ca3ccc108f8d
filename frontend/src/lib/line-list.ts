import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { inspectKeys } from './keys';
import { lineListSchema } from './schemas';
import type { CombLine } from './schemas';

export const getLineList = async (signal?: AbortSignal): Promise<CombLine[]> => (await api.get('/api/line-list', lineListSchema, signal)).lines;

export const getLineListQueryOptions = () =>
  // The list ships with the server; it cannot change while the page is open.
  queryOptions({ queryKey: inspectKeys.lineList(), queryFn: ({ signal }) => getLineList(signal), staleTime: Infinity });

export const useLineList = () => useQuery(getLineListQueryOptions());
