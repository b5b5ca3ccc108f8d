import { and, asc, eq, inArray } from 'drizzle-orm';
import type { Disagreement, SettleDecision } from '../contracts/release';
import { campaigns, confirmedRedshifts, disagreements, memberships, readings, spectra, targets, users } from '../db/schema';
import type { CampaignRole } from '../contracts/campaigns';
import { badRequest, conflict, forbidden, notFound } from '../http/errors';
import type { Actor, ServiceContext } from './context';
import { recordAudit } from './record-audit';
import { toReadingView } from './submit-reading';
import { lineEvidence } from './line-evidence';
import type { StoredLineMeasurements } from '../contracts/line-measurements';

export function disagreementCampaignId(ctx: ServiceContext, id: number): number {
  const row = Number.isSafeInteger(id) ? ctx.db.select({ campaignId: disagreements.campaignId }).from(disagreements).where(eq(disagreements.id, id)).get() : undefined;
  if (!row) throw notFound('No such disagreement.', 'disagreement_not_found');
  return row.campaignId;
}

/**
 * Open disagreements of a campaign with both readings side by side. Leads see all of them;
 * a third reader sees only those delegated to them (seeing both readings is their task).
 */
export function listOpenDisagreements(ctx: ServiceContext, campaignId: number, delegatedTo?: number): Disagreement[] {
  const rows = ctx.db
    .select({ d: disagreements, fileName: spectra.fileName, targetId: targets.id, catalogueId: targets.catalogueId, imageFamily: targets.imageFamily })
    .from(disagreements)
    .innerJoin(spectra, eq(spectra.id, disagreements.spectrumId))
    .leftJoin(targets, eq(targets.id, spectra.targetId))
    .where(and(eq(disagreements.campaignId, campaignId), eq(disagreements.state, 'open'), delegatedTo === undefined ? undefined : eq(disagreements.delegatedTo, delegatedTo)))
    .orderBy(asc(disagreements.openedAt))
    .all();
  const delegateIds = rows.map((r) => r.d.delegatedTo).filter((id): id is number => id !== null);
  const delegateNames = new Map(delegateIds.length ? ctx.db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, delegateIds)).all().map((u) => [u.id, u.name]) : []);
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
    delegatedTo: r.d.delegatedTo === null ? null : { id: r.d.delegatedTo, name: delegateNames.get(r.d.delegatedTo) ?? '' },
    openedAt: r.d.openedAt,
  }));
}

/**
 * The lead's settlement: the confirmed redshift is one reading's value or a value the lead
 * enters, always with the reason; both readings are locked and the disagreement closed.
 */
export function settleDisagreement(ctx: ServiceContext, actor: Actor, role: CampaignRole | null, disagreementId: number, input: SettleDecision): { confirmedId: number } {
  return ctx.db.transaction((tx) => {
    const d = tx.select().from(disagreements).where(eq(disagreements.id, disagreementId)).get()!;
    if (role !== 'lead' && d.delegatedTo !== actor.id) throw forbidden('Only a lead, or the third reader the lead chose, can settle this disagreement.');
    if (d.state !== 'open') throw conflict('This disagreement has already been settled.', 'disagreement_closed');
    const campaign = tx.select().from(campaigns).where(eq(campaigns.id, d.campaignId)).get()!;
    let lineMeasurements: StoredLineMeasurements | null;
    let value: { z: number; zErr: number | null; grade: string; spectrumClass: (typeof confirmedRedshifts.$inferInsert)['spectrumClass']; lines: string[] };
    if (input.choice === 'new') {
      if (!campaign.gradeScheme.some((g) => g.code === input.grade)) throw badRequest(`Grade ${input.grade} is not in this campaign's scheme.`, 'unknown_grade');
      const entered = { z: input.z, zErr: input.zErr ?? null, grade: input.grade, spectrumClass: input.class, lines: input.lines ?? [] };
      const evidence = lineEvidence(ctx, d.spectrumId, entered);
      value = { ...entered, zErr: evidence.zErr };
      lineMeasurements = evidence.lineMeasurements;
    } else {
      const chosen = tx.select().from(readings).where(eq(readings.id, input.choice === 'first' ? d.firstReadingId : d.secondReadingId)).get()!;
      value = { z: chosen.z, zErr: chosen.zErr, grade: chosen.grade, spectrumClass: chosen.spectrumClass, lines: chosen.lines };
      lineMeasurements = chosen.lineMeasurements ?? null;
    }
    const now = ctx.now().toISOString();
    const confirmed = tx
      .insert(confirmedRedshifts)
      .values({ spectrumId: d.spectrumId, ...value, lineMeasurements, method: 'settlement', firstReadingId: d.firstReadingId, secondReadingId: d.secondReadingId, decidedBy: actor.id, reason: input.reason, createdAt: now })
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

/**
 * Hands a disagreement to a third reader to settle: someone of the campaign who made neither
 * reading. They are e-mailed; the lead can still settle it themselves.
 */
export async function delegateDisagreement(ctx: ServiceContext, actor: Actor, disagreementId: number, readerId: number, appUrl: string) {
  const { campaignId, email, name } = ctx.db.transaction((tx) => {
    const d = tx.select().from(disagreements).where(eq(disagreements.id, disagreementId)).get()!;
    if (d.state !== 'open') throw conflict('This disagreement has already been settled.', 'disagreement_closed');
    const member = tx
      .select({ role: memberships.role, email: users.email, name: users.name })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.campaignId, d.campaignId), eq(memberships.userId, readerId)))
      .get();
    if (!member || member.role === 'observer') throw badRequest('The third reader must be a reader or lead of this campaign.', 'not_a_reader');
    const readerIds = tx.select({ readerId: readings.readerId }).from(readings).where(inArray(readings.id, [d.firstReadingId, d.secondReadingId])).all().map((r) => r.readerId);
    if (readerIds.includes(readerId)) throw badRequest('A third reader must be someone who made neither reading.', 'not_independent');
    tx.update(disagreements).set({ delegatedTo: readerId }).where(eq(disagreements.id, disagreementId)).run();
    recordAudit(tx, { actorId: actor.id, action: 'disagreement.delegated', subjectType: 'disagreement', subjectId: disagreementId, campaignId: d.campaignId, after: { delegatedTo: readerId } });
    return { campaignId: d.campaignId, email: member.email, name: member.name };
  });
  try {
    await ctx.mailer.send({
      to: email,
      subject: 'A disagreement for you to settle',
      text: `${actor.name} asks you to settle a disagreement between two readings as the third reader.\n\nOpen it here:\n${appUrl}/campaigns/${campaignId}/disagreements`,
    });
  } catch (err) {
    ctx.logger.warn({ err, disagreementId }, 'third-reader e-mail could not be sent');
  }
  return { disagreementId, delegatedTo: { id: readerId, name } };
}
