import { meResponseSchema } from '@contracts/auth';
import type { UpdateAccountRequest, User } from '@contracts/auth';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { accountKeys } from './keys';

export async function updateName(body: UpdateAccountRequest): Promise<User> {
  const { user } = await api.patch('/api/account', body, meResponseSchema);
  return user;
}

export function useUpdateName() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateName,
    onSuccess: (user) => queryClient.setQueryData(accountKeys.me(), user),
  });
}
