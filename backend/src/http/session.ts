import type { NextFunction, Request, Response } from 'express';
import type { IncomingMessage } from 'node:http';
import { getIronSession, unsealData, type IronSession, type SessionOptions } from 'iron-session';
import type { Actor, ServiceContext } from '../services/context';
import { findTokenUser } from '../services/api-tokens';
import { findSessionUser, SESSION_TTL_MS } from '../services/sessions';
import { findWorker, WORKER_TOKEN_PREFIX, type WorkerIdentity } from '../services/worker-tokens';
import { AppError } from './errors';
import { UnsealedCookieCache } from './unsealed-cookie-cache';

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
  // Per middleware, so per session password: a cookie unsealed under one is never reused under another.
  const unsealed = new UnsealedCookieCache<SessionData>();
  /**
   * iron-session's session object for this request, its data unsealed from the cookie or taken
   * from the cache of cookies unsealed before. The library is handed a request without cookies
   * (so it unseals nothing) and the data are put on the object it returns, which keeps its own
   * save() and destroy().
   */
  const loadSession = async (req: Request, res: Response, options: SessionOptions): Promise<IronSession<SessionData>> => {
    const sealed = cookieValue(req.headers.cookie, SESSION_COOKIE);
    let data: SessionData = {};
    if (sealed) {
      const cached = unsealed.get(sealed);
      if (cached) data = cached;
      else {
        data = await unsealData<SessionData>(sealed, { password: options.password, ttl: options.ttl });
        // An unreadable, altered or expired cookie unseals to {}: nothing to remember.
        if (Object.keys(data).length > 0) unsealed.set(sealed, data);
      }
    }
    const session = await getIronSession<SessionData>({ headers: {} } as IncomingMessage, res, options);
    return Object.assign(session, data);
  };
  return async (req: Request, res: Response, next: NextFunction) => {
    try {
      req.session = await loadSession(req, res, {
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

/**
 * The first cookie called `name` in a Cookie header (RFC 6265 §5.4: the first is the most
 * specific; the `cookie` package iron-session uses reads it the same way), unquoted and
 * percent-decoded; '' when absent.
 */
export function cookieValue(header: string | undefined, name: string): string {
  if (!header) return '';
  for (const pair of header.split(';')) {
    const eq = pair.indexOf('=');
    if (eq < 0 || pair.slice(0, eq).trim() !== name) continue;
    let value = pair.slice(eq + 1).trim();
    if (value.length >= 2 && value.startsWith('"') && value.endsWith('"')) value = value.slice(1, -1);
    if (!value.includes('%')) return value;
    try {
      return decodeURIComponent(value);
    } catch {
      return value;
    }
  }
  return '';
}
