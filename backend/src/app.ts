import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import { requestActivity } from './http/request-activity';
import { csrfGuard } from './http/csrf';
import { errorMiddleware } from './http/error-middleware';
import { notFound } from './http/errors';
import { sessionMiddleware } from './http/session';
import { accountRoutes } from './routes/account';
import { adminRoutes } from './routes/admin';
import { authRoutes } from './routes/auth';
import { campaignRoutes } from './routes/campaigns';
import { confirmedRoutes } from './routes/confirmed';
import { healthRoutes } from './routes/health';
import { invitationRoutes } from './routes/invitations';
import { jobRoutes } from './routes/jobs';
import { lineListRoutes } from './routes/line-list';
import { memberRoutes } from './routes/members';
import { openApiRoutes } from './routes/openapi';
import { readingRoutes } from './routes/readings';
import { releaseRoutes } from './routes/release';
import { spectrumRoutes } from './routes/spectra';
import { targetRoutes } from './routes/targets';
import { filterRoutes } from './routes/filters';
import { uploadRoutes } from './routes/uploads';
import { workerRoutes } from './routes/workers';
import type { ServiceContext } from './services/context';

export const FRONTEND_DIST = fileURLToPath(new URL('../../frontend/dist', import.meta.url));

/** The HTTP application: API under /api, the built UI everywhere else. No listening here. */
export function createApp(ctx: ServiceContext, sessionPassword: string): Express {
  const app = express();
  app.disable('x-powered-by');
  if (ctx.config.trustProxy) app.set('trust proxy', 1);
  app.use(
    helmet({
      // Plain http on a LAN must keep working; upgrading requests would break it.
      contentSecurityPolicy: { directives: { upgradeInsecureRequests: null } },
    }),
  );
  app.use(pinoHttp({ logger: ctx.logger, autoLogging: { ignore: (req) => !req.url?.startsWith('/api') } }));

  const api = express.Router();
  api.use(requestActivity.middleware);
  api.use(express.json({ limit: '1mb' }));
  api.use(csrfGuard(ctx.config.publicUrl));
  api.use(sessionMiddleware(ctx, sessionPassword));
  for (const routes of [
    healthRoutes,
    authRoutes,
    accountRoutes,
    campaignRoutes,
    memberRoutes,
    invitationRoutes,
    adminRoutes,
    uploadRoutes,
    jobRoutes,
    spectrumRoutes,
    targetRoutes,
    filterRoutes,
    readingRoutes,
    lineListRoutes,
    releaseRoutes,
    confirmedRoutes,
    workerRoutes,
    openApiRoutes,
  ]) {
    api.use(routes(ctx));
  }
  api.use((req, _res, next) => next(notFound(`No API route ${req.method} ${req.path}.`, 'route_not_found')));
  app.use('/api', api);

  serveFrontend(app);
  app.use(errorMiddleware(ctx.logger));
  return app;
}

function serveFrontend(app: Express): void {
  const index = path.join(FRONTEND_DIST, 'index.html');
  app.use(express.static(FRONTEND_DIST, { index: false, maxAge: '1h' }));
  // Client-side routes (/campaigns/3, /invitations/…) all load the single page.
  app.get(/.*/, (_req, res, next) => {
    if (!existsSync(index)) {
      next(notFound('The user interface has not been built. Run `npm run build` (npm start does this for you).', 'ui_not_built'));
      return;
    }
    res.set('Cache-Control', 'no-cache').sendFile(index);
  });
}
