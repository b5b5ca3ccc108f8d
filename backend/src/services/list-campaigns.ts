import { asc, eq, inArray, sql } from 'drizzle-orm';
import type { CampaignListItem, CampaignProgress, CampaignRole } from '../contracts/campaigns';
import { qualified } from '../db/qualified';
import { confirmedRedshifts, disagreements, readings, campaigns, memberships, spectra } from '../db/schema';
import { toCampaignViews } from './campaign-view';
import type { Actor, ServiceContext } from './context';

/** The campaigns the person belongs to, with their reading progress; admins see every campaign of the installation. */
export function listCampaigns(ctx: ServiceContext, actor: Actor): CampaignListItem[] {
  const mine = ctx.db
    .select({ campaignId: memberships.campaignId, role: memberships.role })
    .from(memberships)
    .where(eq(memberships.userId, actor.id))
    .all();
  const roleOf = new Map<number, CampaignRole>(mine.map((m) => [m.campaignId, m.role]));
  const rows = ctx.db.select().from(campaigns).orderBy(asc(campaigns.name)).all();
  const visible = actor.isAdmin ? rows : rows.filter((r) => roleOf.has(r.id));
  const progress = campaignProgress(ctx, visible.map((r) => r.id));
  return toCampaignViews(ctx, visible, (id) => roleOf.get(id) ?? null).map((c) => {
    const p = progress.get(c.id) ?? NO_PROGRESS;
    return { ...c, progress: c.myRole === 'reader' ? { ...p, agreed: null, openDisagreements: null } : p };
  });
}

const NO_PROGRESS: CampaignProgress = { spectra: 0, unread: 0, agreed: 0, confirmed: 0, openDisagreements: 0 };

/**
 * Per campaign, counted over spectra: unread (no reading saved), agreed (a current confirmed value
 * from two agreeing readings), confirmed (a current confirmed value by any route), open
 * disagreements. One grouped query for all campaigns of the list.
 */
function campaignProgress(ctx: ServiceContext, campaignIds: number[]): Map<number, CampaignProgress> {
  if (campaignIds.length === 0) return new Map();
  const current = (method?: string) =>
    sql`exists (select 1 from ${confirmedRedshifts} where ${qualified(confirmedRedshifts.spectrumId)} = ${qualified(spectra.id)} and ${qualified(confirmedRedshifts.isCurrent)} = 1${method ? sql` and ${qualified(confirmedRedshifts.method)} = ${method}` : sql``})`;
  const rows = ctx.db
    .select({
      campaignId: spectra.campaignId,
      spectra: sql<number>`count(*)`,
      unread: sql<number>`sum(case when not exists (select 1 from ${readings} where ${qualified(readings.spectrumId)} = ${qualified(spectra.id)}) then 1 else 0 end)`,
      agreed: sql<number>`sum(case when ${current('agreement')} then 1 else 0 end)`,
      confirmed: sql<number>`sum(case when ${current()} then 1 else 0 end)`,
      openDisagreements: sql<number>`sum(case when exists (select 1 from ${disagreements} where ${qualified(disagreements.spectrumId)} = ${qualified(spectra.id)} and ${qualified(disagreements.state)} = 'open') then 1 else 0 end)`,
    })
    .from(spectra)
    .where(inArray(spectra.campaignId, campaignIds))
    .groupBy(spectra.campaignId)
    .all();
  return new Map(rows.map((r) => [r.campaignId, { spectra: r.spectra, unread: r.unread ?? 0, agreed: r.agreed ?? 0, confirmed: r.confirmed ?? 0, openDisagreements: r.openDisagreements ?? 0 }]));
}
