import type { NextFunction, Request, Response } from 'express';
import { forbidden } from './errors';
import { SESSION_COOKIE } from './session';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Cross-site request forgery defence for cookie-authenticated changes: the request must come
 * from a page of our own origin (Origin header, or Referer when a browser omits Origin).
 * Requests without our session cookie cannot act as anyone and pass through.
 */
export function csrfGuard(publicUrl: string | undefined) {
  const configuredOrigin = publicUrl ? new URL(publicUrl).origin : undefined;
  return (req: Request, _res: Response, next: NextFunction) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const hasSessionCookie = (req.headers.cookie ?? '').includes(`${SESSION_COOKIE}=`);
    if (!hasSessionCookie) return next();
    const ownOrigin = `${req.protocol}://${req.get('host')}`;
    const claimed = req.get('origin') ?? originOf(req.get('referer'));
    if (claimed && (claimed === ownOrigin || claimed === configuredOrigin)) return next();
    next(forbidden('This request did not come from a Redward page (cross-site request refused).', 'csrf_rejected'));
  };
}

function originOf(url: string | undefined): string | undefined {
  if (!url) return undefined;
  try {
    return new URL(url).origin;
  } catch {
    return undefined;
  }
}
