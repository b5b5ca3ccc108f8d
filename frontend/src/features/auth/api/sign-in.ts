import { meResponseSchema } from '@contracts/auth';
import type { LoginRequest, User } from '@contracts/auth';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { authKeys } from './keys';

export async function signIn(body: LoginRequest): Promise<User> {
  const { user } = await api.post('/api/auth/login', body, meResponseSchema);
  return user;
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (user) => {
      // Whatever was cached belonged to the previous person (if any); start clean for this one.
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== authKeys.me()[0] });
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}
