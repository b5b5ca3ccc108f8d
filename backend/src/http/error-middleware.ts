import type { NextFunction, Request, Response } from 'express';
import type { Logger } from 'pino';
import { AppError } from './errors';

interface BodyParserError extends Error {
  type?: string;
  status?: number;
}

/**
 * The one place errors become responses: `{ error: { code, message } }`. Known errors keep
 * their status and sentence; anything unexpected is logged and answered without details.
 */
export function errorMiddleware(logger: Logger) {
  return (err: unknown, req: Request, res: Response, _next: NextFunction) => {
    if (res.headersSent) {
      req.socket.destroy();
      return;
    }
    if (err instanceof AppError) {
      const details = err.details === undefined ? {} : { details: err.details };
      res.set(err.headers).status(err.status).json({ error: { code: err.code, message: err.message, ...details } });
      return;
    }
    const bodyError = err as BodyParserError;
    if (bodyError.type === 'entity.parse.failed') {
      res.status(400).json({ error: { code: 'malformed_json', message: 'The request body is not valid JSON.' } });
      return;
    }
    if (bodyError.type === 'entity.too.large') {
      res.status(413).json({ error: { code: 'payload_too_large', message: 'The request body is too large.' } });
      return;
    }
    if (bodyError.type === 'encoding.unsupported' || bodyError.type === 'charset.unsupported') {
      res.status(415).json({ error: { code: 'unsupported_encoding', message: 'Send JSON encoded as UTF-8.' } });
      return;
    }
    logger.error({ err, method: req.method, url: req.originalUrl }, 'unhandled error');
    res.status(500).json({ error: { code: 'internal_error', message: 'Something went wrong on the server. The error has been logged.' } });
  };
}
