import { and, eq } from 'drizzle-orm';
import type { CampaignRole } from '../contracts/campaigns';
import { campaigns, memberships } from '../db/schema';
import type { ServiceContext } from './context';

/** Whether the campaign exists, and the user's role in it (null when not a member). */
export function findCampaignRole(
  ctx: ServiceContext,
  userId: number,
  campaignId: number,
): { exists: boolean; role: CampaignRole | null } {
  const campaign = ctx.db.select({ id: campaigns.id }).from(campaigns).where(eq(campaigns.id, campaignId)).get();
  if (!campaign) return { exists: false, role: null };
  const membership = ctx.db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.userId, userId), eq(memberships.campaignId, campaignId)))
    .get();
  return { exists: true, role: membership?.role ?? null };
}
