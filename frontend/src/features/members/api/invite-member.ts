import { inviteMemberResponseSchema } from '@contracts/campaigns';
import type { InviteMemberRequest, PendingInvitation } from '@contracts/campaigns';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { memberKeys } from './keys';

export async function inviteMember(campaignId: number, body: InviteMemberRequest): Promise<PendingInvitation> {
  const { invitation } = await api.post(`/api/campaigns/${campaignId}/members`, body, inviteMemberResponseSchema);
  return invitation;
}

export function useInviteMember(campaignId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: InviteMemberRequest) => inviteMember(campaignId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: memberKeys.list(campaignId) }),
  });
}
