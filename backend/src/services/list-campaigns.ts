import { asc, eq } from 'drizzle-orm';
import type { Campaign, CampaignRole } from '../contracts/campaigns';
import { campaigns, memberships } from '../db/schema';
import { toCampaignViews } from './campaign-view';
import type { Actor, ServiceContext } from './context';

/** The campaigns the person belongs to; admins see every campaign of the installation. */
export function listCampaigns(ctx: ServiceContext, actor: Actor): Campaign[] {
  const mine = ctx.db
    .select({ campaignId: memberships.campaignId, role: memberships.role })
    .from(memberships)
    .where(eq(memberships.userId, actor.id))
    .all();
  const roleOf = new Map<number, CampaignRole>(mine.map((m) => [m.campaignId, m.role]));
  const rows = ctx.db.select().from(campaigns).orderBy(asc(campaigns.name)).all();
  const visible = actor.isAdmin ? rows : rows.filter((r) => roleOf.has(r.id));
  return toCampaignViews(ctx, visible, (id) => roleOf.get(id) ?? null);
}
