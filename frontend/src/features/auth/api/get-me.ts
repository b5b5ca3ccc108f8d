import { meResponseSchema } from '@contracts/auth';
import type { User } from '@contracts/auth';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, isApiError } from '@/lib/api-client';
import { authKeys } from './keys';

/** Being signed out is a normal state, not an error: a 401 here means "nobody", so it resolves to null. */
export async function getMe(signal?: AbortSignal): Promise<User | null> {
  try {
    const { user } = await api.get('/api/auth/me', meResponseSchema, signal);
    return user;
  } catch (e) {
    if (isApiError(e) && e.status === 401) return null;
    throw e;
  }
}

export const getMeQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 5 * 60_000,
    retry: false,
  });

export const useMe = () => useQuery(getMeQueryOptions());
