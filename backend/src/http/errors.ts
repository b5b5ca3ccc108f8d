/**
 * Errors the API may answer with. Services throw these; one middleware writes them as
 * `{ error: { code, message } }` with the status. Anything else is a 500 without details.
 */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly headers: Record<string, string> = {},
    /** Itemised problems (e.g. catalogue rows) a client can list; sent as `error.details`. */
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const badRequest = (message: string, code = 'bad_request') => new AppError(400, code, message);
export const unauthenticated = (message = 'Sign in to continue.') => new AppError(401, 'unauthenticated', message);
export const forbidden = (message = 'You do not have permission to do this.', code = 'forbidden') =>
  new AppError(403, code, message);
export const notFound = (message = 'Not found.', code = 'not_found') => new AppError(404, code, message);
export const conflict = (message: string, code = 'conflict') => new AppError(409, code, message);
export const gone = (message: string, code = 'gone') => new AppError(410, code, message);
export const tooManyRequests = (message: string, retryAfterSeconds: number) =>
  new AppError(429, 'too_many_attempts', message, { 'Retry-After': String(retryAfterSeconds) });
