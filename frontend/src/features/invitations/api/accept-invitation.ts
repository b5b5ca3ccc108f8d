import { acceptInvitationResponseSchema } from '@contracts/invitations';
import type { AcceptInvitationRequest, AcceptInvitationResponse } from '@contracts/invitations';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { sessionKeys } from '@/lib/session';
import { invitationKeys } from './keys';

export const acceptInvitation = (token: string, body: AcceptInvitationRequest): Promise<AcceptInvitationResponse> =>
  api.post(`/api/invitations/${encodeURIComponent(token)}/accept`, body, acceptInvitationResponseSchema);

export function useAcceptInvitation(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AcceptInvitationRequest) => acceptInvitation(token, body),
    onSuccess: ({ user }) => {
      // Accepting may have signed a new person in, and it changes their campaigns: start from fresh data.
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== sessionKeys.me()[0] });
      queryClient.setQueryData(sessionKeys.me(), user);
      return queryClient.invalidateQueries({ queryKey: invitationKeys.detail(token) });
    },
  });
}
