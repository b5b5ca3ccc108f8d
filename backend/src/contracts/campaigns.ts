import { z } from 'zod';
import { gradeSchemeSchema } from './grades';

export const CAMPAIGN_ROLES = ['lead', 'reader', 'observer'] as const;
export const campaignRoleSchema = z.enum(CAMPAIGN_ROLES);
export type CampaignRole = z.infer<typeof campaignRoleSchema>;

/** Largest redshift a campaign may search; the engine's templates are built for 0 ≤ z ≤ 9. */
export const Z_LIMIT = 9;

/**
 * The log-λ grid a campaign's scans use: 'default' is 1e-4 dex (≈ 69 km/s pixels); 'native' follows
 * each file's own median pixel, snapped to one of the engine's grid levels (2.5e-5 … 8e-4 dex).
 */
export const GRID_STEP_CHOICES = ['default', 'native'] as const;
export const gridStepSchema = z.enum(GRID_STEP_CHOICES, { error: 'The scan grid is either "default" or "native".' });
export type GridStep = z.infer<typeof gridStepSchema>;
/** The grid a stored scan or queued job used: those from before campaigns had the setting used the default. */
export const gridStepOf = (settings: { gridStep?: unknown } | null | undefined): GridStep => (settings?.gridStep === 'native' ? 'native' : 'default');

const campaignFields = {
  name: z.string().trim().min(1, 'Give the campaign a name.').max(120),
  description: z.string().trim().max(4000),
  zMin: z.number().min(0, 'The lowest redshift cannot be negative.').max(Z_LIMIT),
  zMax: z.number().min(0).max(Z_LIMIT, `The highest redshift searched is ${Z_LIMIT}.`),
  /** Agreement tolerance in |Δz|/(1+z) between two readings. */
  tolerance: z.number().gt(0, 'The tolerance must be positive.').max(0.1, 'A tolerance above 0.1 in dz/(1+z) is not an agreement.'),
  gridStep: gridStepSchema,
  gradeScheme: gradeSchemeSchema,
};

const rangeIsOrdered = (c: { zMin?: number; zMax?: number }) =>
  c.zMin === undefined || c.zMax === undefined || c.zMin < c.zMax;
const rangeMessage = { message: 'The lowest redshift must be below the highest.', path: ['zMax'] };

export const createCampaignRequestSchema = z
  .object({
    name: campaignFields.name,
    description: campaignFields.description.default(''),
    zMin: campaignFields.zMin.default(0),
    zMax: campaignFields.zMax.default(Z_LIMIT),
    tolerance: campaignFields.tolerance.default(0.003),
    gridStep: campaignFields.gridStep.default('default'),
    gradeScheme: campaignFields.gradeScheme.optional(),
  })
  .strict()
  .refine(rangeIsOrdered, rangeMessage);
export type CreateCampaignRequest = z.input<typeof createCampaignRequestSchema>;

export const updateCampaignRequestSchema = z
  .object(campaignFields)
  .partial()
  .strict()
  .refine((c) => Object.keys(c).length > 0, { message: 'Nothing to change.' })
  .refine(rangeIsOrdered, rangeMessage);
export type UpdateCampaignRequest = z.input<typeof updateCampaignRequestSchema>;

export const campaignSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  description: z.string(),
  zMin: z.number(),
  zMax: z.number(),
  tolerance: z.number(),
  gridStep: gridStepSchema,
  gradeScheme: gradeSchemeSchema,
  createdAt: z.string(),
  updatedAt: z.string(),
  /** The caller's role in this campaign; null for an admin who is not a member. */
  myRole: campaignRoleSchema.nullable(),
  memberCount: z.number().int(),
});
export type Campaign = z.infer<typeof campaignSchema>;

/** How far a campaign's reading has come, per spectrum: no reading yet, in reading, agreed by two readers, confirmed (by any route), with an open disagreement. */
export const campaignProgressSchema = z.object({
  spectra: z.number().int(),
  unread: z.number().int(),
  /** Null for a reader of the campaign: readings are blind, and how many agreed would tell. */
  agreed: z.number().int().nullable(),
  confirmed: z.number().int(),
  openDisagreements: z.number().int().nullable(),
});
export type CampaignProgress = z.infer<typeof campaignProgressSchema>;

export const campaignListItemSchema = campaignSchema.extend({ progress: campaignProgressSchema });
export type CampaignListItem = z.infer<typeof campaignListItemSchema>;

export const campaignListResponseSchema = z.object({ campaigns: z.array(campaignListItemSchema) });
export const campaignResponseSchema = z.object({ campaign: campaignSchema });

export const memberSchema = z.object({
  userId: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: campaignRoleSchema,
  joinedAt: z.string(),
});
export type Member = z.infer<typeof memberSchema>;

export const pendingInvitationSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  role: campaignRoleSchema,
  expiresAt: z.string(),
  invitedBy: z.string(),
  createdAt: z.string(),
});
export type PendingInvitation = z.infer<typeof pendingInvitationSchema>;

export const membersResponseSchema = z.object({
  members: z.array(memberSchema),
  /** Only leads see pending invitations; others get an empty list. */
  invitations: z.array(pendingInvitationSchema),
});
export type MembersResponse = z.infer<typeof membersResponseSchema>;

export const inviteMemberRequestSchema = z
  .object({
    email: z.string().trim().toLowerCase().pipe(z.email({ message: 'Enter a valid e-mail address.' })),
    role: campaignRoleSchema,
  })
  .strict();
export type InviteMemberRequest = z.infer<typeof inviteMemberRequestSchema>;

export const inviteMemberResponseSchema = z.object({ invitation: pendingInvitationSchema });
