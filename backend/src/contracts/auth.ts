import { z } from 'zod';

export const emailSchema = z.string().trim().toLowerCase().pipe(z.email({ message: 'Enter a valid e-mail address.' }));

/** Long enough to resist guessing; no composition rules (they do not help). */
export const newPasswordSchema = z
  .string()
  .min(10, 'Use at least 10 characters.')
  .max(200, 'Use at most 200 characters.');

export const loginRequestSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, 'Enter your password.').max(200),
});
export type LoginRequest = z.infer<typeof loginRequestSchema>;

export const changePasswordRequestSchema = z.object({
  currentPassword: z.string().min(1, 'Enter your current password.').max(200),
  newPassword: newPasswordSchema,
});
export type ChangePasswordRequest = z.infer<typeof changePasswordRequestSchema>;

export const updateAccountRequestSchema = z.object({
  name: z.string().trim().min(1, 'Enter your name.').max(120),
});
export type UpdateAccountRequest = z.infer<typeof updateAccountRequestSchema>;

export const userSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  isAdmin: z.boolean(),
});
export type User = z.infer<typeof userSchema>;

export const meResponseSchema = z.object({ user: userSchema });
export type MeResponse = z.infer<typeof meResponseSchema>;

export const createTokenRequestSchema = z.object({ name: z.string().trim().min(1, 'Name the token (e.g. the script that uses it).').max(80) }).strict();
export const apiTokenSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  prefix: z.string(),
  createdAt: z.string(),
  lastUsedAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
});
export type ApiToken = z.infer<typeof apiTokenSchema>;
export const apiTokenListSchema = z.object({ tokens: z.array(apiTokenSchema) });
/** DELETE /api/account/tokens/:id answers with the token as it now is (revokedAt set). */
export const revokedTokenResponseSchema = z.object({ apiToken: apiTokenSchema });
/** The token itself appears only in this response. */
export const createdTokenSchema = z.object({ token: z.string(), apiToken: apiTokenSchema });
