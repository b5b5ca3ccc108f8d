import { Router, type Request } from 'express';
import { createWorkerTokenSchema, createdWorkerTokenSchema, revokedWorkerTokenSchema, workerItemStateSchema, workerTokenListSchema } from '../contracts/workers';
import { access } from '../http/access';
import { defineRoute } from '../http/define-route';
import { AppError, badRequest } from '../http/errors';
import { decodeWorkerResult } from '../jobs/worker-result-body';
import type { ServiceContext } from '../services/context';
import { postWorkerResult, takeWorkerItem } from '../services/worker-items';
import { createWorkerToken, listWorkerTokens, revokeWorkerToken } from '../services/worker-tokens';

// A 4,000-pixel scan's result is ≈ 1 MB (mostly float32 χ² curves); 100,000-pixel spectra on a
// fine grid stay well inside this.
const MAX_RESULT_BYTES = 64 * 1024 * 1024;
const itemId = (req: Request) => Number(req.params.itemId);

/** Scan workers on other machines (JOB_QUEUE=redis://…): their tokens, and the two calls they make per item. */
export function workerRoutes(ctx: ServiceContext): Router {
  const router = Router();

  defineRoute(ctx, router, {
    method: 'get',
    path: '/admin/worker-tokens',
    access: access.admin,
    response: workerTokenListSchema,
    handle: () => ({ tokens: listWorkerTokens(ctx) }),
  });

  defineRoute(ctx, router, {
    method: 'post',
    path: '/admin/worker-tokens',
    access: access.admin,
    body: createWorkerTokenSchema,
    status: 201,
    response: createdWorkerTokenSchema,
    handle: ({ user, body }) => createWorkerToken(ctx, user!, body.name),
  });

  defineRoute(ctx, router, {
    method: 'delete',
    path: '/admin/worker-tokens/:tokenId',
    access: access.admin,
    response: revokedWorkerTokenSchema,
    handle: ({ req, user }) => ({ workerToken: revokeWorkerToken(ctx, user!, Number(req.params.tokenId)) }),
  });

  // The stored bytes of a pending item's file; 409 when the item needs no scan any more.
  defineRoute(ctx, router, {
    method: 'get',
    path: '/worker/items/:itemId/file',
    access: access.worker,
    handle: ({ req, res }) => {
      const { item, filePath } = takeWorkerItem(ctx, itemId(req));
      res.type('application/octet-stream').set({ 'Cache-Control': 'no-store', 'X-Content-Sha256': item.sha256 });
      return new Promise<void>((resolve, reject) => res.sendFile(filePath, (err) => (err && !res.headersSent ? reject(err) : resolve())));
    },
  });

  // What the scan found (worker-result-body.ts); idempotent by item.
  defineRoute(ctx, router, {
    method: 'post',
    path: '/worker/items/:itemId/result',
    access: access.worker,
    response: workerItemStateSchema,
    handle: async ({ req }) => {
      if (!req.is('application/octet-stream')) throw badRequest('Post the result as application/octet-stream (jobs/worker-result-body.ts).', 'result_malformed');
      // Read only now, after the worker token was checked: nobody else gets to make us buffer a body.
      const body = await readBody(req, MAX_RESULT_BYTES);
      return postWorkerResult(ctx, itemId(req), decodeWorkerResult(body));
    },
  });

  return router;
}

function readBody(req: Request, limit: number): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on('data', (chunk: Buffer) => {
      size += chunk.length;
      if (size > limit) {
        req.removeAllListeners('data');
        req.resume();
        reject(new AppError(413, 'result_too_large', `A result may be at most ${limit / 1024 / 1024} MB.`));
        return;
      }
      chunks.push(chunk);
    });
    req.once('end', () => resolve(Buffer.concat(chunks)));
    req.once('error', reject);
  });
}
