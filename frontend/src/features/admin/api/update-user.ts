import { adminUserResponseSchema } from '@contracts/admin';
import type { UpdateUserRequest } from '@contracts/admin';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { adminKeys } from './keys';

export const updateUser = (id: number, body: UpdateUserRequest) =>
  api.patch(`/api/admin/users/${id}`, body, adminUserResponseSchema);

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: number; body: UpdateUserRequest }) => updateUser(id, body),
    onSettled: () => queryClient.invalidateQueries({ queryKey: adminKeys.users() }),
  });
}
