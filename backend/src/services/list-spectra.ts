import { and, asc, count, desc, eq, isNotNull, isNull, or, sql, type SQL, type SQLWrapper } from 'drizzle-orm';
import type { CampaignRole } from '../contracts/campaigns';
import type { SpectraPage, spectraQuerySchema } from '../contracts/ingest';
import type { z } from 'zod';
import { preparedByShape } from '../db/prepared-by-shape';
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

/** What decides the SQL of a list request; everything else is a bound value. */
interface ListShape {
  search: boolean;
  byClass: boolean;
  linked: Query['linked'];
  sort: Query['sort'];
  dir: Query['dir'];
  ownReadingsOnly: boolean;
}

/**
 * User text for a LIKE pattern: `%`, `_` and the escape character itself stand for themselves
 * (`escape '\'` in the statement), so a search for "50%" does not match every name with a 50.
 */
export function likeContaining(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

const containsSearch = (column: SQLWrapper) => sql`${column} like ${sql.placeholder('pattern')} escape '\\'`;

function filtersOf(shape: ListShape): SQL {
  const filters: SQL[] = [eq(spectra.campaignId, sql.placeholder('campaignId'))];
  if (shape.search) filters.push(or(containsSearch(spectra.fileName), containsSearch(targets.catalogueId), containsSearch(spectra.objectName))!);
  if (shape.byClass) filters.push(eq(scanResults.spectrumClass, sql.placeholder('class')));
  if (shape.linked === 'yes') filters.push(isNotNull(spectra.targetId));
  if (shape.linked === 'no') filters.push(isNull(spectra.targetId));
  return and(...filters)!;
}

// The list is asked on every visit of the spectra screen, and its statements took ≈ 8 ms of
// building and compiling a request (issue 13's load benchmark); the shapes are few (2 × 2 × 3 × 7
// sorts × 2 × 2), so each is prepared on first use and kept.
const statementsFor = preparedByShape(
  64,
  (s: ListShape) => `${+s.search}${+s.byClass}${s.linked ?? '-'}:${s.sort}:${s.dir}:${+s.ownReadingsOnly}`,
  (db, shape) => {
    const where = filtersOf(shape);
    const ownReadingsOnly = shape.ownReadingsOnly ? sql` and ${qualified(readings.readerId)} = ${sql.placeholder('viewerId')}` : sql``;
    const order = shape.dir === 'asc' ? asc : desc;
    const total = db
      .select({ n: count() })
      .from(spectra)
      .leftJoin(targets, eq(targets.id, spectra.targetId))
      .leftJoin(scanResults, and(eq(scanResults.spectrumId, spectra.id), eq(scanResults.isCurrent, true)))
      .where(where)
      .prepare();
    const page = db
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
      .leftJoin(scanResults, and(eq(scanResults.spectrumId, spectra.id), eq(scanResults.isCurrent, true)))
      .where(where)
      .orderBy(order(sortColumns[shape.sort]), asc(spectra.id))
      .limit(sql.placeholder('limit'))
      .offset(sql.placeholder('offset'))
      .prepare();
    return { total, page };
  },
);

/**
 * One page of a campaign's spectra, sorted and filtered in SQL so thousands stay quick.
 * `readingsDone` counts every saved reading for leads, observers and admins; for a reader it
 * counts only their own (0 or 1), since "2 of 2" would tell them the other reader has finished.
 */
export function listSpectra(ctx: ServiceContext, campaignId: number, query: Query, viewer: SpectraViewer): SpectraPage {
  const shape: ListShape = { search: !!query.q, byClass: !!query.class, linked: query.linked, sort: query.sort, dir: query.dir, ownReadingsOnly: viewer.role === 'reader' };
  const statements = statementsFor(ctx.db, shape);
  // Drizzle binds by name the placeholders a shape's statements use; the others are ignored.
  const values = {
    campaignId,
    pattern: query.q ? likeContaining(query.q) : null,
    class: query.class ?? null,
    viewerId: viewer.userId,
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  };
  const total = statements.total.get(values)!.n;
  const rows = statements.page.all(values);
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
