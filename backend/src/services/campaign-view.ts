import { count, eq, inArray } from 'drizzle-orm';
import type { Campaign, CampaignRole } from '../contracts/campaigns';
import { campaigns, memberships } from '../db/schema';
import type { ServiceContext } from './context';

type CampaignRow = typeof campaigns.$inferSelect;

/** Campaign rows as the API shows them, with the caller's role and the member count. */
export function toCampaignViews(
  ctx: ServiceContext,
  rows: CampaignRow[],
  roleOf: (campaignId: number) => CampaignRole | null,
): Campaign[] {
  if (rows.length === 0) return [];
  const counts = ctx.db
    .select({ campaignId: memberships.campaignId, n: count() })
    .from(memberships)
    .where(inArray(memberships.campaignId, rows.map((r) => r.id)))
    .groupBy(memberships.campaignId)
    .all();
  const countOf = new Map(counts.map((c) => [c.campaignId, c.n]));
  return rows.map((row) => ({
    id: row.id,
    name: row.name,
    description: row.description,
    zMin: row.zMin,
    zMax: row.zMax,
    tolerance: row.tolerance,
    gridStep: row.gridStep,
    gradeScheme: row.gradeScheme,
    createdAt: row.createdAt,
    updatedAt: row.updatedAt,
    myRole: roleOf(row.id),
    memberCount: countOf.get(row.id) ?? 0,
  }));
}

export function getCampaignView(ctx: ServiceContext, campaignId: number, myRole: CampaignRole | null): Campaign {
  const row = ctx.db.select().from(campaigns).where(eq(campaigns.id, campaignId)).get();
  if (!row) throw new Error(`campaign ${campaignId} vanished after authorization`);
  return toCampaignViews(ctx, [row], () => myRole)[0]!;
}
