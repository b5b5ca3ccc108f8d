import { and, eq } from 'drizzle-orm';
import { spectra, targets } from '../db/schema';
import { badRequest } from '../http/errors';
import type { Actor, ServiceContext } from './context';
import { recordAudit } from './record-audit';

/** A lead's manual link of a spectrum to a target of the same campaign (or unlinking it). */
export function linkSpectrum(ctx: ServiceContext, actor: Actor, spectrumId: number, targetId: number | null): { spectrumId: number; targetId: number | null } {
  return ctx.db.transaction((tx) => {
    const spectrum = tx.select().from(spectra).where(eq(spectra.id, spectrumId)).get()!;
    if (targetId !== null) {
      const target = tx.select({ id: targets.id }).from(targets).where(and(eq(targets.id, targetId), eq(targets.campaignId, spectrum.campaignId))).get();
      if (!target) throw badRequest('That target is not in this campaign.', 'target_not_found');
    }
    tx.update(spectra).set({ targetId, linkMethod: targetId === null ? null : 'manual' }).where(eq(spectra.id, spectrumId)).run();
    recordAudit(tx, {
      actorId: actor.id,
      action: 'spectrum.linked',
      subjectType: 'spectrum',
      subjectId: spectrumId,
      campaignId: spectrum.campaignId,
      before: { targetId: spectrum.targetId, linkMethod: spectrum.linkMethod },
      after: { targetId, linkMethod: targetId === null ? null : 'manual' },
    });
    return { spectrumId, targetId };
  });
}
