import { Router } from 'express';
import { createCampaignRequestSchema, updateCampaignRequestSchema } from '../contracts/campaigns';
import { access } from '../http/access';
import { defineRoute } from '../http/define-route';
import { getCampaignView } from '../services/campaign-view';
import type { ServiceContext } from '../services/context';
import { createCampaign } from '../services/create-campaign';
import { listCampaigns } from '../services/list-campaigns';
import { updateCampaign } from '../services/update-campaign';

export function campaignRoutes(ctx: ServiceContext): Router {
  const router = Router();

  defineRoute(ctx, router, {
    method: 'get',
    path: '/campaigns',
    access: access.signedIn,
    handle: ({ user }) => ({ campaigns: listCampaigns(ctx, user!) }),
  });

  defineRoute(ctx, router, {
    method: 'post',
    path: '/campaigns',
    access: access.signedIn,
    body: createCampaignRequestSchema,
    status: 201,
    handle: ({ user, body }) => ({ campaign: createCampaign(ctx, user, body) }),
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/campaigns/:id',
    access: access.campaignViewer,
    handle: ({ campaign }) => ({ campaign: getCampaignView(ctx, campaign!.id, campaign!.role) }),
  });

  defineRoute(ctx, router, {
    method: 'patch',
    path: '/campaigns/:id',
    access: access.campaign('lead'),
    body: updateCampaignRequestSchema,
    handle: ({ user, campaign, body }) => ({ campaign: updateCampaign(ctx, user!, campaign!.id, campaign!.role, body) }),
  });

  return router;
}
