import { revokedTokenResponseSchema } from '@contracts/auth';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getTokensQueryOptions } from './get-tokens';

export const revokeToken = (tokenId: number) => api.delete(`/api/account/tokens/${tokenId}`, revokedTokenResponseSchema);

export function useRevokeToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeToken,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getTokensQueryOptions().queryKey }),
  });
}
