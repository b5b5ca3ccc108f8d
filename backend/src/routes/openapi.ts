import { Router } from 'express';
import { openApiDocumentSchema } from '../contracts/openapi';
import { access } from '../http/access';
import { defineRoute, routeDocs } from '../http/define-route';
import { buildOpenApi } from '../http/openapi';
import type { ServiceContext } from '../services/context';

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/** `/api/openapi.json` and a plain page that lists the same operations for people. */
export function openApiRoutes(ctx: ServiceContext): Router {
  const router = Router();
  const document = () => buildOpenApi(routeDocs.get(ctx) ?? [], ctx.config.version);

  defineRoute(ctx, router, {
    method: 'get',
    path: '/openapi.json',
    access: access.public,
    response: openApiDocumentSchema,
    handle: () => document(),
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/docs',
    access: access.public,
    handle: ({ res }) => {
      const doc = document();
      const rows = Object.entries(doc.paths).flatMap(([path, ops]) =>
        Object.entries(ops).map(([method, op]) => {
          const o = op as { description: string; requestBody?: { content: { 'application/json': { schema: unknown } } } };
          const body = o.requestBody ? `<details><summary>Request body</summary><pre>${escapeHtml(JSON.stringify(o.requestBody.content['application/json'].schema, null, 2))}</pre></details>` : '';
          return `<tr><td><code>${method.toUpperCase()}</code></td><td><code>${escapeHtml(path)}</code></td><td>${escapeHtml(o.description.replace('Who may call it: ', ''))}${body}</td></tr>`;
        }),
      );
      res.type('html').send(`<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Redward API ${escapeHtml(doc.info.version)}</title>
<style>body{font:15px/1.5 system-ui,sans-serif;margin:2rem auto;max-width:70rem;padding:0 1rem;color:#1b2230}table{border-collapse:collapse;width:100%}td,th{border-bottom:1px solid #ddd;padding:.4rem;text-align:left;vertical-align:top}code,pre{font-family:ui-monospace,monospace;font-size:13px}pre{background:#f6f3ec;padding:.5rem;overflow:auto}</style></head>
<body><h1>Redward API ${escapeHtml(doc.info.version)}</h1><p>${escapeHtml(doc.info.description)}</p><p>Machine-readable: <a href="/api/openapi.json">/api/openapi.json</a> (OpenAPI 3.1).</p>
<table><thead><tr><th>Method</th><th>Path</th><th>Who may call it</th></tr></thead><tbody>${rows.join('')}</tbody></table></body></html>`);
      return undefined;
    },
  });

  return router;
}
