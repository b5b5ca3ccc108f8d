import { z } from 'zod';

export const adminUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  isAdmin: z.boolean(),
  disabled: z.boolean(),
  createdAt: z.string(),
  lastLoginAt: z.string().nullable(),
  campaignCount: z.number().int(),
  /** Browsers signed in to the account right now (not ended, not expired). */
  activeSessions: z.number().int(),
});
export type AdminUser = z.infer<typeof adminUserSchema>;
export const adminUsersResponseSchema = z.object({ users: z.array(adminUserSchema) });
export const adminUserResponseSchema = z.object({ user: adminUserSchema });
export const signOutEverywhereResponseSchema = z.object({ user: adminUserSchema, sessionsEnded: z.number().int() });

export const updateUserRequestSchema = z
  .object({ isAdmin: z.boolean(), disabled: z.boolean() })
  .partial()
  .strict()
  .refine((u) => Object.keys(u).length > 0, { message: 'Nothing to change.' });
export type UpdateUserRequest = z.infer<typeof updateUserRequestSchema>;

export const mailSummarySchema = z.object({
  id: z.number().int(),
  from: z.string(),
  to: z.string(),
  subject: z.string(),
  receivedAt: z.string(),
});
export type MailSummary = z.infer<typeof mailSummarySchema>;
export const mailListResponseSchema = z.object({ messages: z.array(mailSummarySchema) });

export const mailMessageSchema = mailSummarySchema.extend({
  text: z.string(),
  html: z.string().nullable(),
});
export type MailMessage = z.infer<typeof mailMessageSchema>;
export const mailMessageResponseSchema = z.object({ message: mailMessageSchema });

export const healthResponseSchema = z.object({ ok: z.literal(true), version: z.string() });
