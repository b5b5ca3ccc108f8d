import { and, eq, inArray, sql } from 'drizzle-orm';
import { qualified } from '../db/qualified';
import { assignments, campaigns, memberships, readings, spectra, targets, users } from '../db/schema';
import { badRequest, conflict } from '../http/errors';
import { planAssignments } from '../release/plan-assignments';
import type { Actor, ServiceContext } from './context';
import { recordAudit } from './record-audit';

interface PerReader {
  readerId: number;
  name: string;
  email: string;
  first: number;
  second: number;
}

function checkReaders(ctx: ServiceContext, campaignId: number, readerIds: number[]) {
  const members = ctx.db
    .select({ id: users.id, name: users.name, email: users.email, role: memberships.role, disabled: users.disabled })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.campaignId, campaignId), inArray(memberships.userId, readerIds)))
    .all();
  const ok = members.filter((m) => (m.role === 'reader' || m.role === 'lead') && !m.disabled);
  const missing = readerIds.filter((id) => !ok.some((m) => m.id === id));
  if (missing.length > 0) throw badRequest(`Only readers and leads of this campaign can read; not eligible: user ${missing.join(', ')}.`, 'not_a_reader');
  return ok;
}

/**
 * Assigns every spectrum of the campaign that lacks a first or second reader, two different
 * readers each, priority targets first, balancing load; then e-mails each reader a summary.
 */
export async function assignReaders(ctx: ServiceContext, actor: Actor, campaignId: number, readerIds: number[], appUrl: string) {
  const readers = checkReaders(ctx, campaignId, [...new Set(readerIds)]);
  const campaign = ctx.db.select({ name: campaigns.name }).from(campaigns).where(eq(campaigns.id, campaignId)).get()!;
  const perReader = new Map<number, PerReader>(readers.map((r) => [r.id, { readerId: r.id, name: r.name, email: r.email, first: 0, second: 0 }]));
  const assigned = ctx.db.transaction((tx) => {
    const rows = tx
      .select({
        spectrumId: spectra.id,
        priority: targets.priority,
        first: sql<number | null>`(select ${qualified(assignments.readerId)} from ${assignments} where ${qualified(assignments.spectrumId)} = ${qualified(spectra.id)} and ${qualified(assignments.readingOrder)} = 'first')`,
        second: sql<number | null>`(select ${qualified(assignments.readerId)} from ${assignments} where ${qualified(assignments.spectrumId)} = ${qualified(spectra.id)} and ${qualified(assignments.readingOrder)} = 'second')`,
      })
      .from(spectra)
      .leftJoin(targets, eq(targets.id, spectra.targetId))
      .where(eq(spectra.campaignId, campaignId))
      .all();
    const load = new Map(
      tx
        .select({ readerId: assignments.readerId, n: sql<number>`count(*)` })
        .from(assignments)
        .innerJoin(spectra, eq(spectra.id, assignments.spectrumId))
        .where(eq(spectra.campaignId, campaignId))
        .groupBy(assignments.readerId)
        .all()
        .map((r) => [r.readerId, r.n]),
    );
    const plan = planAssignments(rows.filter((r) => r.first === null || r.second === null), readers.map((r) => r.id), load);
    for (let i = 0; i < plan.length; i += 500) {
      tx.insert(assignments).values(plan.slice(i, i + 500).map((p) => ({ ...p, assignedBy: actor.id }))).run();
    }
    for (const p of plan) perReader.get(p.readerId)![p.readingOrder] += 1;
    recordAudit(tx, { actorId: actor.id, action: 'assignments.created', subjectType: 'campaign', subjectId: campaignId, campaignId, after: { assigned: plan.length, readers: readers.map((r) => r.id) } });
    return plan.length;
  });
  for (const r of perReader.values()) {
    if (r.first + r.second === 0) continue;
    try {
      await ctx.mailer.send({
        to: r.email,
        subject: `${r.first + r.second} spectra to read in ${campaign.name}`,
        text: [
          `You have new spectra to read in "${campaign.name}": ${r.first} as first reader and ${r.second} as second reader.`,
          'Second readings are blind: you will not see the other reading.',
          '',
          'Start here:',
          `${appUrl}/campaigns/${campaignId}/inspect`,
        ].join('\n'),
      });
    } catch (err) {
      ctx.logger.warn({ err, readerId: r.readerId }, 'assignment e-mail could not be sent');
    }
  }
  return { assigned, perReader: [...perReader.values()].map(({ email: _email, ...rest }) => rest) };
}

/** Moves one reading of a spectrum to another reader, while that reading has not been made. */
export function reassignReading(ctx: ServiceContext, actor: Actor, spectrumId: number, readingOrder: 'first' | 'second', readerId: number) {
  return ctx.db.transaction((tx) => {
    const spectrum = tx.select({ campaignId: spectra.campaignId }).from(spectra).where(eq(spectra.id, spectrumId)).get()!;
    checkReaders(ctx, spectrum.campaignId, [readerId]);
    const current = tx.select().from(assignments).where(and(eq(assignments.spectrumId, spectrumId), eq(assignments.readingOrder, readingOrder))).get();
    if (current && tx.select({ id: readings.id }).from(readings).where(and(eq(readings.spectrumId, spectrumId), eq(readings.readerId, current.readerId))).get()) {
      throw conflict(`The ${readingOrder} reading has already been made; it cannot be reassigned.`, 'already_read');
    }
    const other = tx.select().from(assignments).where(and(eq(assignments.spectrumId, spectrumId), eq(assignments.readerId, readerId))).get();
    if (other && other.readingOrder !== readingOrder) throw conflict('That person already makes the other reading of this spectrum; the two readings must be independent.', 'same_reader');
    if (current) tx.delete(assignments).where(eq(assignments.id, current.id)).run();
    tx.insert(assignments).values({ spectrumId, readerId, readingOrder, assignedBy: actor.id }).run();
    recordAudit(tx, {
      actorId: actor.id,
      action: 'assignment.changed',
      subjectType: 'spectrum',
      subjectId: spectrumId,
      campaignId: spectrum.campaignId,
      before: current ? { readingOrder, readerId: current.readerId } : null,
      after: { readingOrder, readerId },
    });
    return { spectrumId, readingOrder, readerId };
  });
}

/** Who reads a spectrum (first and second), whether they have read it, and who else could. */
export function spectrumAssignments(ctx: ServiceContext, spectrumId: number) {
  const spectrum = ctx.db.select({ campaignId: spectra.campaignId }).from(spectra).where(eq(spectra.id, spectrumId)).get()!;
  const rows = ctx.db
    .select({ readingOrder: assignments.readingOrder, readerId: assignments.readerId, name: users.name })
    .from(assignments)
    .innerJoin(users, eq(users.id, assignments.readerId))
    .where(eq(assignments.spectrumId, spectrumId))
    .all();
  const readBy = new Set(ctx.db.select({ readerId: readings.readerId }).from(readings).where(eq(readings.spectrumId, spectrumId)).all().map((r) => r.readerId));
  const candidates = ctx.db
    .select({ id: users.id, name: users.name, role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.campaignId, spectrum.campaignId), inArray(memberships.role, ['lead', 'reader']), eq(users.disabled, false)))
    .all()
    .map((c) => ({ id: c.id, name: c.name, role: c.role as 'lead' | 'reader' }));
  return {
    assignments: rows.sort((a, b) => a.readingOrder.localeCompare(b.readingOrder)).map((r) => ({ ...r, read: readBy.has(r.readerId) })),
    candidates,
  };
}
