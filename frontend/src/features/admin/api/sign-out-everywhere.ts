import { signOutEverywhereResponseSchema } from '@contracts/admin';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { adminKeys } from './keys';

/** Ends every signed-in browser of an account; its access tokens keep working. */
export const signOutEverywhere = (id: number) =>
  api.post(`/api/admin/users/${id}/sign-out-everywhere`, {}, signOutEverywhereResponseSchema);

export function useSignOutEverywhere() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => signOutEverywhere(id),
    onSettled: () => queryClient.invalidateQueries({ queryKey: adminKeys.users() }),
  });
}
