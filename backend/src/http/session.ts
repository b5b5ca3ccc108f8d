import type { NextFunction, Request, Response } from 'express';
import { getIronSession, type IronSession } from 'iron-session';
import type { Actor, ServiceContext } from '../services/context';
import { findTokenUser } from '../services/api-tokens';
import { findSessionUser } from '../services/find-session-user';
import { AppError } from './errors';

export interface SessionData {
  userId?: number;
  /** The user's session epoch at sign-in; a password change bumps it and ends older sessions. */
  epoch?: number;
}

export const SESSION_COOKIE = 'redward_session';
const SESSION_TTL_SECONDS = 14 * 24 * 3600;

declare module 'express-serve-static-core' {
  interface Request {
    session: IronSession<SessionData>;
    user: Actor | null;
  }
}

/** Loads the iron-session cookie and the signed-in user (if any) onto the request. */
export function sessionMiddleware(ctx: ServiceContext, password: string) {
  return async (req: Request, res: Response, next: NextFunction) => {
    try {
      req.session = await getIronSession<SessionData>(req, res, {
        password,
        cookieName: SESSION_COOKIE,
        ttl: SESSION_TTL_SECONDS,
        cookieOptions: { httpOnly: true, sameSite: 'lax', secure: req.secure, path: '/' },
      });
      const bearer = /^Bearer\s+(\S+)$/i.exec(req.get('authorization') ?? '')?.[1];
      if (bearer !== undefined) {
        // Scripts authenticate with a personal access token; a bad one is refused outright
        // rather than falling back to any cookie the client may also send.
        req.user = findTokenUser(ctx, bearer);
        if (!req.user) return next(new AppError(401, 'invalid_token', 'The access token is not valid (unknown, revoked, or its account is disabled).'));
        return next();
      }
      const { userId, epoch } = req.session;
      req.user = userId === undefined ? null : findSessionUser(ctx, userId, epoch ?? 0);
      if (userId !== undefined && req.user === null) req.session.destroy();
      next();
    } catch (err) {
      next(err);
    }
  };
}
