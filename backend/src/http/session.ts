import type { NextFunction, Request, Response } from 'express';
import { getIronSession, type IronSession } from 'iron-session';
import type { Actor, ServiceContext } from '../services/context';
import { findTokenUser } from '../services/api-tokens';
import { findSessionUser, SESSION_TTL_MS } from '../services/sessions';
import { findWorker, WORKER_TOKEN_PREFIX, type WorkerIdentity } from '../services/worker-tokens';
import { AppError } from './errors';

/** What the sealed cookie holds: only the id of a row in `sessions`, which decides if it still counts. */
export interface SessionData {
  sessionId?: string;
}

export const SESSION_COOKIE = 'redward_session';

declare module 'express-serve-static-core' {
  interface Request {
    session: IronSession<SessionData>;
    user: Actor | null;
    /** A scan worker's token (worker routes only); null for people. */
    worker: WorkerIdentity | null;
  }
}

/** Loads the iron-session cookie and the signed-in user (if any) onto the request. */
export function sessionMiddleware(ctx: ServiceContext, password: string) {
  return async (req: Request, res: Response, next: NextFunction) => {
    try {
      req.session = await getIronSession<SessionData>(req, res, {
        password,
        cookieName: SESSION_COOKIE,
        ttl: SESSION_TTL_MS / 1000,
        cookieOptions: { httpOnly: true, sameSite: 'lax', secure: req.secure, path: '/' },
      });
      req.worker = null;
      const bearer = /^Bearer\s+(\S+)$/i.exec(req.get('authorization') ?? '')?.[1];
      if (bearer?.startsWith(WORKER_TOKEN_PREFIX)) {
        // A scan worker: no person, so req.user stays null and only worker routes let it in.
        req.user = null;
        req.worker = findWorker(ctx, bearer);
        if (!req.worker) return next(new AppError(401, 'invalid_token', 'The worker token is not valid (unknown or revoked).'));
        return next();
      }
      if (bearer !== undefined) {
        // Scripts authenticate with a personal access token; a bad one is refused outright
        // rather than falling back to any cookie the client may also send.
        req.user = findTokenUser(ctx, bearer);
        if (!req.user) return next(new AppError(401, 'invalid_token', 'The access token is not valid (unknown, revoked, or its account is disabled).'));
        return next();
      }
      const { sessionId } = req.session;
      req.user = typeof sessionId === 'string' ? findSessionUser(ctx, sessionId) : null;
      // An ended session (or a cookie from before sessions were recorded) clears the cookie.
      if (req.user === null && Object.keys(req.session).length > 0) req.session.destroy();
      next();
    } catch (err) {
      next(err);
    }
  };
}
