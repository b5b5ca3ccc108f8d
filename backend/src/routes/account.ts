import { Router } from 'express';
import { apiTokenListSchema, changePasswordRequestSchema, createdTokenSchema, createTokenRequestSchema, meResponseSchema, revokedTokenResponseSchema, updateAccountRequestSchema } from '../contracts/auth';
import { createApiToken, listApiTokens, revokeApiToken } from '../services/api-tokens';
import { access } from '../http/access';
import { defineRoute } from '../http/define-route';
import { changePassword } from '../services/change-password';
import type { ServiceContext } from '../services/context';
import { updateAccount } from '../services/update-account';

export function accountRoutes(ctx: ServiceContext): Router {
  const router = Router();

  defineRoute(ctx, router, {
    method: 'patch',
    path: '/account',
    access: access.signedIn,
    body: updateAccountRequestSchema,
    response: meResponseSchema,
    handle: ({ user, body }) => ({ user: updateAccount(ctx, user!, body.name) }),
  });

  defineRoute(ctx, router, {
    method: 'post',
    path: '/account/password',
    access: access.signedIn,
    body: changePasswordRequestSchema,
    handle: async ({ req, user, body }) => {
      // This browser stays signed in (a script with a token keeps no session); every other session ends.
      await changePassword(ctx, user!, body.currentPassword, body.newPassword, req.session.sessionId);
      return undefined;
    },
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/account/tokens',
    access: access.signedIn,
    response: apiTokenListSchema,
    handle: ({ user }) => ({ tokens: listApiTokens(ctx, user!) }),
  });

  defineRoute(ctx, router, {
    method: 'post',
    path: '/account/tokens',
    access: access.signedIn,
    body: createTokenRequestSchema,
    status: 201,
    response: createdTokenSchema,
    handle: ({ user, body }) => createApiToken(ctx, user!, body.name),
  });

  defineRoute(ctx, router, {
    method: 'delete',
    path: '/account/tokens/:tokenId',
    access: access.signedIn,
    response: revokedTokenResponseSchema,
    handle: ({ req, user }) => ({ apiToken: revokeApiToken(ctx, user!, Number(req.params.tokenId)) }),
  });

  return router;
}
