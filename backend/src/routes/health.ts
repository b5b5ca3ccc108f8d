import { Router } from 'express';
import { healthResponseSchema } from '../contracts/admin';
import { access } from '../http/access';
import { defineRoute } from '../http/define-route';
import type { ServiceContext } from '../services/context';

export function healthRoutes(ctx: ServiceContext): Router {
  const router = Router();
  defineRoute(ctx, router, {
    method: 'get',
    path: '/health',
    access: access.public,
    response: healthResponseSchema,
    handle: () => ({ ok: true, version: ctx.config.version }),
  });
  return router;
}
