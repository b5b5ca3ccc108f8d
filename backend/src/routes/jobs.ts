import { Router, type Request } from 'express';
import { access } from '../http/access';
import { defineRoute } from '../http/define-route';
import type { ServiceContext } from '../services/context';
import { jobFilesSchema, jobListSchema, jobProgressSchema, rescanRequestSchema, rescanResponseSchema, scanStatusSchema } from '../contracts/ingest';
import { cancelJob, getJobProgress, jobCampaignId, listCampaignJobs, listJobFiles } from '../services/job-progress';
import { getScanStatus, queueRescan } from '../services/queue-rescan';

const jobId = (req: Request) => Number(req.params.jobId);
const ofJob = (ctx: ServiceContext, req: Request) => jobCampaignId(ctx, jobId(req));
const POLL_MS = 400;
const HEARTBEAT_MS = 15_000;

export function jobRoutes(ctx: ServiceContext): Router {
  const router = Router();

  defineRoute(ctx, router, {
    method: 'get',
    path: '/jobs/:jobId',
    access: access.campaignOf(ofJob, 'lead'),
    response: jobProgressSchema,
    handle: ({ req }) => getJobProgress(ctx, jobId(req)),
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/jobs/:jobId/files',
    access: access.campaignOf(ofJob, 'lead'),
    response: jobFilesSchema,
    handle: ({ req }) => listJobFiles(ctx, jobId(req)),
  });

  defineRoute(ctx, router, {
    method: 'post',
    path: '/jobs/:jobId/cancel',
    access: access.campaignOf(ofJob, 'lead'),
    response: jobProgressSchema,
    handle: ({ req, user }) => cancelJob(ctx, user!, jobId(req)),
  });

  // Server-sent events: a `progress` event whenever the job moves, the last one when it ends.
  // Progress is read from SQLite, so a job run by another process (the import command) streams too.
  defineRoute(ctx, router, {
    method: 'get',
    path: '/jobs/:jobId/events',
    access: access.campaignOf(ofJob, 'lead'),
    handle: ({ req, res }) => {
      res.writeHead(200, { 'Content-Type': 'text/event-stream', 'Cache-Control': 'no-cache, no-transform', Connection: 'keep-alive' });
      let last = '';
      let lastWrite = Date.now();
      const tick = () => {
        const progress = getJobProgress(ctx, jobId(req));
        const json = JSON.stringify(progress);
        if (json !== last) {
          res.write(`event: progress\ndata: ${json}\n\n`);
          last = json;
          lastWrite = Date.now();
        } else if (Date.now() - lastWrite > HEARTBEAT_MS) {
          res.write(': still working\n\n');
          lastWrite = Date.now();
        }
        if (['done', 'failed', 'cancelled'].includes(progress.state)) stop();
      };
      const timer = setInterval(tick, POLL_MS);
      const stop = () => {
        clearInterval(timer);
        res.end();
      };
      req.on('close', () => clearInterval(timer));
      tick();
    },
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/campaigns/:id/jobs',
    access: access.campaign('lead'),
    response: jobListSchema,
    handle: ({ campaign }) => ({ jobs: listCampaignJobs(ctx, campaign!.id) }),
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/campaigns/:id/scan-status',
    access: access.campaignViewer,
    response: scanStatusSchema,
    handle: ({ campaign }) => getScanStatus(ctx, campaign!.id),
  });

  defineRoute(ctx, router, {
    method: 'post',
    path: '/campaigns/:id/rescans',
    access: access.campaign('lead'),
    body: rescanRequestSchema,
    status: 202,
    response: rescanResponseSchema,
    handle: ({ user, campaign, body }) => queueRescan(ctx, user!, campaign!.id, body.all),
  });

  return router;
}
