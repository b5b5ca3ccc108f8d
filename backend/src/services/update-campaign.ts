import { eq } from 'drizzle-orm';
import type { Campaign, CampaignRole, GridStep } from '../contracts/campaigns';
import type { GradeScheme } from '../contracts/grades';
import { campaigns } from '../db/schema';
import { badRequest } from '../http/errors';
import { getCampaignView } from './campaign-view';
import type { Actor, ServiceContext } from './context';
import { recordAudit } from './record-audit';

export interface CampaignChanges {
  name?: string | undefined;
  description?: string | undefined;
  zMin?: number | undefined;
  zMax?: number | undefined;
  tolerance?: number | undefined;
  gridStep?: GridStep | undefined;
  gradeScheme?: GradeScheme | undefined;
}

/** Applies a lead's settings change, keeping the previous values in the audit trail. */
export function updateCampaign(
  ctx: ServiceContext,
  actor: Actor,
  campaignId: number,
  role: CampaignRole | null,
  changes: CampaignChanges,
): Campaign {
  ctx.db.transaction((tx) => {
    const before = tx.select().from(campaigns).where(eq(campaigns.id, campaignId)).get()!;
    const zMin = changes.zMin ?? before.zMin;
    const zMax = changes.zMax ?? before.zMax;
    if (zMin >= zMax) {
      throw badRequest(`The lowest redshift (${zMin}) must be below the highest (${zMax}).`, 'invalid_input');
    }
    const after = tx
      .update(campaigns)
      .set({ ...changes, updatedAt: ctx.now().toISOString() })
      .where(eq(campaigns.id, campaignId))
      .returning()
      .get();
    recordAudit(tx, {
      actorId: actor.id,
      action: 'campaign.updated',
      subjectType: 'campaign',
      subjectId: campaignId,
      campaignId,
      before: pick(before, Object.keys(changes)),
      after: pick(after, Object.keys(changes)),
    });
  });
  return getCampaignView(ctx, campaignId, role);
}

function pick(row: Record<string, unknown>, keys: string[]): Record<string, unknown> {
  return Object.fromEntries(keys.map((k) => [k, row[k]]));
}
