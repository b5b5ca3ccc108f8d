import { Router } from 'express';
import { loginRequestSchema, meResponseSchema } from '../contracts/auth';
import { access } from '../http/access';
import { defineRoute } from '../http/define-route';
import { clientAddressKey, SignInLimiter, signInRefused } from '../http/rate-limits';
import { alertSignInAttack } from '../services/alert-sign-in-attack';
import type { ServiceContext } from '../services/context';
import { endSession } from '../services/sessions';
import { signIn } from '../services/sign-in';

export function authRoutes(ctx: ServiceContext): Router {
  const router = Router();
  const limiter = new SignInLimiter(ctx.now);

  defineRoute(ctx, router, {
    method: 'post',
    path: '/auth/login',
    access: access.public,
    body: loginRequestSchema,
    response: meResponseSchema,
    handle: async ({ req, body }) => {
      // req.ip is the socket's address unless TRUST_PROXY lets X-Forwarded-For speak for it.
      const address = clientAddressKey(req.ip);
      const refusal = limiter.attempt(address, body.email);
      if (refusal) throw signInRefused(refusal);
      let signedIn: Awaited<ReturnType<typeof signIn>>;
      try {
        signedIn = await signIn(ctx, body.email, body.password);
      } catch (err) {
        const { alertDue, accountFailures } = limiter.failed(body.email);
        // Not awaited: the person at the form should not wait for SMTP.
        if (alertDue) void alertSignInAttack(ctx, { email: body.email, failures: accountFailures, windowMinutes: limiter.limits.windowMs / 60_000 });
        throw err;
      }
      limiter.succeeded(address, body.email);
      const { user, sessionId } = signedIn;
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
