import { Router } from 'express';
import { spectraPageSchema, spectraQuerySchema } from '../contracts/ingest';
import { linkSpectrumRequestSchema, linkSpectrumResponseSchema } from '../contracts/targets';
import { access } from '../http/access';
import { defineRoute } from '../http/define-route';
import type { ServiceContext } from '../services/context';
import { linkSpectrum } from '../services/link-spectrum';
import { spectrumCampaignId } from '../services/spectrum-access';
import { listSpectra } from '../services/list-spectra';

export function spectrumRoutes(ctx: ServiceContext): Router {
  const router = Router();

  defineRoute(ctx, router, {
    method: 'get',
    path: '/campaigns/:id/spectra',
    access: access.campaignViewer,
    query: spectraQuerySchema,
    response: spectraPageSchema,
    handle: ({ campaign, user, query }) => listSpectra(ctx, campaign!.id, query, { userId: user!.id, role: campaign!.role }),
  });

  defineRoute(ctx, router, {
    method: 'patch',
    path: '/spectra/:spectrumId/target',
    access: access.campaignOf((c, req) => spectrumCampaignId(c, Number(req.params.spectrumId)), 'lead'),
    body: linkSpectrumRequestSchema,
    response: linkSpectrumResponseSchema,
    handle: ({ req, user, body }) => linkSpectrum(ctx, user!, Number(req.params.spectrumId), body.targetId),
  });

  return router;
}
