import { count } from 'drizzle-orm';
import type { CampaignRole } from '../contracts/campaigns';
import { memberships, users } from '../db/schema';
import type { ServiceContext } from '../services/context';
import { createCampaign, type NewCampaign } from '../services/create-campaign';
import { hashPassword } from '../services/passwords';
import { recordAudit } from '../services/record-audit';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from './demo-accounts';
import { LANTERN_TARGETS, TIDEWATER_TARGETS, type DemoTarget } from './demo-scenario';
import { seedDemoSpectra } from './seed-demo-spectra';

// An invented scenario: the cluster, field and programme names below do not exist.
const DEMO_CAMPAIGNS = [
  {
    name: 'Lantern Cluster arcs',
    description:
      'Spectroscopic follow-up of lensed arcs and multiple-image families behind the (fictional) galaxy cluster ' +
      'Lantern, LNT J1042−1138, at z = 0.41. Goals: redshifts for the arc candidates, confirmation that the ' +
      'image families agree, and a census of foreground interlopers on the arcs.',
    zMin: 0,
    zMax: 9,
    tolerance: 0.003,
    gridStep: 'default',
    members: { 'lead@demo.test': 'lead', 'reader1@demo.test': 'reader', 'reader2@demo.test': 'reader', 'observer@demo.test': 'observer' },
    targets: LANTERN_TARGETS,
  },
  {
    name: 'Tidewater Deep Field dropouts',
    description:
      'Wide-field follow-up of i-band dropout candidates in the (fictional) Tidewater Deep Field. Expect Lyman-break ' +
      'sources at 5.5 < z < 7, low-redshift Balmer-break interlopers and cool-dwarf contaminants.',
    zMin: 0,
    zMax: 9,
    tolerance: 0.005,
    gridStep: 'default',
    members: { 'lead@demo.test': 'lead', 'reader1@demo.test': 'reader', 'reader2@demo.test': 'reader' },
    targets: TIDEWATER_TARGETS,
  },
] satisfies (NewCampaign & { members: Record<string, CampaignRole>; targets: readonly DemoTarget[] })[];

/** Seeds the demo accounts and campaigns, once, into an empty database. Returns whether it did. */
export async function seedDemoIfEmpty(ctx: ServiceContext): Promise<boolean> {
  const existing = ctx.db.select({ n: count() }).from(users).get()!.n;
  if (existing > 0) return false;
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const userIds = new Map<string, number>();
  ctx.db.transaction((tx) => {
    for (const account of DEMO_ACCOUNTS) {
      const row = tx.insert(users).values({ ...account, passwordHash }).returning({ id: users.id }).get();
      userIds.set(account.email, row.id);
    }
    recordAudit(tx, { actorId: null, action: 'demo.seeded', subjectType: 'installation', after: { accounts: DEMO_ACCOUNTS.length } });
  });
  const lead = { id: userIds.get('lead@demo.test')!, email: 'lead@demo.test', name: 'Lena Demo (lead)', isAdmin: false };
  for (const [index, { members, targets, ...fields }] of DEMO_CAMPAIGNS.entries()) {
    const campaign = createCampaign(ctx, null, fields);
    ctx.db
      .insert(memberships)
      .values(Object.entries(members).map(([email, role]) => ({ userId: userIds.get(email)!, campaignId: campaign.id, role })))
      .run();
    if (ctx.config.demoSpectra) {
      const readers = { first: userIds.get('reader1@demo.test')!, second: userIds.get('reader2@demo.test')! };
      await seedDemoSpectra(ctx, lead, campaign.id, targets, 5000 * (index + 1), readers);
    }
  }
  ctx.wakeJobRunner();
  return true;
}
