import { delegateResponseSchema } from '@contracts/release';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getDisagreementsQueryOptions } from './get-disagreements';

export const delegateDisagreement = (disagreementId: number, readerId: number) => api.post(`/api/disagreements/${disagreementId}/delegate`, { readerId }, delegateResponseSchema);

/** The disagreement stays open (and listed) with the third reader named on it. */
export function useDelegateDisagreement(campaignId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, readerId }: { id: number; readerId: number }) => delegateDisagreement(id, readerId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getDisagreementsQueryOptions(campaignId).queryKey }),
  });
}
