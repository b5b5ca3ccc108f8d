import { eq } from 'drizzle-orm';
import { badRequest } from '../http/errors';
import { users } from '../db/schema';
import type { Actor, ServiceContext } from './context';
import { hashPassword, verifyPassword } from './passwords';
import { recordAudit } from './record-audit';
import { endUserSessions } from './sessions';

/**
 * Checks the current password, stores the new hash and ends every session of the account but
 * `keepSessionId` (the browser making the change). Returns how many sessions ended.
 */
export async function changePassword(
  ctx: ServiceContext,
  actor: Actor,
  currentPassword: string,
  newPassword: string,
  keepSessionId: string | undefined,
): Promise<number> {
  const user = ctx.db.select().from(users).where(eq(users.id, actor.id)).get();
  if (!user || !(await verifyPassword(user.passwordHash, currentPassword))) {
    throw badRequest('The current password is not right.', 'wrong_password');
  }
  if (currentPassword === newPassword) throw badRequest('Choose a password different from the current one.', 'same_password');
  const passwordHash = await hashPassword(newPassword);
  return ctx.db.transaction((tx) => {
    tx.update(users).set({ passwordHash }).where(eq(users.id, actor.id)).run();
    const ended = endUserSessions(ctx, actor.id, keepSessionId, tx);
    recordAudit(tx, { actorId: actor.id, action: 'account.password_changed', subjectType: 'user', subjectId: actor.id, after: { sessionsEnded: ended } });
    return ended;
  });
}
