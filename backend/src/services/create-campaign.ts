import type { Campaign, GridStep } from '../contracts/campaigns';
import { DEFAULT_GRADE_SCHEME, type GradeScheme } from '../contracts/grades';
import { campaigns, memberships } from '../db/schema';
import { getCampaignView } from './campaign-view';
import type { Actor, ServiceContext } from './context';
import { recordAudit } from './record-audit';

export interface NewCampaign {
  name: string;
  description: string;
  zMin: number;
  zMax: number;
  tolerance: number;
  gridStep: GridStep;
  gradeScheme?: GradeScheme | undefined;
}

/** Creates a campaign with the creator as its lead. */
export function createCampaign(ctx: ServiceContext, actor: Actor | null, input: NewCampaign): Campaign {
  const id = ctx.db.transaction((tx) => {
    const row = tx
      .insert(campaigns)
      .values({ ...input, gradeScheme: input.gradeScheme ?? DEFAULT_GRADE_SCHEME, createdBy: actor?.id ?? null })
      .returning()
      .get();
    if (actor) tx.insert(memberships).values({ userId: actor.id, campaignId: row.id, role: 'lead' }).run();
    recordAudit(tx, {
      actorId: actor?.id ?? null,
      action: 'campaign.created',
      subjectType: 'campaign',
      subjectId: row.id,
      campaignId: row.id,
      after: row,
    });
    return row.id;
  });
  return getCampaignView(ctx, id, actor ? 'lead' : null);
}
