import { Router } from 'express';
import { campaignListResponseSchema, campaignResponseSchema, createCampaignRequestSchema, updateCampaignRequestSchema } from '../contracts/campaigns';
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
    response: campaignListResponseSchema,
    handle: ({ user }) => ({ campaigns: listCampaigns(ctx, user!) }),
  });

  defineRoute(ctx, router, {
    method: 'post',
    path: '/campaigns',
    access: access.signedIn,
    body: createCampaignRequestSchema,
    status: 201,
    response: campaignResponseSchema,
    handle: ({ user, body }) => ({ campaign: createCampaign(ctx, user, body) }),
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/campaigns/:id',
    access: access.campaignViewer,
    response: campaignResponseSchema,
    handle: ({ campaign }) => ({ campaign: getCampaignView(ctx, campaign!.id, campaign!.role) }),
  });

  defineRoute(ctx, router, {
    method: 'patch',
    path: '/campaigns/:id',
    access: access.campaign('lead'),
    body: updateCampaignRequestSchema,
    response: campaignResponseSchema,
    handle: ({ user, campaign, body }) => ({ campaign: updateCampaign(ctx, user!, campaign!.id, campaign!.role, body) }),
  });

  return router;
}
