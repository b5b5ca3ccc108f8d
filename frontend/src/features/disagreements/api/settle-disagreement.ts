import { confirmedIdResponseSchema } from '@contracts/release';
import type { SettleRequest } from '@contracts/release';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getDisagreementsQueryOptions } from './get-disagreements';

export const settleDisagreement = (disagreementId: number, body: SettleRequest) => api.post(`/api/disagreements/${disagreementId}/settle`, body, confirmedIdResponseSchema);

/** `onSettled` lets the page refresh what other features show (the confirmed table, counts). */
export function useSettleDisagreement(campaignId: number, onSettled?: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: number; body: SettleRequest }) => settleDisagreement(id, body),
    onSuccess: () => {
      onSettled?.();
      return queryClient.invalidateQueries({ queryKey: getDisagreementsQueryOptions(campaignId).queryKey });
    },
  });
}
