import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import type { z } from 'zod';
import type { ServiceContext } from '../services/context';
import { authorize, type Access, type Authorization } from './access';
import { validationError } from './validation-error';

export interface RouteInput<B, Q> extends Authorization {
  req: Request;
  res: Response;
  body: B;
  query: Q;
}

export interface RouteSpec<B, Q> {
  method: 'get' | 'post' | 'patch' | 'put' | 'delete';
  path: string;
  access: Access;
  body?: z.ZodType<B>;
  query?: z.ZodType<Q>;
  /** Middleware run before authorization, e.g. rate limits. */
  before?: RequestHandler[];
  /** Status for a returned value; `undefined` results always answer 204. */
  status?: number;
  /** The JSON answer, for the OpenAPI document (routes that send files leave it out). */
  response?: z.ZodType;
  handle: (input: RouteInput<B, Q>) => unknown;
}

/**
 * Registers one route as a chain: limits → authorize → validate → use-case. The handler
 * returns the JSON body; errors it throws reach the error middleware.
 */
export interface RouteDoc {
  method: string;
  path: string;
  access: Access;
  body?: z.ZodType;
  query?: z.ZodType;
  response?: z.ZodType;
  status: number;
}

/** Every route defined for an application, for the OpenAPI document; one list per context. */
export const routeDocs = new WeakMap<ServiceContext, RouteDoc[]>();

export function defineRoute<B = undefined, Q = undefined>(ctx: ServiceContext, router: Router, spec: RouteSpec<B, Q>): void {
  const docs = routeDocs.get(ctx) ?? [];
  routeDocs.set(ctx, docs);
  docs.push({
    method: spec.method,
    path: spec.path,
    access: spec.access,
    ...(spec.body ? { body: spec.body } : {}),
    ...(spec.query ? { query: spec.query } : {}),
    ...(spec.response ? { response: spec.response } : {}),
    status: spec.status ?? 200,
  });
  const run = async (req: Request, res: Response, next: NextFunction) => {
    try {
      const auth = authorize(ctx, req, spec.access);
      const body = spec.body ? parseOrThrow(spec.body, req.body ?? {}, 'body') : (undefined as B);
      const query = spec.query ? parseOrThrow(spec.query, req.query, 'query') : (undefined as Q);
      const result = await spec.handle({ ...auth, req, res, body, query });
      if (res.headersSent) return;
      if (result === undefined) res.status(204).end();
      else res.status(spec.status ?? 200).json(result);
    } catch (err) {
      next(err);
    }
  };
  router[spec.method](spec.path, ...(spec.before ?? []), run);
}

function parseOrThrow<T>(schema: z.ZodType<T>, value: unknown, where: 'body' | 'query'): T {
  const parsed = schema.safeParse(value);
  if (!parsed.success) throw validationError(parsed.error, where);
  return parsed.data;
}
