import { Router } from 'express';
import { acceptInvitationRequestSchema, acceptInvitationResponseSchema, invitationPreviewSchema } from '../contracts/invitations';
import { access } from '../http/access';
import { defineRoute } from '../http/define-route';
import { acceptInvitation, previewInvitation } from '../services/accept-invitation';
import type { ServiceContext } from '../services/context';

export function invitationRoutes(ctx: ServiceContext): Router {
  const router = Router();

  defineRoute(ctx, router, {
    method: 'get',
    path: '/invitations/:token',
    access: access.public,
    response: invitationPreviewSchema,
    handle: ({ req }) => previewInvitation(ctx, String(req.params.token)),
  });

  defineRoute(ctx, router, {
    method: 'post',
    path: '/invitations/:token/accept',
    access: access.public,
    body: acceptInvitationRequestSchema,
    response: acceptInvitationResponseSchema,
    handle: async ({ req, user, body }) => {
      const result = await acceptInvitation(ctx, String(req.params.token), user, body);
      if (result.sessionId !== null) {
        req.session.sessionId = result.sessionId;
        await req.session.save();
      }
      return { campaignId: result.campaignId, user: result.user };
    },
  });

  return router;
}
