import { z } from 'zod';
import { newPasswordSchema } from './auth';
import { campaignRoleSchema } from './campaigns';

export const invitationPreviewSchema = z.object({
  email: z.string(),
  role: campaignRoleSchema,
  campaign: z.object({ id: z.number().int(), name: z.string() }),
  invitedBy: z.string(),
  expiresAt: z.string(),
  /** True when an account with this e-mail exists: the person signs in and joins instead of setting a password. */
  accountExists: z.boolean(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

/** New people give a name and password; people with an account send an empty body while signed in. */
export const acceptInvitationRequestSchema = z
  .object({
    name: z.string().trim().min(1, 'Enter your name.').max(120).optional(),
    password: newPasswordSchema.optional(),
  })
  .strict();
export type AcceptInvitationRequest = z.infer<typeof acceptInvitationRequestSchema>;

export const acceptInvitationResponseSchema = z.object({
  campaignId: z.number().int(),
  user: z.object({ id: z.number().int(), email: z.string(), name: z.string(), isAdmin: z.boolean() }),
});
export type AcceptInvitationResponse = z.infer<typeof acceptInvitationResponseSchema>;
