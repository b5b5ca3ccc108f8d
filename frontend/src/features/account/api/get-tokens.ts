import { apiTokenListSchema } from '@contracts/auth';
import type { ApiToken } from '@contracts/auth';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { accountKeys } from './keys';

export async function getTokens(signal?: AbortSignal): Promise<ApiToken[]> {
  const { tokens } = await api.get('/api/account/tokens', apiTokenListSchema, signal);
  return tokens;
}

export const getTokensQueryOptions = () => queryOptions({ queryKey: accountKeys.tokens(), queryFn: ({ signal }) => getTokens(signal) });

export const useTokens = () => useQuery(getTokensQueryOptions());
