import { and, eq, inArray } from 'drizzle-orm';
import { campaigns, confirmedRedshifts, disagreements, readings, spectra } from '../db/schema';
import { combineReadings, compareReadings } from '../release/compare-readings';
import { atLeastFloor, mergeLineEvidence } from '../release/merge-line-evidence';
import type { ServiceContext } from './context';
import { recordAudit } from './record-audit';

type Tx = Parameters<Parameters<ServiceContext['db']['transaction']>[0]>[0];

export type AgreementOutcome =
  | { kind: 'waiting' }
  | { kind: 'confirmed'; confirmedId: number }
  | { kind: 'disagreement'; disagreementId: number; opened: boolean }
  | { kind: 'already-confirmed' };

/**
 * Runs when a reading is saved: once both the first and the second reading are in, compares
 * them. Agreement creates the confirmed redshift (and closes a disagreement a revision has
 * resolved); otherwise a disagreement is opened, or the open one is updated.
 */
export function checkAgreement(ctx: ServiceContext, tx: Tx, spectrumId: number, actorId: number): AgreementOutcome {
  const current = tx.select({ id: confirmedRedshifts.id }).from(confirmedRedshifts).where(and(eq(confirmedRedshifts.spectrumId, spectrumId), eq(confirmedRedshifts.isCurrent, true))).get();
  if (current) return { kind: 'already-confirmed' };
  const pair = tx.select().from(readings).where(and(eq(readings.spectrumId, spectrumId), inArray(readings.readingOrder, ['first', 'second']))).all();
  const first = pair.find((r) => r.readingOrder === 'first');
  const second = pair.find((r) => r.readingOrder === 'second');
  if (!first || !second) return { kind: 'waiting' };

  const spectrum = tx.select({ campaignId: spectra.campaignId }).from(spectra).where(eq(spectra.id, spectrumId)).get()!;
  const campaign = tx.select().from(campaigns).where(eq(campaigns.id, spectrum.campaignId)).get()!;
  const verdict = compareReadings(first, second, campaign.gradeScheme, campaign.tolerance);
  const open = tx.select().from(disagreements).where(and(eq(disagreements.spectrumId, spectrumId), eq(disagreements.state, 'open'))).get();
  const now = ctx.now().toISOString();

  if (verdict.agree) {
    const combined = combineReadings(first, second, campaign.gradeScheme);
    const lineMeasurements = mergeLineEvidence(combined.lines, first.lineMeasurements, second.lineMeasurements);
    const value = { ...combined, zErr: atLeastFloor(combined.zErr, lineMeasurements) };
    const confirmed = tx
      .insert(confirmedRedshifts)
      .values({ spectrumId, z: value.z, zErr: value.zErr, grade: value.grade, spectrumClass: first.spectrumClass, lines: value.lines, lineMeasurements, method: 'agreement', firstReadingId: first.id, secondReadingId: second.id, createdAt: now })
      .returning({ id: confirmedRedshifts.id })
      .get();
    tx.update(readings).set({ lockedAt: now }).where(inArray(readings.id, [first.id, second.id])).run();
    if (open) tx.update(disagreements).set({ state: 'agreed-on-revision', confirmedId: confirmed.id, closedAt: now }).where(eq(disagreements.id, open.id)).run();
    recordAudit(tx, {
      actorId,
      action: 'confirmed.by_agreement',
      subjectType: 'confirmed_redshift',
      subjectId: confirmed.id,
      campaignId: campaign.id,
      after: { ...value, dzOver1pz: verdict.dzOver1pz, gradeSteps: verdict.gradeSteps, readings: [first.id, second.id] },
    });
    return { kind: 'confirmed', confirmedId: confirmed.id };
  }

  if (open) {
    tx.update(disagreements).set({ reasons: verdict.reasons }).where(eq(disagreements.id, open.id)).run();
    return { kind: 'disagreement', disagreementId: open.id, opened: false };
  }
  const opened = tx
    .insert(disagreements)
    .values({ spectrumId, campaignId: campaign.id, firstReadingId: first.id, secondReadingId: second.id, reasons: verdict.reasons, openedAt: now })
    .returning({ id: disagreements.id })
    .get();
  recordAudit(tx, {
    actorId,
    action: 'disagreement.opened',
    subjectType: 'disagreement',
    subjectId: opened.id,
    campaignId: campaign.id,
    after: { reasons: verdict.reasons, dzOver1pz: verdict.dzOver1pz, gradeSteps: verdict.gradeSteps, readings: [first.id, second.id] },
  });
  return { kind: 'disagreement', disagreementId: opened.id, opened: true };
}
