import { and, asc, eq, isNull, sql } from 'drizzle-orm';
import type { QueueItem } from '../contracts/readings';
import { assignments, readings, scanResults, spectra, targets } from '../db/schema';
import type { Actor, ServiceContext } from './context';

/**
 * The reader's assigned spectra in a campaign that they have not read yet, in reading order:
 * first readings before second, then by target priority (1 = most wanted), target id, file name.
 */
export function readingQueue(ctx: ServiceContext, actor: Actor, campaignId: number): QueueItem[] {
  return ctx.db
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
    .leftJoin(readings, and(eq(readings.spectrumId, spectra.id), eq(readings.readerId, actor.id)))
    .where(and(eq(assignments.readerId, actor.id), eq(spectra.campaignId, campaignId), isNull(readings.id)))
    .orderBy(asc(assignments.readingOrder), sql`coalesce(${targets.priority}, 99)`, asc(targets.catalogueId), asc(spectra.fileName), asc(spectra.id))
    .all()
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
