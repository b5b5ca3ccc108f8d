import { and, asc, eq, inArray } from 'drizzle-orm';
import type { Disagreement, SettleRequest } from '../contracts/release';
import { campaigns, confirmedRedshifts, disagreements, readings, spectra, targets, users } from '../db/schema';
import { badRequest, conflict, notFound } from '../http/errors';
import type { Actor, ServiceContext } from './context';
import { recordAudit } from './record-audit';
import { toReadingView } from './submit-reading';

export function disagreementCampaignId(ctx: ServiceContext, id: number): number {
  const row = Number.isSafeInteger(id) ? ctx.db.select({ campaignId: disagreements.campaignId }).from(disagreements).where(eq(disagreements.id, id)).get() : undefined;
  if (!row) throw notFound('No such disagreement.', 'disagreement_not_found');
  return row.campaignId;
}

/** Open disagreements of a campaign with both readings side by side (leads only: it unblinds). */
export function listOpenDisagreements(ctx: ServiceContext, campaignId: number): Disagreement[] {
  const rows = ctx.db
    .select({ d: disagreements, fileName: spectra.fileName, targetId: targets.id, catalogueId: targets.catalogueId, imageFamily: targets.imageFamily })
    .from(disagreements)
    .innerJoin(spectra, eq(spectra.id, disagreements.spectrumId))
    .leftJoin(targets, eq(targets.id, spectra.targetId))
    .where(and(eq(disagreements.campaignId, campaignId), eq(disagreements.state, 'open')))
    .orderBy(asc(disagreements.openedAt))
    .all();
  const ids = rows.flatMap((r) => [r.d.firstReadingId, r.d.secondReadingId]);
  const readingRows = ids.length
    ? ctx.db.select({ reading: readings, name: users.name }).from(readings).innerJoin(users, eq(users.id, readings.readerId)).where(inArray(readings.id, ids)).all()
    : [];
  const byId = new Map(readingRows.map((r) => [r.reading.id, toReadingView(r.reading, r.name)]));
  return rows.map((r) => ({
    id: r.d.id,
    spectrumId: r.d.spectrumId,
    fileName: r.fileName,
    target: r.targetId !== null && r.catalogueId !== null ? { id: r.targetId, catalogueId: r.catalogueId, imageFamily: r.imageFamily } : null,
    reasons: r.d.reasons as Disagreement['reasons'],
    readings: [byId.get(r.d.firstReadingId)!, byId.get(r.d.secondReadingId)!],
    openedAt: r.d.openedAt,
  }));
}

/**
 * The lead's settlement: the confirmed redshift is one reading's value or a value the lead
 * enters, always with the reason; both readings are locked and the disagreement closed.
 */
export function settleDisagreement(ctx: ServiceContext, actor: Actor, disagreementId: number, input: SettleRequest): { confirmedId: number } {
  return ctx.db.transaction((tx) => {
    const d = tx.select().from(disagreements).where(eq(disagreements.id, disagreementId)).get()!;
    if (d.state !== 'open') throw conflict('This disagreement has already been settled.', 'disagreement_closed');
    const campaign = tx.select().from(campaigns).where(eq(campaigns.id, d.campaignId)).get()!;
    let value: { z: number; zErr: number | null; grade: number; spectrumClass: (typeof confirmedRedshifts.$inferInsert)['spectrumClass']; lines: string[] };
    if (input.choice === 'new') {
      if (!campaign.gradeScheme.some((g) => g.code === input.grade)) throw badRequest(`Grade ${input.grade} is not in this campaign's scheme.`, 'unknown_grade');
      value = { z: input.z, zErr: input.zErr ?? null, grade: input.grade, spectrumClass: input.class, lines: input.lines ?? [] };
    } else {
      const chosen = tx.select().from(readings).where(eq(readings.id, input.choice === 'first' ? d.firstReadingId : d.secondReadingId)).get()!;
      value = { z: chosen.z, zErr: chosen.zErr, grade: chosen.grade, spectrumClass: chosen.spectrumClass, lines: chosen.lines };
    }
    const now = ctx.now().toISOString();
    const confirmed = tx
      .insert(confirmedRedshifts)
      .values({ spectrumId: d.spectrumId, ...value, method: 'settlement', firstReadingId: d.firstReadingId, secondReadingId: d.secondReadingId, decidedBy: actor.id, reason: input.reason, createdAt: now })
      .returning({ id: confirmedRedshifts.id })
      .get();
    tx.update(readings).set({ lockedAt: now }).where(inArray(readings.id, [d.firstReadingId, d.secondReadingId])).run();
    tx.update(disagreements).set({ state: 'settled', confirmedId: confirmed.id, closedAt: now }).where(eq(disagreements.id, d.id)).run();
    recordAudit(tx, {
      actorId: actor.id,
      action: 'disagreement.settled',
      subjectType: 'confirmed_redshift',
      subjectId: confirmed.id,
      campaignId: d.campaignId,
      after: { ...value, choice: input.choice, reason: input.reason, disagreementId: d.id },
    });
    return { confirmedId: confirmed.id };
  });
}
