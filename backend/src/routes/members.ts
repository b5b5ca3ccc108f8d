import { Router } from 'express';
import { inviteMemberRequestSchema, inviteMemberResponseSchema, membersResponseSchema } from '../contracts/campaigns';
import { access } from '../http/access';
import { defineRoute } from '../http/define-route';
import { appUrl } from '../http/app-url';
import type { ServiceContext } from '../services/context';
import { inviteMember } from '../services/invite-member';
import { listMembers } from '../services/list-members';

export function memberRoutes(ctx: ServiceContext): Router {
  const router = Router();

  defineRoute(ctx, router, {
    method: 'get',
    path: '/campaigns/:id/members',
    access: access.campaignViewer,
    response: membersResponseSchema,
    handle: ({ campaign }) => listMembers(ctx, campaign!.id, campaign!.role),
  });

  defineRoute(ctx, router, {
    method: 'post',
    path: '/campaigns/:id/members',
    access: access.campaign('lead'),
    body: inviteMemberRequestSchema,
    status: 201,
    response: inviteMemberResponseSchema,
    handle: async ({ user, campaign, body }) => ({
      invitation: await inviteMember(ctx, user!, campaign!.id, body.email, body.role, appUrl(ctx.config)),
    }),
  });

  return router;
}
