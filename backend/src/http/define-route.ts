import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import { z } from 'zod';
import type { ServiceContext } from '../services/context';
import { authorize, type Access, type Authorization } from './access';
import { AppError } from './errors';
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
  /**
   * The JSON answer: documented in the OpenAPI document and, where responses are validated (the
   * test app), checked before it is sent. Routes that stream files, binary or events leave it out.
   */
  response?: z.ZodType;
  /**
   * Other success statuses the handler sets itself (`res.status(…)`) with the same `response`
   * schema, documented beside `status`: e.g. 202 when part of the work continues as a job.
   */
  alsoAnswers?: ReadonlyArray<{ status: number; description: string }>;
  handle: (input: RouteInput<B, Q>) => unknown;
}

export interface RouteDoc {
  method: string;
  path: string;
  access: Access;
  body?: z.ZodType;
  query?: z.ZodType;
  response?: z.ZodType;
  status: number;
  alsoAnswers?: ReadonlyArray<{ status: number; description: string }>;
}

/** Every route defined for an application, for the OpenAPI document; one list per context. */
export const routeDocs = new WeakMap<ServiceContext, RouteDoc[]>();

/** Applications whose JSON answers are checked against their route's `response` schema. */
const validatedContexts = new WeakSet<ServiceContext>();

/**
 * Checks every JSON answer of this application against its route's `response` schema before it
 * is sent; an answer that does not match fails the request with a 500 naming the route. The test
 * app turns this on so contract drift fails the API tests; production never does, and pays only one
 * set lookup per answer (no serialisation, no parse).
 */
export function validateResponses(ctx: ServiceContext): void {
  validatedContexts.add(ctx);
}

/**
 * Registers one route as a chain: limits → authorize → validate → use-case. The handler
 * returns the JSON body; errors it throws reach the error middleware.
 */
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
    ...(spec.alsoAnswers ? { alsoAnswers: spec.alsoAnswers } : {}),
  });
  const run = async (req: Request, res: Response, next: NextFunction) => {
    try {
      const auth = authorize(ctx, req, spec.access);
      const body = spec.body ? parseOrThrow(spec.body, req.body ?? {}, 'body') : (undefined as B);
      const query = spec.query ? parseOrThrow(spec.query, req.query, 'query') : (undefined as Q);
      const result = await spec.handle({ ...auth, req, res, body, query });
      if (res.headersSent) return;
      if (result === undefined) res.status(204).end();
      else {
        if (validatedContexts.has(ctx)) checkResponse(`${spec.method.toUpperCase()} ${spec.path}`, spec.response, result);
        res.status(spec.status ?? 200).json(result);
      }
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

/**
 * Parses what the client will receive (the value after JSON serialisation, as the client's own
 * contract parse sees it) with the route's schema, and refuses fields the schema does not declare
 * (zod would strip them silently, leaving them undocumented). Only called where responses are validated.
 */
function checkResponse(route: string, schema: z.ZodType | undefined, result: unknown): void {
  if (!schema) {
    throw new AppError(500, 'response_schema_missing', `${route} answered JSON but declares no response schema; set \`response\` in its defineRoute.`);
  }
  const sent: unknown = JSON.parse(JSON.stringify(result));
  const parsed = schema.safeParse(sent);
  if (!parsed.success) {
    throw new AppError(500, 'response_contract_mismatch', `${route} answered JSON that does not match its response schema:\n${z.prettifyError(parsed.error)}`);
  }
  const extra = [...new Set(undeclaredFields(sent, parsed.data, '$'))];
  if (extra.length > 0) {
    throw new AppError(500, 'response_contract_mismatch', `${route} answered fields its response schema does not declare: ${extra.join(', ')}.`);
  }
}

/** Paths of object keys present in what was sent but dropped by the schema's parse. */
function undeclaredFields(sent: unknown, kept: unknown, at: string): string[] {
  if (sent === null || typeof sent !== 'object' || kept === null || typeof kept !== 'object') return [];
  if (Array.isArray(sent)) return sent.flatMap((item, i) => undeclaredFields(item, (kept as unknown[])[i], `${at}[]`));
  return Object.entries(sent).flatMap(([key, value]) =>
    key in kept ? undeclaredFields(value, (kept as Record<string, unknown>)[key], `${at}.${key}`) : [`${at}.${key}`],
  );
}
