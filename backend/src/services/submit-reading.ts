import { and, eq } from 'drizzle-orm';
import type { Reading, SubmittedReading } from '../contracts/readings';
import { assignments, campaigns, readings, spectra, users } from '../db/schema';
import { badRequest, conflict, forbidden } from '../http/errors';
import { LINES } from '../spectra/lineList';
import type { Actor, ServiceContext } from './context';
import { checkAgreement, type AgreementOutcome } from './check-agreement';
import { recordAudit } from './record-audit';
import { lineEvidence } from './line-evidence';

const KNOWN_LINES = new Set(LINES.map((l) => l.name));

type ReadingRow = typeof readings.$inferSelect;

export function toReadingView(row: ReadingRow, readerName: string): Reading {
  return {
    id: row.id,
    spectrumId: row.spectrumId,
    reader: { id: row.readerId, name: readerName },
    readingOrder: row.readingOrder,
    z: row.z,
    zErr: row.zErr,
    grade: row.grade,
    class: row.spectrumClass,
    lines: row.lines,
    lineMeasurements: row.lineMeasurements ?? null,
    note: row.note,
    timeSpentMs: row.timeSpentMs,
    revision: row.revision,
    locked: row.lockedAt !== null,
    createdAt: row.createdAt,
    updatedAt: row.updatedAt,
  };
}

/**
 * Records or revises the reader's reading of a spectrum they are assigned to. Saving the same
 * values again changes nothing (a double submit is harmless); a different value is a new
 * revision whose before/after goes to the audit trail. A confirmed reading is locked.
 */
export function submitReading(
  ctx: ServiceContext,
  actor: Actor,
  spectrumId: number,
  input: Omit<SubmittedReading, 'lines'> & { lines: string[] },
): { reading: Reading; changed: boolean; outcome: AgreementOutcome } {
  return ctx.db.transaction((tx) => {
    const spectrum = tx.select({ campaignId: spectra.campaignId }).from(spectra).where(eq(spectra.id, spectrumId)).get()!;
    const assignment = tx
      .select()
      .from(assignments)
      .where(and(eq(assignments.spectrumId, spectrumId), eq(assignments.readerId, actor.id)))
      .get();
    if (!assignment) throw forbidden('You are not assigned to read this spectrum. Ask the campaign lead to assign it to you.', 'not_assigned');

    const campaign = tx.select().from(campaigns).where(eq(campaigns.id, spectrum.campaignId)).get()!;
    if (input.z < campaign.zMin - 0.01 || input.z > campaign.zMax) {
      throw badRequest(`z = ${input.z} lies outside this campaign's range ${campaign.zMin} ≤ z ≤ ${campaign.zMax}.`, 'z_out_of_range');
    }
    const grade = campaign.gradeScheme.find((g) => g.code === input.grade);
    if (!grade) {
      const codes = campaign.gradeScheme.map((g) => `${g.code} (${g.label})`).join(', ');
      throw badRequest(`Grade ${input.grade} is not in this campaign's scheme: ${codes}.`, 'unknown_grade');
    }
    const unknown = input.lines.filter((name) => !KNOWN_LINES.has(name));
    if (unknown.length > 0) throw badRequest(`Not in the line list: ${unknown.join(', ')}.`, 'unknown_line');

    const lines = [...new Set(input.lines)];
    // Measured here, from the stored file: what the reading records of its lines is the server's measurement.
    const evidence = lineEvidence(ctx, spectrumId, { z: input.z, zErr: input.zErr ?? null, spectrumClass: input.class, lines });
    const values = {
      z: input.z,
      zErr: evidence.zErr,
      grade: input.grade,
      spectrumClass: input.class,
      lines,
      note: input.note ?? '',
    };
    const existing = tx.select().from(readings).where(and(eq(readings.spectrumId, spectrumId), eq(readings.readerId, actor.id))).get();
    const now = ctx.now().toISOString();
    let row: ReadingRow;
    let changed = true;
    if (!existing) {
      row = tx
        .insert(readings)
        .values({ ...values, lineMeasurements: evidence.lineMeasurements, spectrumId, readerId: actor.id, readingOrder: assignment.readingOrder, timeSpentMs: input.timeSpentMs ?? 0, createdAt: now, updatedAt: now })
        .returning()
        .get();
      recordAudit(tx, { actorId: actor.id, action: 'reading.created', subjectType: 'reading', subjectId: row.id, campaignId: spectrum.campaignId, after: values });
    } else if (sameReading(existing, values)) {
      row = existing;
      changed = false;
    } else {
      if (existing.lockedAt) throw conflict('This reading is part of a confirmed redshift and can no longer be changed.', 'reading_locked');
      row = tx
        .update(readings)
        .set({ ...values, lineMeasurements: evidence.lineMeasurements, revision: existing.revision + 1, timeSpentMs: existing.timeSpentMs + (input.timeSpentMs ?? 0), updatedAt: now })
        .where(eq(readings.id, existing.id))
        .returning()
        .get();
      recordAudit(tx, {
        actorId: actor.id,
        action: 'reading.revised',
        subjectType: 'reading',
        subjectId: row.id,
        campaignId: spectrum.campaignId,
        before: pickReading(existing),
        after: { ...values, revision: row.revision },
      });
    }
    const outcome: AgreementOutcome = changed ? checkAgreement(ctx, tx, spectrumId, actor.id) : { kind: 'waiting' };
    const reader = tx.select({ name: users.name }).from(users).where(eq(users.id, actor.id)).get()!;
    return { reading: toReadingView(row, reader.name), changed, outcome };
  });
}

function pickReading(r: ReadingRow) {
  return { z: r.z, zErr: r.zErr, grade: r.grade, spectrumClass: r.spectrumClass, lines: r.lines, note: r.note, revision: r.revision };
}

function sameReading(r: ReadingRow, v: { z: number; zErr: number | null; grade: string; spectrumClass: string; lines: string[]; note: string }): boolean {
  return (
    r.z === v.z &&
    r.zErr === v.zErr &&
    r.grade === v.grade &&
    r.spectrumClass === v.spectrumClass &&
    r.note === v.note &&
    JSON.stringify(r.lines) === JSON.stringify(v.lines)
  );
}
