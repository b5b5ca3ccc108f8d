import { and, eq, sql } from 'drizzle-orm';
import { preparedQuery } from '../db/prepared';
import type { CampaignRole } from '../contracts/campaigns';
import { campaigns, memberships } from '../db/schema';
import type { ServiceContext } from './context';

const campaignExists = preparedQuery((db) => db.select({ id: campaigns.id }).from(campaigns).where(eq(campaigns.id, sql.placeholder('campaignId'))).prepare());
const roleIn = preparedQuery((db) =>
  db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.userId, sql.placeholder('userId')), eq(memberships.campaignId, sql.placeholder('campaignId'))))
    .prepare(),
);

/** Whether the campaign exists, and the user's role in it (null when not a member). */
export function findCampaignRole(
  ctx: ServiceContext,
  userId: number,
  campaignId: number,
): { exists: boolean; role: CampaignRole | null } {
  const campaign = campaignExists(ctx.db).get({ campaignId });
  if (!campaign) return { exists: false, role: null };
  const membership = roleIn(ctx.db).get({ userId, campaignId });
  return { exists: true, role: membership?.role ?? null };
}
