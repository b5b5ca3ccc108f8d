import { and, asc, eq, gt, isNull } from 'drizzle-orm';
import type { CampaignRole, MembersResponse } from '../contracts/campaigns';
import { invitations, memberships, users } from '../db/schema';
import type { ServiceContext } from './context';

/** Members of a campaign; leads also see invitations still waiting for an answer. */
export function listMembers(ctx: ServiceContext, campaignId: number, viewerRole: CampaignRole | null): MembersResponse {
  const members = ctx.db
    .select({
      userId: users.id,
      email: users.email,
      name: users.name,
      role: memberships.role,
      joinedAt: memberships.createdAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.campaignId, campaignId))
    .orderBy(asc(memberships.role), asc(users.name))
    .all();
  if (viewerRole !== 'lead') return { members, invitations: [] };
  const pending = ctx.db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      expiresAt: invitations.expiresAt,
      invitedBy: users.name,
      createdAt: invitations.createdAt,
    })
    .from(invitations)
    .innerJoin(users, eq(users.id, invitations.invitedBy))
    .where(
      and(
        eq(invitations.campaignId, campaignId),
        isNull(invitations.acceptedAt),
        gt(invitations.expiresAt, ctx.now().toISOString()),
      ),
    )
    .orderBy(asc(invitations.createdAt))
    .all();
  return { members, invitations: pending };
}
