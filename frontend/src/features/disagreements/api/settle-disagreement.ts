import type { SettleRequest } from '@contracts/release';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { getDisagreementsQueryOptions } from './get-disagreements';

const settledSchema = z.object({ confirmedId: z.number().int() });

export const settleDisagreement = (disagreementId: number, body: SettleRequest) => api.post(`/api/disagreements/${disagreementId}/settle`, body, settledSchema);

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
