import { apiTokenSchema } from '@contracts/auth';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { getTokensQueryOptions } from './get-tokens';

const revokedSchema = z.object({ apiToken: apiTokenSchema });

export const revokeToken = (tokenId: number) => api.delete(`/api/account/tokens/${tokenId}`, revokedSchema);

export function useRevokeToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeToken,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getTokensQueryOptions().queryKey }),
  });
}
