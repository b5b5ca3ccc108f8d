import { Router } from 'express';
import { z } from 'zod';
import { adminUserResponseSchema, adminUsersResponseSchema, mailListResponseSchema, mailMessageResponseSchema, signOutEverywhereResponseSchema, updateUserRequestSchema } from '../contracts/admin';
import { access } from '../http/access';
import { defineRoute } from '../http/define-route';
import { notFound } from '../http/errors';
import { listUsers, updateUser } from '../services/admin-users';
import { getCaughtMail, listCaughtMail } from '../services/caught-mail';
import type { ServiceContext } from '../services/context';
import { signOutEverywhere } from '../services/sessions';

const numericId = (raw: unknown, what: string) => {
  const parsed = z.coerce.number().int().positive().safeParse(raw);
  if (!parsed.success) throw notFound(`No such ${what}.`);
  return parsed.data;
};

export function adminRoutes(ctx: ServiceContext): Router {
  const router = Router();

  defineRoute(ctx, router, {
    method: 'get',
    path: '/admin/users',
    access: access.admin,
    response: adminUsersResponseSchema,
    handle: () => ({ users: listUsers(ctx) }),
  });

  defineRoute(ctx, router, {
    method: 'patch',
    path: '/admin/users/:userId',
    access: access.admin,
    body: updateUserRequestSchema,
    response: adminUserResponseSchema,
    handle: ({ req, user, body }) => ({ user: updateUser(ctx, user!, numericId(req.params.userId, 'user'), body) }),
  });

  defineRoute(ctx, router, {
    method: 'post',
    path: '/admin/users/:userId/sign-out-everywhere',
    access: access.admin,
    response: signOutEverywhereResponseSchema,
    handle: ({ req, user }) => {
      const userId = numericId(req.params.userId, 'user');
      const sessionsEnded = signOutEverywhere(ctx, user!, userId);
      return { user: listUsers(ctx).find((u) => u.id === userId)!, sessionsEnded };
    },
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/admin/mail',
    access: access.admin,
    response: mailListResponseSchema,
    handle: () => ({ messages: listCaughtMail(ctx) }),
  });

  defineRoute(ctx, router, {
    method: 'get',
    path: '/admin/mail/:mailId',
    access: access.admin,
    response: mailMessageResponseSchema,
    handle: ({ req }) => ({ message: getCaughtMail(ctx, numericId(req.params.mailId, 'message')) }),
  });

  return router;
}
