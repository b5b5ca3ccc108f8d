import type { Request } from 'express';
import type { CampaignRole } from '../contracts/campaigns';
import type { Actor, ServiceContext } from '../services/context';
import { findCampaignRole } from '../services/find-campaign-role';
import type { WorkerIdentity } from '../services/worker-tokens';
import { forbidden, notFound, unauthenticated } from './errors';

/**
 * Who may call a route. Every route declares one; `authorize` is the single place that
 * enforces them, so the browser never decides access.
 *
 * - public: anyone, signed in or not
 * - signedIn: any signed-in account
 * - admin: installation admins
 * - worker: scan workers holding a worker token (and nobody else: a worker token is no person,
 *   so it passes no other rule)
 * - campaign: members of the campaign in `:id` holding one of the roles. Admins may read
 *   every campaign as if observers (they run the installation), but hold no other role
 *   unless they are members.
 */
export type Access =
  | { kind: 'public' }
  | { kind: 'signedIn' }
  | { kind: 'admin' }
  | { kind: 'worker' }
  | { kind: 'campaign'; roles: readonly CampaignRole[]; campaignOf?: CampaignResolver };

/** Finds the campaign a request is about when the path names something inside it (a job, a spectrum). */
export type CampaignResolver = (ctx: ServiceContext, req: Request) => number | null;

export const access = {
  public: { kind: 'public' } as Access,
  signedIn: { kind: 'signedIn' } as Access,
  admin: { kind: 'admin' } as Access,
  worker: { kind: 'worker' } as Access,
  campaign: (...roles: CampaignRole[]): Access => ({ kind: 'campaign', roles }),
  /** Roles in the campaign that owns the thing named in the path. */
  campaignOf: (campaignOf: CampaignResolver, ...roles: CampaignRole[]): Access => ({ kind: 'campaign', roles, campaignOf }),
  /** Anyone who can see the campaign: all members, and admins. */
  campaignViewer: { kind: 'campaign', roles: ['lead', 'reader', 'observer'] } as Access,
};

export interface Authorization {
  user: Actor | null;
  /** The scan worker calling a worker route (null on every other route). */
  worker: WorkerIdentity | null;
  campaign: { id: number; role: CampaignRole | null } | null;
}

const roleWords: Record<CampaignRole, string> = { lead: 'a lead', reader: 'a reader', observer: 'an observer' };

export function authorize(ctx: ServiceContext, req: Request, rule: Access): Authorization {
  if (rule.kind === 'public') return { user: req.user, worker: null, campaign: null };
  if (rule.kind === 'worker') {
    if (req.worker) return { user: null, worker: req.worker, campaign: null };
    if (req.user) throw forbidden('Only scan workers can do this (Authorization: Bearer rwwkr_…).', 'worker_only');
    throw unauthenticated('Send a worker token: Authorization: Bearer rwwkr_… (an administrator makes them).');
  }
  const user = req.user;
  if (!user) throw unauthenticated();
  if (rule.kind === 'signedIn') return { user, worker: null, campaign: null };
  if (rule.kind === 'admin') {
    if (!user.isAdmin) throw forbidden('Only administrators can do this.');
    return { user, worker: null, campaign: null };
  }
  const campaignId = rule.campaignOf ? rule.campaignOf(ctx, req) : Number(req.params.id);
  if (campaignId === null || !Number.isSafeInteger(campaignId) || campaignId <= 0) throw notFound('No such campaign.', 'campaign_not_found');
  const { exists, role } = findCampaignRole(ctx, user.id, campaignId);
  if (!exists) throw notFound('No such campaign.', 'campaign_not_found');
  const allowed =
    (role !== null && rule.roles.includes(role)) || (role === null && user.isAdmin && rule.roles.includes('observer'));
  if (!allowed) {
    if (role === null && !user.isAdmin) throw notFound('No such campaign.', 'campaign_not_found');
    const needed = rule.roles.map((r) => roleWords[r]).join(' or ');
    throw forbidden(`Only ${needed} of this campaign can do this.`);
  }
  return { user, worker: null, campaign: { id: campaignId, role } };
}
