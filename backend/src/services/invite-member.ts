import { and, eq } from 'drizzle-orm';
import type { CampaignRole, PendingInvitation } from '../contracts/campaigns';
import { campaigns, invitations, memberships, users } from '../db/schema';
import { AppError, conflict } from '../http/errors';
import type { Actor, ServiceContext } from './context';
import { hashInvitationToken, newInvitationToken } from './invitation-tokens';
import { invitationMail } from './invitation-mail';
import { recordAudit } from './record-audit';

/**
 * Records an invitation and e-mails its link. The token exists only in the e-mail; if the
 * message cannot be sent the invitation is withdrawn, so no unreachable invitation lingers.
 */
export async function inviteMember(
  ctx: ServiceContext,
  actor: Actor,
  campaignId: number,
  email: string,
  role: CampaignRole,
  appUrl: string,
): Promise<PendingInvitation> {
  const existing = ctx.db
    .select({ role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.campaignId, campaignId), eq(users.email, email)))
    .get();
  if (existing) throw conflict(`${email} is already a ${existing.role} of this campaign.`, 'already_member');

  const campaign = ctx.db.select({ name: campaigns.name }).from(campaigns).where(eq(campaigns.id, campaignId)).get()!;
  const token = newInvitationToken();
  const expiresAt = new Date(ctx.now().getTime() + ctx.config.invitationTtlHours * 3600_000).toISOString();
  const row = ctx.db.transaction((tx) => {
    const inserted = tx
      .insert(invitations)
      .values({ tokenHash: hashInvitationToken(token), email, campaignId, role, invitedBy: actor.id, expiresAt })
      .returning()
      .get();
    recordAudit(tx, {
      actorId: actor.id,
      action: 'invitation.created',
      subjectType: 'invitation',
      subjectId: inserted.id,
      campaignId,
      after: { email, role, expiresAt },
    });
    return inserted;
  });

  try {
    await ctx.mailer.send(
      invitationMail({ to: email, inviter: actor.name, campaign: campaign.name, role, link: `${appUrl}/invitations/${token}`, expiresAt }),
    );
  } catch (err) {
    ctx.logger.warn({ err, invitationId: row.id }, 'invitation e-mail could not be sent');
    ctx.db.transaction((tx) => {
      tx.update(invitations).set({ expiresAt: ctx.now().toISOString() }).where(eq(invitations.id, row.id)).run();
      recordAudit(tx, {
        actorId: actor.id,
        action: 'invitation.withdrawn',
        subjectType: 'invitation',
        subjectId: row.id,
        campaignId,
        after: { reason: 'e-mail could not be sent' },
      });
    });
    throw new AppError(502, 'mail_not_sent', `The invitation e-mail to ${email} could not be sent, so no invitation was made. Check the mail settings (SMTP_URL) and try again.`);
  }

  return { id: row.id, email, role, expiresAt, invitedBy: actor.name, createdAt: row.createdAt };
}
