import { asc, count, eq } from 'drizzle-orm';
import type { AdminUser } from '../contracts/admin';
import { memberships, users } from '../db/schema';
import { badRequest, notFound } from '../http/errors';
import type { Actor, ServiceContext } from './context';
import { recordAudit } from './record-audit';
import { countLiveSessions } from './sessions';

export function listUsers(ctx: ServiceContext): AdminUser[] {
  const counts = new Map(
    ctx.db
      .select({ userId: memberships.userId, n: count() })
      .from(memberships)
      .groupBy(memberships.userId)
      .all()
      .map((r) => [r.userId, r.n]),
  );
  const live = countLiveSessions(ctx);
  return ctx.db
    .select()
    .from(users)
    .orderBy(asc(users.email))
    .all()
    .map((u) => ({
      id: u.id,
      email: u.email,
      name: u.name,
      isAdmin: u.isAdmin,
      disabled: u.disabled,
      createdAt: u.createdAt,
      lastLoginAt: u.lastLoginAt,
      campaignCount: counts.get(u.id) ?? 0,
      activeSessions: live.get(u.id) ?? 0,
    }));
}

/** Grants or removes admin rights and disables or restores an account. */
export function updateUser(
  ctx: ServiceContext,
  actor: Actor,
  userId: number,
  changes: { isAdmin?: boolean | undefined; disabled?: boolean | undefined },
): AdminUser {
  // An admin locking themselves out would leave the installation without anyone to undo it.
  if (userId === actor.id && (changes.isAdmin === false || changes.disabled === true)) {
    throw badRequest('You cannot remove your own admin rights or disable your own account.', 'self_lockout');
  }
  ctx.db.transaction((tx) => {
    const before = tx.select().from(users).where(eq(users.id, userId)).get();
    if (!before) throw notFound('No such user.', 'user_not_found');
    tx.update(users).set(changes).where(eq(users.id, userId)).run();
    recordAudit(tx, {
      actorId: actor.id,
      action: 'user.updated',
      subjectType: 'user',
      subjectId: userId,
      before: { isAdmin: before.isAdmin, disabled: before.disabled },
      after: { isAdmin: changes.isAdmin ?? before.isAdmin, disabled: changes.disabled ?? before.disabled },
    });
  });
  return listUsers(ctx).find((u) => u.id === userId)!;
}
