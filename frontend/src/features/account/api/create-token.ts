import { createdTokenSchema } from '@contracts/auth';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getTokensQueryOptions } from './get-tokens';

export const createToken = (name: string) => api.post('/api/account/tokens', { name }, createdTokenSchema);

export function useCreateToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createToken,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getTokensQueryOptions().queryKey }),
  });
}
