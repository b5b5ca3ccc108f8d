import { and, asc, eq } from 'drizzle-orm';
import type { ConfirmedRedshift, CorrectionDecision } from '../contracts/release';
import { campaigns, confirmedRedshifts, spectra, users } from '../db/schema';
import { badRequest, conflict } from '../http/errors';
import type { Actor, ServiceContext } from './context';
import { recordAudit } from './record-audit';
import { lineEvidence } from './line-evidence';

/**
 * Corrects a released redshift without touching it: the current record is marked superseded
 * and a new record, pointing back to it, becomes current. Both stay in the database.
 */
export function correctConfirmed(ctx: ServiceContext, actor: Actor, spectrumId: number, input: CorrectionDecision): { confirmedId: number } {
  return ctx.db.transaction((tx) => {
    const current = tx.select().from(confirmedRedshifts).where(and(eq(confirmedRedshifts.spectrumId, spectrumId), eq(confirmedRedshifts.isCurrent, true))).get();
    if (!current) throw conflict('This spectrum has no confirmed redshift to correct yet; settle or confirm it first.', 'not_confirmed');
    const spectrum = tx.select({ campaignId: spectra.campaignId }).from(spectra).where(eq(spectra.id, spectrumId)).get()!;
    const campaign = tx.select().from(campaigns).where(eq(campaigns.id, spectrum.campaignId)).get()!;
    if (!campaign.gradeScheme.some((g) => g.code === input.grade)) throw badRequest(`Grade ${input.grade} is not in this campaign's scheme.`, 'unknown_grade');
    const evidence = lineEvidence(ctx, spectrumId, { z: input.z, zErr: input.zErr ?? null, spectrumClass: input.class, lines: input.lines ?? [] });
    const now = ctx.now().toISOString();
    tx.update(confirmedRedshifts).set({ isCurrent: false, supersededAt: now }).where(eq(confirmedRedshifts.id, current.id)).run();
    const next = tx
      .insert(confirmedRedshifts)
      .values({
        spectrumId,
        z: input.z,
        zErr: evidence.zErr,
        grade: input.grade,
        spectrumClass: input.class,
        lines: input.lines ?? [],
        lineMeasurements: evidence.lineMeasurements,
        method: 'correction',
        firstReadingId: current.firstReadingId,
        secondReadingId: current.secondReadingId,
        decidedBy: actor.id,
        reason: input.reason,
        supersedesId: current.id,
        createdAt: now,
      })
      .returning({ id: confirmedRedshifts.id })
      .get();
    recordAudit(tx, {
      actorId: actor.id,
      action: 'confirmed.corrected',
      subjectType: 'confirmed_redshift',
      subjectId: next.id,
      campaignId: spectrum.campaignId,
      before: { id: current.id, z: current.z, zErr: current.zErr, grade: current.grade, class: current.spectrumClass },
      after: { id: next.id, z: input.z, zErr: evidence.zErr, grade: input.grade, class: input.class, reason: input.reason },
    });
    return { confirmedId: next.id };
  });
}

/** Every confirmed record of a spectrum, oldest first: the history of its released value. */
export function confirmedHistory(ctx: ServiceContext, spectrumId: number): ConfirmedRedshift[] {
  return ctx.db
    .select({ c: confirmedRedshifts, decidedBy: users.name })
    .from(confirmedRedshifts)
    .leftJoin(users, eq(users.id, confirmedRedshifts.decidedBy))
    .where(eq(confirmedRedshifts.spectrumId, spectrumId))
    .orderBy(asc(confirmedRedshifts.id))
    .all()
    .map(({ c, decidedBy }) => ({
      id: c.id,
      spectrumId: c.spectrumId,
      z: c.z,
      zErr: c.zErr,
      grade: c.grade,
      class: c.spectrumClass,
      lines: c.lines,
      method: c.method,
      reason: c.reason,
      decidedBy,
      supersedesId: c.supersedesId,
      isCurrent: c.isCurrent,
      createdAt: c.createdAt,
    }));
}
