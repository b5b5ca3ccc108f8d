import { invitationPreviewSchema } from '@contracts/invitations';
import type { InvitationPreview } from '@contracts/invitations';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { invitationKeys } from './keys';

export const getInvitation = (token: string, signal?: AbortSignal): Promise<InvitationPreview> =>
  api.get(`/api/invitations/${encodeURIComponent(token)}`, invitationPreviewSchema, signal);

export const getInvitationQueryOptions = (token: string) =>
  queryOptions({
    queryKey: invitationKeys.detail(token),
    queryFn: ({ signal }) => getInvitation(token, signal),
    // 404/410 are final answers about this link; asking again only delays the message.
    retry: false,
  });

export const useInvitation = (token: string) => useQuery(getInvitationQueryOptions(token));
