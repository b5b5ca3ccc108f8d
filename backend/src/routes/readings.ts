import { Router, type Request } from 'express';
import { queueQuerySchema, readingQueueSchema, readingResponseSchema, submitReadingRequestSchema } from '../contracts/readings';
import { solutionModelQuerySchema, spectrumDetailSchema } from '../contracts/spectra';
import { access } from '../http/access';
import { defineRoute } from '../http/define-route';
import type { ServiceContext } from '../services/context';
import { readingQueue } from '../services/reading-queue';
import { getScanCurves, getSpectrumDetail } from '../services/spectrum-detail';
import { packSolutionModel } from '../services/solution-model';
import { packSpectrumData } from '../services/spectrum-data';
import { spectrumCampaignId } from '../services/spectrum-access';
import { submitReading } from '../services/submit-reading';
import { findCampaignRole } from '../services/find-campaign-role';
import { forbidden, notFound } from '../http/errors';
import { appUrl } from '../http/app-url';
import { notifyDisagreement } from '../services/notify-disagreement';
import { combLinesQuerySchema, combLinesResponseSchema } from '../contracts/line-measurements';
import { measureSpectrumLines } from '../services/measure-lines';

const spectrumId = (req: Request) => Number(req.params.spectrumId);
const ofSpectrum = (ctx: ServiceContext, req: Request) => spectrumCampaignId(ctx, spectrumId(req));

export function readingRoutes(ctx: ServiceContext): Router {
  const router = Router();
  const viewer = access.campaignOf(ofSpectrum, 'lead', 'reader', 'observer');

  defineRoute(ctx, router, {
    method: 'get',
    path: '/me/queue',
    access: access.signedIn,
    query: queueQuerySchema,
    response: readingQueueSchema,
    handle: ({ user, query }) => {
      const { exists, role } = findCampaignRole(ctx, user!.id, query.campaign);
      // Administrators may view every campaign, so to them its existence is no secret: say why.
      if (exists && role === null && user!.isAdmin) throw notFound('You are not a member of this campaign, so it holds no reading queue for you.', 'campaign_not_found');
      if (!exists || role === null) throw notFound('No such campaign.', 'campaign_not_found');
      if (role === 'observer') throw forbidden('Observers have no reading queue.');
      return readingQueue(ctx, user!, query.campaign);
    },
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/spectra/:spectrumId',
    access: viewer,
    response: spectrumDetailSchema,
    handle: ({ user, campaign, req }) => getSpectrumDetail(ctx, user!, campaign!.role, spectrumId(req)),
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/spectra/:spectrumId/data',
    access: viewer,
    handle: async ({ req, res }) => {
      // Packed before any header is set: an error must leave as JSON, not as an octet stream.
      const { packed, etag } = await packSpectrumData(ctx, spectrumId(req));
      res.set('ETag', etag).set('Cache-Control', 'private, max-age=3600');
      if (req.get('if-none-match') === etag) return void res.status(304).end();
      res.type('application/octet-stream').send(packed);
    },
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/spectra/:spectrumId/scan-curves',
    access: viewer,
    handle: ({ req, res }) => {
      // Binary, as stored (contracts/scan-curves-binary.ts); revalidated, since a re-scan replaces them.
      const { packed, etag } = getScanCurves(ctx, spectrumId(req));
      res.set('ETag', etag).set('Cache-Control', 'private, no-cache');
      if (req.get('if-none-match') === etag) return void res.status(304).end();
      res.type('application/octet-stream').send(packed);
    },
  });

  // Measured on demand at the comb's z: nothing is cached, so it can never describe another z or file.
  defineRoute(ctx, router, {
    method: 'get',
    path: '/spectra/:spectrumId/lines',
    access: viewer,
    query: combLinesQuerySchema,
    response: combLinesResponseSchema,
    handle: ({ req, query }) => measureSpectrumLines(ctx, spectrumId(req), query.z, query.class),
  });

  // float32[n] on the spectrum's pixels, the same n as /data.
  defineRoute(ctx, router, {
    method: 'get',
    path: '/spectra/:spectrumId/solutions/:rank/model',
    access: viewer,
    query: solutionModelQuerySchema,
    handle: async ({ req, res, query }) => {
      const rank = Number(req.params.rank);
      if (!Number.isInteger(rank) || rank < 1) throw notFound('Solutions are numbered from 1.', 'solution_not_found');
      const scan = query.scan;
      // Cached only when the URL names its scan: then it can never show another scan's model.
      const model = await packSolutionModel(ctx, spectrumId(req), rank, scan);
      res.type('application/octet-stream').set('Cache-Control', scan === undefined ? 'no-cache' : 'private, max-age=3600').send(model);
    },
  });

  defineRoute(ctx, router, {
    method: 'post',
    path: '/spectra/:spectrumId/readings',
    access: access.campaignOf(ofSpectrum, 'lead', 'reader'),
    body: submitReadingRequestSchema,
    response: readingResponseSchema,
    handle: async ({ req, user, body }) => {
      const { reading, changed, outcome } = submitReading(ctx, user!, spectrumId(req), body);
      if (outcome.kind === 'disagreement' && outcome.opened) await notifyDisagreement(ctx, outcome.disagreementId, appUrl(ctx.config));
      // The outcome stays on the server: telling the second reader "agreed" would unblind them.
      return { reading, changed };
    },
  });

  return router;
}
