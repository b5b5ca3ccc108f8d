import { and, eq, isNull } from 'drizzle-orm';
import type { InvitationPreview } from '../contracts/invitations';
import { campaigns, invitations, memberships, users } from '../db/schema';
import { AppError, badRequest, conflict, forbidden, gone, notFound } from '../http/errors';
import type { Actor, ServiceContext } from './context';
import { hashInvitationToken } from './invitation-tokens';
import { hashPassword } from './passwords';
import { recordAudit } from './record-audit';
import { startSession } from './sessions';

type InvitationRow = typeof invitations.$inferSelect;

/** Finds a usable invitation or says exactly why it cannot be used. */
function findUsableInvitation(ctx: ServiceContext, token: string): InvitationRow {
  const row = ctx.db.select().from(invitations).where(eq(invitations.tokenHash, hashInvitationToken(token))).get();
  if (!row) throw notFound('This invitation link is not valid. Check that the whole link was copied, or ask the campaign lead for a new invitation.', 'invitation_not_found');
  if (row.acceptedAt) throw gone('This invitation has already been used. Sign in to reach the campaign, or ask the campaign lead for a new invitation.', 'invitation_used');
  if (row.expiresAt <= ctx.now().toISOString()) {
    throw gone(`This invitation expired on ${new Date(row.expiresAt).toUTCString()}. Ask the campaign lead for a new one.`, 'invitation_expired');
  }
  return row;
}

export function previewInvitation(ctx: ServiceContext, token: string): InvitationPreview {
  const row = findUsableInvitation(ctx, token);
  const campaign = ctx.db.select({ id: campaigns.id, name: campaigns.name }).from(campaigns).where(eq(campaigns.id, row.campaignId)).get()!;
  const inviter = ctx.db.select({ name: users.name }).from(users).where(eq(users.id, row.invitedBy)).get();
  const account = ctx.db.select({ id: users.id }).from(users).where(eq(users.email, row.email)).get();
  return {
    email: row.email,
    role: row.role,
    campaign,
    invitedBy: inviter?.name ?? 'A campaign lead',
    expiresAt: row.expiresAt,
    accountExists: account !== undefined,
  };
}

export interface AcceptInput {
  name?: string | undefined;
  password?: string | undefined;
}

/**
 * Accepts an invitation. A new person sets a name and password and gets an account; a person
 * with an account must be signed in as the invited address. The invitation is marked used in
 * the same transaction that adds the membership, so a link submitted twice joins once.
 */
export async function acceptInvitation(
  ctx: ServiceContext,
  token: string,
  signedIn: Actor | null,
  input: AcceptInput,
): Promise<{ campaignId: number; user: Actor; sessionId: string | null }> {
  const invitation = findUsableInvitation(ctx, token);
  const account = ctx.db.select().from(users).where(eq(users.email, invitation.email)).get();

  if (account) {
    if (!signedIn) throw conflict(`An account for ${invitation.email} exists. Sign in as ${invitation.email}, then open the link again.`, 'sign_in_required');
    if (signedIn.id !== account.id) throw forbidden(`This invitation is for ${invitation.email}, but you are signed in as ${signedIn.email}. Sign out and sign in as ${invitation.email}.`, 'wrong_account');
  } else if (!input.name || !input.password) {
    throw badRequest('Enter your name and choose a password to create your account.', 'invalid_input');
  }

  const passwordHash = account ? null : await hashPassword(input.password!);
  const result = ctx.db.transaction((tx) => {
    const claimed = tx
      .update(invitations)
      .set({ acceptedAt: ctx.now().toISOString() })
      .where(and(eq(invitations.id, invitation.id), isNull(invitations.acceptedAt)))
      .run();
    if (claimed.changes === 0) throw gone('This invitation has already been used.', 'invitation_used');

    let user = account;
    if (!user) {
      if (tx.select({ id: users.id }).from(users).where(eq(users.email, invitation.email)).get()) {
        throw new AppError(409, 'account_exists', `An account for ${invitation.email} was created meanwhile. Sign in, then open the link again.`);
      }
      user = tx.insert(users).values({ email: invitation.email, name: input.name!, passwordHash: passwordHash! }).returning().get();
      recordAudit(tx, { actorId: user.id, action: 'user.created', subjectType: 'user', subjectId: user.id, after: { email: user.email, name: user.name, via: 'invitation' } });
    }
    tx.update(invitations).set({ acceptedBy: user.id }).where(eq(invitations.id, invitation.id)).run();

    const membership = tx
      .select()
      .from(memberships)
      .where(and(eq(memberships.userId, user.id), eq(memberships.campaignId, invitation.campaignId)))
      .get();
    // Someone who is already a member keeps their role: an invitation never demotes a lead.
    if (!membership) {
      tx.insert(memberships).values({ userId: user.id, campaignId: invitation.campaignId, role: invitation.role }).run();
    }
    recordAudit(tx, {
      actorId: user.id,
      action: 'invitation.accepted',
      subjectType: 'invitation',
      subjectId: invitation.id,
      campaignId: invitation.campaignId,
      after: { role: membership?.role ?? invitation.role, alreadyMember: membership !== undefined },
    });
    return { user, campaignId: invitation.campaignId };
  });
  const u = result.user;
  return {
    campaignId: result.campaignId,
    user: { id: u.id, email: u.email, name: u.name, isAdmin: u.isAdmin },
    // A new account is signed in here; an existing one already is (it had to be, above).
    sessionId: account ? null : startSession(ctx, u.id),
  };
}
