import { readFileSync, rmSync } from 'node:fs';
import { Router } from 'express';
import { filterInfoSchema, filterListSchema, filterNameSchema } from '../contracts/targets';
import { access } from '../http/access';
import { defineRoute } from '../http/define-route';
import { badRequest } from '../http/errors';
import { receiveFiles } from '../http/receive-files';
import type { ServiceContext } from '../services/context';
import { addCampaignFilter, listFilters } from '../services/photo-z-filters';

/** A filter curve is a few thousand lines at most; 2 MB leaves room for fine sampling. */
const MAX_CURVE_BYTES = 2 * 1024 * 1024;

export function filterRoutes(ctx: ServiceContext): Router {
  const router = Router();

  defineRoute(ctx, router, {
    method: 'get',
    path: '/campaigns/:id/filters',
    access: access.campaignViewer,
    response: filterListSchema,
    handle: ({ campaign }) => ({ filters: listFilters(ctx, campaign!.id) }),
  });

  // multipart: `files` = the curve (two columns: Å, transmission), `name` = the filter's name.
  defineRoute(ctx, router, {
    method: 'post',
    path: '/campaigns/:id/filters',
    access: access.campaign('lead'),
    status: 201,
    response: filterInfoSchema,
    handle: async ({ req, res, user, campaign }) => {
      const files = await receiveFiles(req, res, ctx.store, { ...ctx.config.uploads, maxFiles: 1, maxFileBytes: MAX_CURVE_BYTES });
      try {
        if (files.length !== 1) throw badRequest('Send the filter curve as one file in the multipart field "files".', 'no_files');
        const name = filterNameSchema.safeParse((req.body as { name?: string }).name ?? '');
        if (!name.success) throw badRequest(name.error.issues[0]!.message, 'filter_name_invalid');
        const text = readFileSync(files[0]!.tempFile, 'utf8');
        return addCampaignFilter(ctx, user!, campaign!.id, name.data, text);
      } finally {
        for (const f of files) rmSync(f.tempFile, { force: true });
      }
    },
  });

  return router;
}
