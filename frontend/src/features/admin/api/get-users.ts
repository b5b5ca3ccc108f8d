import { adminUsersResponseSchema } from '@contracts/admin';
import type { AdminUser } from '@contracts/admin';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { adminKeys } from './keys';

export async function getUsers(signal?: AbortSignal): Promise<AdminUser[]> {
  const { users } = await api.get('/api/admin/users', adminUsersResponseSchema, signal);
  return users;
}

export const getUsersQueryOptions = () =>
  queryOptions({ queryKey: adminKeys.users(), queryFn: ({ signal }) => getUsers(signal) });

export const useUsers = () => useQuery(getUsersQueryOptions());
