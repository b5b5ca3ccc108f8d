import { Router } from 'express';
import { z } from 'zod';
import { campaignStatisticsSchema, confirmedPageSchema, confirmedQuerySchema, familiesResponseSchema } from '../contracts/release';
import { familyTable, familyTableCsv, toCsv, toEcsv, toFitsTable, toVotable } from '../exports';
import { access } from '../http/access';
import { defineRoute } from '../http/define-route';
import { confirmedRows, EXPORT_COSMOLOGY, exportAssumptions, spectrumStates, unconfirmedFamilyMembers } from '../services/confirmed-table';
import { campaignStatistics } from '../services/campaign-statistics';
import type { ServiceContext } from '../services/context';

const FILES = {
  csv: { type: 'text/csv; charset=utf-8', ext: 'csv', write: toCsv },
  ecsv: { type: 'text/plain; charset=utf-8', ext: 'ecsv', write: toEcsv },
  votable: { type: 'application/x-votable+xml; charset=utf-8', ext: 'vot', write: toVotable },
  fits: { type: 'application/fits', ext: 'fits', write: toFitsTable },
} as const;

const slug = (name: string) => name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'campaign';

export function confirmedRoutes(ctx: ServiceContext): Router {
  const router = Router();

  // Observers may read and export the confirmed table: releasing it to collaborators is its purpose.
  defineRoute(ctx, router, {
    method: 'get',
    path: '/campaigns/:id/confirmed',
    access: access.campaignViewer,
    query: confirmedQuerySchema,
    // The JSON page (format=json); the other formats are files.
    response: confirmedPageSchema,
    handle: ({ res, campaign, query }) => {
      const id = campaign!.id;
      if (query.format === 'json') {
        const { rows, total } = confirmedRows(ctx, id, query, { limit: query.pageSize, offset: (query.page - 1) * query.pageSize });
        const a = exportAssumptions(ctx, id);
        return { rows, total, page: query.page, pageSize: query.pageSize, states: spectrumStates(ctx, id), assumptions: { wavelengths: a.wavelengths, cosmology: EXPORT_COSMOLOGY, tolerance: a.tolerance } };
      }
      const assumptions = exportAssumptions(ctx, id);
      const { rows } = confirmedRows(ctx, id, query);
      const file = FILES[query.format];
      const body = file.write(rows, assumptions);
      const stamp = assumptions.exportedAt.slice(0, 10);
      res
        .type(file.type)
        .set('Content-Disposition', `attachment; filename="${slug(assumptions.campaign)}-confirmed-${stamp}.${file.ext}"`)
        .send(typeof body === 'string' ? body : Buffer.from(body.buffer, body.byteOffset, body.byteLength));
      return undefined;
    },
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/campaigns/:id/families',
    access: access.campaignViewer,
    query: z.object({ format: z.enum(['json', 'csv']).default('json') }),
    // format=json; csv is a file.
    response: familiesResponseSchema,
    handle: ({ res, campaign, query }) => {
      const id = campaign!.id;
      const { rows } = confirmedRows(ctx, id, {});
      const assumptions = exportAssumptions(ctx, id);
      const families = familyTable(rows, assumptions.tolerance, unconfirmedFamilyMembers(ctx, id));
      if (query.format === 'json') return { families, tolerance: assumptions.tolerance };
      res
        .type('text/csv; charset=utf-8')
        .set('Content-Disposition', `attachment; filename="${slug(assumptions.campaign)}-families-${assumptions.exportedAt.slice(0, 10)}.csv"`)
        .send(familyTableCsv(families, assumptions));
      return undefined;
    },
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/campaigns/:id/statistics',
    access: access.campaignViewer,
    response: campaignStatisticsSchema,
    handle: ({ campaign }) => campaignStatistics(ctx, campaign!.id),
  });

  return router;
}
