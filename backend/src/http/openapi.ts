import { z } from 'zod';
import { errorResponseSchema } from '../contracts/errors';
import type { Access } from './access';
import type { RouteDoc } from './define-route';

const jsonSchema = (schema: z.ZodType) => {
  const { $schema: _drop, ...rest } = z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as Record<string, unknown>;
  return rest;
};

export function describeAccess(access: Access): string {
  switch (access.kind) {
    case 'public':
      return 'Anyone, signed in or not.';
    case 'signedIn':
      return 'Any signed-in person (session cookie or personal access token).';
    case 'admin':
      return 'Installation administrators.';
    case 'worker':
      return 'Scan workers only, with a worker token (`Authorization: Bearer rwwkr_…`, made by an administrator); no person, cookie or personal token.';
    case 'campaign': {
      const roles = access.roles.join(', ');
      const adminNote = access.roles.includes('observer') ? ' Administrators may view.' : '';
      return `Members of the campaign with the role: ${roles}.${adminNote}`;
    }
  }
}

/** The OpenAPI 3.1 document of the API, generated from the routes' own zod schemas. */
export function buildOpenApi(docs: readonly RouteDoc[], version: string) {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const d of docs) {
    const path = `/api${d.path.replace(/:([A-Za-z]+)/g, '{$1}')}`;
    const pathParams = [...d.path.matchAll(/:([A-Za-z]+)/g)].map((m) => ({ name: m[1], in: 'path', required: true, schema: { type: 'string' } }));
    const queryShape = d.query && 'shape' in d.query ? (d.query as z.ZodObject).shape : {};
    const queryParams = Object.entries(queryShape).map(([name, schema]) => ({
      name,
      in: 'query',
      required: !(schema as z.ZodType).safeParse(undefined).success,
      schema: jsonSchema(schema as z.ZodType),
    }));
    const tag = d.path.split('/')[1] ?? 'api';
    const operation: Record<string, unknown> = {
      tags: [tag],
      summary: `${d.method.toUpperCase()} ${path}`,
      description: `Who may call it: ${describeAccess(d.access)}`,
      parameters: [...pathParams, ...queryParams],
      responses: {
        [String(d.status)]: d.response
          ? { description: 'Success', content: { 'application/json': { schema: jsonSchema(d.response) } } }
          : { description: 'Success' },
        ...Object.fromEntries(
          (d.alsoAnswers ?? []).map((a) => [String(a.status), { description: a.description, ...(d.response ? { content: { 'application/json': { schema: jsonSchema(d.response) } } } : {}) }]),
        ),
        default: { description: 'An error, as one sentence and a stable code', content: { 'application/json': { schema: jsonSchema(errorResponseSchema) } } },
      },
      ...(d.access.kind === 'public' ? { security: [] } : {}),
    };
    if (d.body) operation.requestBody = { required: true, content: { 'application/json': { schema: jsonSchema(d.body) } } };
    (paths[path] ??= {})[d.method] = operation;
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Redward API',
      version,
      description:
        'Campaigns, spectra, scans, readings and confirmed redshifts. Browsers use the session cookie; scripts send a personal access token as `Authorization: Bearer rwpat_…` (create one on the account page). Wavelengths are vacuum Å.',
    },
    servers: [{ url: '/' }],
    components: {
      securitySchemes: {
        session: { type: 'apiKey', in: 'cookie', name: 'redward_session' },
        token: { type: 'http', scheme: 'bearer' },
      },
    },
    security: [{ session: [] }, { token: [] }],
    paths,
  };
}
