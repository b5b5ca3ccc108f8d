import { Router } from 'express';
import { uploadReceiptSchema } from '../contracts/ingest';
import { access } from '../http/access';
import { defineRoute } from '../http/define-route';
import { receiveFiles } from '../http/receive-files';
import type { ServiceContext } from '../services/context';
import { receiveUpload } from '../services/receive-upload';

export function uploadRoutes(ctx: ServiceContext): Router {
  const router = Router();

  defineRoute(ctx, router, {
    method: 'post',
    path: '/campaigns/:id/uploads',
    access: access.campaign('lead'),
    status: 202,
    response: uploadReceiptSchema,
    // Files are read only after the role check: a reader's upload is refused unread.
    handle: async ({ req, res, user, campaign }) => {
      const files = await receiveFiles(req, res, ctx.store, ctx.config.uploads);
      const receipt = await receiveUpload(ctx, ctx.store, user!, campaign!.id, files);
      ctx.wakeJobRunner();
      return receipt;
    },
  });

  return router;
}
