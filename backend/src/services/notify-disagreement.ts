import { and, eq } from 'drizzle-orm';
import { campaigns, disagreements, memberships, spectra, targets, users } from '../db/schema';
import type { ServiceContext } from './context';

/**
 * E-mails the campaign's leads that a disagreement waits for them. The disagreement is already
 * recorded and listed in the app, so a failed e-mail is logged, not fatal.
 */
export async function notifyDisagreement(ctx: ServiceContext, disagreementId: number, appUrl: string): Promise<void> {
  const d = ctx.db
    .select({ campaignId: disagreements.campaignId, reasons: disagreements.reasons, fileName: spectra.fileName, catalogueId: targets.catalogueId, campaign: campaigns.name })
    .from(disagreements)
    .innerJoin(spectra, eq(spectra.id, disagreements.spectrumId))
    .innerJoin(campaigns, eq(campaigns.id, disagreements.campaignId))
    .leftJoin(targets, eq(targets.id, spectra.targetId))
    .where(eq(disagreements.id, disagreementId))
    .get();
  if (!d) return;
  const leads = ctx.db
    .select({ email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.campaignId, d.campaignId), eq(memberships.role, 'lead'), eq(users.disabled, false)))
    .all();
  const what = { z: 'the redshifts differ beyond the tolerance', grade: 'the grades are more than one step apart', class: 'the classes differ' } as Record<string, string>;
  const subject = `Disagreement to settle in ${d.campaign}: ${d.catalogueId ?? d.fileName}`;
  const text = [
    `The two readings of ${d.catalogueId ? `target ${d.catalogueId} (${d.fileName})` : d.fileName} in "${d.campaign}" disagree: ${d.reasons.map((r) => what[r] ?? r).join('; ')}.`,
    '',
    'Settle it here:',
    `${appUrl}/campaigns/${d.campaignId}/disagreements`,
  ].join('\n');
  for (const lead of leads) {
    try {
      await ctx.mailer.send({ to: lead.email, subject, text });
    } catch (err) {
      ctx.logger.warn({ err, disagreementId, to: lead.email }, 'disagreement e-mail could not be sent');
    }
  }
}
