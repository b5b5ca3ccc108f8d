import { Router, type Request } from 'express';
import {
  assignReadersRequestSchema,
  assignReadersResponseSchema,
  confirmedHistorySchema,
  confirmedIdResponseSchema,
  correctionRequestSchema,
  delegateRequestSchema,
  delegateResponseSchema,
  disagreementListSchema,
  reassignRequestSchema,
  reassignResponseSchema,
  settleRequestSchema,
  spectrumAssignmentsSchema,
} from '../contracts/release';
import { appUrl } from '../http/app-url';
import { assignReaders, reassignReading, spectrumAssignments } from '../services/assign-readers';
import { access } from '../http/access';
import { defineRoute } from '../http/define-route';
import type { ServiceContext } from '../services/context';
import { confirmedHistory, correctConfirmed } from '../services/correct-confirmed';
import { delegateDisagreement, disagreementCampaignId, listOpenDisagreements, settleDisagreement } from '../services/settle-disagreement';
import { spectrumCampaignId } from '../services/spectrum-access';

const spectrumId = (req: Request) => Number(req.params.spectrumId);
const disagreementId = (req: Request) => Number(req.params.disagreementId);

export function releaseRoutes(ctx: ServiceContext): Router {
  const router = Router();
  const ofSpectrum = (c: ServiceContext, req: Request) => spectrumCampaignId(c, spectrumId(req));

  // Leads see every open disagreement; readers only those a lead delegated to them.
  defineRoute(ctx, router, {
    method: 'get',
    path: '/campaigns/:id/disagreements',
    access: access.campaign('lead', 'reader'),
    response: disagreementListSchema,
    handle: ({ user, campaign }) => listOpenDisagreements(ctx, campaign!.id, campaign!.role === 'lead' ? undefined : user!.id),
  });

  defineRoute(ctx, router, {
    method: 'post',
    path: '/disagreements/:disagreementId/settle',
    access: access.campaignOf((c, req) => disagreementCampaignId(c, disagreementId(req)), 'lead', 'reader'),
    body: settleRequestSchema,
    response: confirmedIdResponseSchema,
    handle: ({ req, user, campaign, body }) => settleDisagreement(ctx, user!, campaign!.role, disagreementId(req), body),
  });

  defineRoute(ctx, router, {
    method: 'post',
    path: '/disagreements/:disagreementId/delegate',
    access: access.campaignOf((c, req) => disagreementCampaignId(c, disagreementId(req)), 'lead'),
    body: delegateRequestSchema,
    response: delegateResponseSchema,
    handle: ({ req, user, body }) => delegateDisagreement(ctx, user!, disagreementId(req), body.readerId, appUrl(ctx.config)),
  });

  defineRoute(ctx, router, {
    method: 'post',
    path: '/spectra/:spectrumId/corrections',
    access: access.campaignOf(ofSpectrum, 'lead'),
    body: correctionRequestSchema,
    response: confirmedIdResponseSchema,
    handle: ({ req, user, body }) => correctConfirmed(ctx, user!, spectrumId(req), body),
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/spectra/:spectrumId/confirmed',
    access: access.campaignOf(ofSpectrum, 'lead', 'reader', 'observer'),
    response: confirmedHistorySchema,
    handle: ({ req }) => ({ history: confirmedHistory(ctx, spectrumId(req)) }),
  });

  defineRoute(ctx, router, {
    method: 'post',
    path: '/campaigns/:id/assignments',
    access: access.campaign('lead'),
    body: assignReadersRequestSchema,
    response: assignReadersResponseSchema,
    handle: ({ user, campaign, body }) => assignReaders(ctx, user!, campaign!.id, body.readerIds, appUrl(ctx.config)),
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/spectra/:spectrumId/assignments',
    access: access.campaignOf(ofSpectrum, 'lead'),
    response: spectrumAssignmentsSchema,
    handle: ({ req }) => spectrumAssignments(ctx, spectrumId(req)),
  });

  defineRoute(ctx, router, {
    method: 'put',
    path: '/spectra/:spectrumId/assignments',
    access: access.campaignOf(ofSpectrum, 'lead'),
    body: reassignRequestSchema,
    response: reassignResponseSchema,
    handle: ({ req, user, body }) => reassignReading(ctx, user!, spectrumId(req), body.readingOrder, body.readerId),
  });

  return router;
}
