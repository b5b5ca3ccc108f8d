import { and, asc, eq, isNull, sql } from 'drizzle-orm';
import type { QueueItem } from '../contracts/readings';
import { preparedQuery } from '../db/prepared';
import { assignments, readings, scanResults, spectra, targets } from '../db/schema';
import type { Actor, ServiceContext } from './context';

/**
 * The reader's assigned spectra in a campaign that they have not read yet, in reading order:
 * first readings before second, then by target priority (1 = most wanted), target id, file name.
 */
// Asked by every reader's screen on each spectrum they finish: prepared once (issue 13's load
// benchmark; building and compiling it cost ≈ 0.4 ms a request).
const queueRows = preparedQuery((db) =>
  db
    .select({
      id: spectra.id,
      campaignId: spectra.campaignId,
      fileName: spectra.fileName,
      readingOrder: assignments.readingOrder,
      targetId: targets.id,
      catalogueId: targets.catalogueId,
      imageFamily: targets.imageFamily,
      priority: targets.priority,
      zBest: scanResults.zBest,
      spectrumClass: scanResults.spectrumClass,
    })
    .from(assignments)
    .innerJoin(spectra, eq(spectra.id, assignments.spectrumId))
    .leftJoin(targets, eq(targets.id, spectra.targetId))
    .leftJoin(scanResults, and(eq(scanResults.spectrumId, spectra.id), eq(scanResults.isCurrent, true)))
    .leftJoin(readings, and(eq(readings.spectrumId, spectra.id), eq(readings.readerId, sql.placeholder('readerId'))))
    .where(and(eq(assignments.readerId, sql.placeholder('readerId')), eq(spectra.campaignId, sql.placeholder('campaignId')), isNull(readings.id)))
    .orderBy(asc(assignments.readingOrder), sql`coalesce(${targets.priority}, 99)`, asc(targets.catalogueId), asc(spectra.fileName), asc(spectra.id))
    .prepare(),
);

export function readingQueue(ctx: ServiceContext, actor: Actor, campaignId: number): QueueItem[] {
  return queueRows(ctx.db)
    .all({ readerId: actor.id, campaignId })
    .map((r) => ({
      id: r.id,
      campaignId: r.campaignId,
      fileName: r.fileName,
      readingOrder: r.readingOrder,
      target: r.targetId !== null && r.catalogueId !== null ? { id: r.targetId, catalogueId: r.catalogueId, imageFamily: r.imageFamily, priority: r.priority } : null,
      zBest: r.zBest,
      spectrumClass: r.spectrumClass,
    }));
}
