import { Router } from 'express';
import { loginRequestSchema, meResponseSchema } from '../contracts/auth';
import { access } from '../http/access';
import { defineRoute } from '../http/define-route';
import { loginRateLimits } from '../http/rate-limits';
import type { ServiceContext } from '../services/context';
import { endSession } from '../services/sessions';
import { signIn } from '../services/sign-in';

export function authRoutes(ctx: ServiceContext): Router {
  const router = Router();

  defineRoute(ctx, router, {
    method: 'post',
    path: '/auth/login',
    access: access.public,
    before: loginRateLimits(),
    body: loginRequestSchema,
    response: meResponseSchema,
    handle: async ({ req, body }) => {
      const { user, sessionId } = await signIn(ctx, body.email, body.password);
      req.session.sessionId = sessionId;
      await req.session.save();
      return { user };
    },
  });

  defineRoute(ctx, router, {
    method: 'post',
    path: '/auth/logout',
    access: access.public,
    handle: ({ req }) => {
      // Ended in the database, so a copy of the cookie kept elsewhere no longer works either.
      if (typeof req.session.sessionId === 'string') endSession(ctx, req.session.sessionId);
      req.session.destroy();
      return undefined;
    },
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/auth/me',
    access: access.signedIn,
    response: meResponseSchema,
    handle: ({ user }) => ({ user }),
  });

  return router;
}
