import { errorResponseSchema } from '@contracts/errors';
import type { z } from 'zod';

/** An error answered by the API (or the network), carrying the server's stable code and sentence. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    /** Itemised problems the server attached (e.g. catalogue rows with errors), unparsed. */
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

export const isApiError = (e: unknown): e is ApiError => e instanceof ApiError;

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

interface RequestOptions<S extends z.ZodType | undefined> {
  method?: Method;
  body?: unknown;
  /** Parses the success body so a contract drift shows up as a clear error, not as undefined fields. */
  schema?: S;
  signal?: AbortSignal;
}

type Result<S> = S extends z.ZodType ? z.output<S> : undefined;

/** Turns an error answer (already read as JSON, or null) into an ApiError; shared with the upload helper. */
export function apiErrorFromBody(status: number, statusText: string, body: unknown): ApiError {
  const parsed = errorResponseSchema.safeParse(body);
  if (parsed.success) {
    const { code, message, details } = parsed.data.error;
    return new ApiError(status, code, message, details);
  }
  // A proxy or a crashed server may answer with HTML; still say what happened.
  const said = [status, statusText].filter(Boolean).join(' ');
  return new ApiError(status, 'http_error', `The server answered ${said}.`);
}

async function toApiError(res: Response): Promise<ApiError> {
  const body: unknown = await res.json().catch(() => null);
  return apiErrorFromBody(res.status, res.statusText, body);
}

export const NETWORK_ERROR_MESSAGE = 'Cannot reach the Redward server. Check your connection and try again.';

/**
 * The one way the UI talks to the API: same-origin cookies, JSON in and out, and every
 * failure turned into an ApiError whose message can be shown to the person verbatim.
 */
export async function apiRequest<S extends z.ZodType | undefined = undefined>(
  path: string,
  { method = 'GET', body, schema, signal }: RequestOptions<S> = {},
): Promise<Result<S>> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (body !== undefined) headers['Content-Type'] = 'application/json';

  let res: Response;
  try {
    res = await fetch(path, {
      method,
      headers,
      credentials: 'same-origin',
      body: body === undefined ? null : JSON.stringify(body),
      signal: signal ?? null,
    });
  } catch (e) {
    if (e instanceof DOMException && e.name === 'AbortError') throw e;
    throw new ApiError(0, 'network_error', NETWORK_ERROR_MESSAGE);
  }

  if (!res.ok) throw await toApiError(res);
  if (schema === undefined || res.status === 204) return undefined as Result<S>;

  const json: unknown = await res.json().catch(() => null);
  const parsed = schema.safeParse(json);
  if (!parsed.success) {
    throw new ApiError(res.status, 'unexpected_response', `The server's answer to ${method} ${path} did not have the expected shape.`);
  }
  return parsed.data as Result<S>;
}

export const api = {
  get: <S extends z.ZodType>(path: string, schema: S, signal?: AbortSignal) =>
    apiRequest(path, { schema, ...(signal ? { signal } : {}) }),
  post: <S extends z.ZodType | undefined = undefined>(path: string, body: unknown, schema?: S) =>
    apiRequest<S>(path, { method: 'POST', body, ...(schema ? { schema } : {}) }),
  patch: <S extends z.ZodType | undefined = undefined>(path: string, body: unknown, schema?: S) =>
    apiRequest<S>(path, { method: 'PATCH', body, ...(schema ? { schema } : {}) }),
  put: <S extends z.ZodType | undefined = undefined>(path: string, body: unknown, schema?: S) =>
    apiRequest<S>(path, { method: 'PUT', body, ...(schema ? { schema } : {}) }),
  delete: <S extends z.ZodType | undefined = undefined>(path: string, schema?: S) =>
    apiRequest<S>(path, { method: 'DELETE', ...(schema ? { schema } : {}) }),
};
