import { adminUserSchema } from '@contracts/admin';
import type { UpdateUserRequest } from '@contracts/admin';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { adminKeys } from './keys';

const updateUserResponseSchema = z.object({ user: adminUserSchema });

export const updateUser = (id: number, body: UpdateUserRequest) =>
  api.patch(`/api/admin/users/${id}`, body, updateUserResponseSchema);

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: number; body: UpdateUserRequest }) => updateUser(id, body),
    onSettled: () => queryClient.invalidateQueries({ queryKey: adminKeys.users() }),
  });
}
