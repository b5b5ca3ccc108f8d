import type { Request } from 'express';
import { rateLimit } from 'express-rate-limit';
import { tooManyRequests } from './errors';

const WINDOW_MS = 15 * 60 * 1000;

function limitReached(next: (err: unknown) => void, retryAfterMs: number) {
  const minutes = Math.max(1, Math.ceil(retryAfterMs / 60000));
  next(tooManyRequests(`Too many failed sign-in attempts. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`, Math.ceil(retryAfterMs / 1000)));
}

/**
 * Failed sign-ins are limited per client address and per account; successful ones do not
 * count, so a person who finally types the right password is not punished.
 */
export function loginRateLimits() {
  const common = {
    windowMs: WINDOW_MS,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8' as const,
    legacyHeaders: false,
    handler: (req: Request, _res: unknown, next: (err: unknown) => void) => {
      const reset = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
      limitReached(next, reset ? reset.getTime() - Date.now() : WINDOW_MS);
    },
  };
  const perAddress = rateLimit({ ...common, limit: 50 });
  const perAccount = rateLimit({
    ...common,
    limit: 10,
    keyGenerator: (req) => `account:${String((req.body as { email?: unknown } | undefined)?.email ?? '').trim().toLowerCase()}`,
  });
  return [perAddress, perAccount];
}
