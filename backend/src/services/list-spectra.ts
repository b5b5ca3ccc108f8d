import { and, asc, count, desc, eq, isNotNull, isNull, like, or, sql, type SQL } from 'drizzle-orm';
import type { CampaignRole } from '../contracts/campaigns';
import type { SpectraPage, spectraQuerySchema } from '../contracts/ingest';
import type { z } from 'zod';
import { qualified } from '../db/qualified';
import { assignments, readings, scanResults, spectra, targets } from '../db/schema';
import type { ServiceContext } from './context';

type Query = z.output<typeof spectraQuerySchema>;

const sortColumns = {
  // "b.fits" sorts between "A.fits" and "C.fits", as a person reads a file list (NOCASE folds ASCII letters).
  fileName: sql`${spectra.fileName} collate nocase`,
  target: targets.catalogueId,
  instrument: spectra.instrument,
  snr: spectra.snrMedian,
  z: scanResults.zBest,
  class: scanResults.spectrumClass,
  createdAt: spectra.createdAt,
} as const;

/** Who asks: a reader's list must not say whether the other reading of a spectrum is in. */
export interface SpectraViewer {
  userId: number;
  role: CampaignRole | null;
}

/**
 * One page of a campaign's spectra, sorted and filtered in SQL so thousands stay quick.
 * `readingsDone` counts every saved reading for leads, observers and admins; for a reader it
 * counts only their own (0 or 1), since "2 of 2" would tell them the other reader has finished.
 */
export function listSpectra(ctx: ServiceContext, campaignId: number, query: Query, viewer: SpectraViewer): SpectraPage {
  const ownReadingsOnly = viewer.role === 'reader' ? sql` and ${qualified(readings.readerId)} = ${viewer.userId}` : sql``;
  const filters: SQL[] = [eq(spectra.campaignId, campaignId)];
  if (query.q) {
    const pattern = `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    filters.push(or(like(spectra.fileName, pattern), like(targets.catalogueId, pattern), like(spectra.objectName, pattern))!);
  }
  if (query.class) filters.push(eq(scanResults.spectrumClass, query.class));
  if (query.linked === 'yes') filters.push(isNotNull(spectra.targetId));
  if (query.linked === 'no') filters.push(isNull(spectra.targetId));
  const where = and(...filters);

  const base = () =>
    ctx.db
      .select({
        id: spectra.id,
        fileName: spectra.fileName,
        targetId: targets.id,
        catalogueId: targets.catalogueId,
        linkMethod: spectra.linkMethod,
        objectName: spectra.objectName,
        instrument: spectra.instrument,
        pixels: spectra.pixels,
        wavelengthMin: spectra.wavelengthMin,
        wavelengthMax: spectra.wavelengthMax,
        snrMedian: spectra.snrMedian,
        scanId: scanResults.id,
        zBest: scanResults.zBest,
        zBestErr: scanResults.zBestErr,
        spectrumClass: scanResults.spectrumClass,
        createdAt: spectra.createdAt,
        readingsAssigned: sql<number>`(select count(*) from ${assignments} where ${qualified(assignments.spectrumId)} = ${qualified(spectra.id)})`,
        readingsDone: sql<number>`(select count(*) from ${readings} where ${qualified(readings.spectrumId)} = ${qualified(spectra.id)}${ownReadingsOnly})`,
      })
      .from(spectra)
      .leftJoin(targets, eq(targets.id, spectra.targetId))
      .leftJoin(scanResults, and(eq(scanResults.spectrumId, spectra.id), eq(scanResults.isCurrent, true)));

  const total = ctx.db
    .select({ n: count() })
    .from(spectra)
    .leftJoin(targets, eq(targets.id, spectra.targetId))
    .leftJoin(scanResults, and(eq(scanResults.spectrumId, spectra.id), eq(scanResults.isCurrent, true)))
    .where(where)
    .get()!.n;
  const order = query.dir === 'asc' ? asc : desc;
  const rows = base()
    .where(where)
    .orderBy(order(sortColumns[query.sort]), asc(spectra.id))
    .limit(query.pageSize)
    .offset((query.page - 1) * query.pageSize)
    .all();
  return {
    total,
    page: query.page,
    pageSize: query.pageSize,
    rows: rows.map((r) => ({
      id: r.id,
      fileName: r.fileName,
      target: r.targetId !== null && r.catalogueId !== null ? { id: r.targetId, catalogueId: r.catalogueId } : null,
      linkMethod: r.linkMethod,
      objectName: r.objectName,
      instrument: r.instrument,
      pixels: r.pixels,
      wavelengthMin: r.wavelengthMin,
      wavelengthMax: r.wavelengthMax,
      snrMedian: r.snrMedian,
      scanState: r.scanId === null ? 'not scanned' : 'scanned',
      zBest: r.zBest,
      zBestErr: r.zBestErr,
      spectrumClass: r.spectrumClass,
      createdAt: r.createdAt,
      readingsAssigned: r.readingsAssigned,
      readingsDone: r.readingsDone,
    })),
  };
}
