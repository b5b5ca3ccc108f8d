import { readFileSync, rmSync } from 'node:fs';
import { Router } from 'express';
import { z } from 'zod';
import { catalogueImportResultSchema, columnMappingSchema, targetListSchema, targetPhotometrySchema, targetsQuerySchema } from '../contracts/targets';
import { access } from '../http/access';
import { defineRoute } from '../http/define-route';
import { AppError, badRequest } from '../http/errors';
import { receiveFiles } from '../http/receive-files';
import type { ServiceContext } from '../services/context';
import { importCatalogue } from '../services/import-catalogue';
import { listTargets } from '../services/list-targets';
import { getTargetPhotometry } from '../services/target-photometry';
import { validationError } from '../http/validation-error';

const MAX_CATALOGUE_BYTES = 50 * 1024 * 1024;
const importQuerySchema = z.object({ dryRun: z.enum(['0', '1', 'true', 'false']).optional() });

export function targetRoutes(ctx: ServiceContext): Router {
  const router = Router();

  // multipart: `files` = the catalogue (CSV/TSV), optional `mapping` = JSON of column names.
  defineRoute(ctx, router, {
    method: 'post',
    path: '/campaigns/:id/targets',
    access: access.campaign('lead'),
    query: importQuerySchema,
    response: catalogueImportResultSchema,
    alsoAnswers: [{ status: 202, description: 'Targets and photometry stored; with more than PHOTOZ_JOB_THRESHOLD rows with photometry the photo-z fit runs as a job, whose id is photoZJobId' }],
    handle: async ({ req, res, user, campaign, query }) => {
      const files = await receiveFiles(req, res, ctx.store, { ...ctx.config.uploads, maxFiles: 1, maxFileBytes: MAX_CATALOGUE_BYTES });
      try {
        if (files.length !== 1) throw badRequest('Send the catalogue as one file in the multipart field "files".', 'no_files');
        const rawMapping = (req.body as { mapping?: string }).mapping;
        let mapping;
        if (rawMapping) {
          let json: unknown;
          try {
            json = JSON.parse(rawMapping);
          } catch {
            throw badRequest('The mapping field is not valid JSON.', 'malformed_json');
          }
          const parsed = columnMappingSchema.safeParse(json);
          if (!parsed.success) throw validationError(parsed.error, 'body');
          mapping = parsed.data;
        }
        const text = readFileSync(files[0]!.tempFile, 'utf8');
        const dryRun = query.dryRun === '1' || query.dryRun === 'true';
        const result = importCatalogue(ctx, user!, campaign!.id, text, mapping, dryRun);
        if (!dryRun && result.errors.length > 0) {
          const n = result.errors.length;
          throw new AppError(400, 'catalogue_invalid', `${n} problem${n === 1 ? '' : 's'} in the catalogue (first on line ${result.errors[0]!.line}: ${result.errors[0]!.message}); nothing was imported.`, {}, result);
        }
        // Targets and photometry are stored; the photo-z fit runs as a job: 202 with its id.
        if (result.photoZJobId !== null) {
          res.status(202).json(catalogueImportResultSchema.parse(result));
          return undefined;
        }
        return result;
      } finally {
        for (const f of files) rmSync(f.tempFile, { force: true });
      }
    },
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/campaigns/:id/targets',
    access: access.campaignViewer,
    query: targetsQuerySchema,
    response: targetListSchema,
    handle: ({ campaign, query }) => ({ targets: listTargets(ctx, campaign!.id, query.q) }),
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/campaigns/:id/targets/:targetId/photometry',
    access: access.campaignViewer,
    response: targetPhotometrySchema,
    handle: ({ req, campaign }) => {
      const targetId = Number(req.params.targetId);
      if (!Number.isSafeInteger(targetId) || targetId <= 0) throw badRequest('The target id must be a positive whole number.', 'invalid_target_id');
      return getTargetPhotometry(ctx, campaign!.id, targetId);
    },
  });

  return router;
}
