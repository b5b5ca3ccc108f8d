import { eq, sql } from 'drizzle-orm';
import { badRequest } from '../http/errors';
import { users } from '../db/schema';
import type { Actor, ServiceContext } from './context';
import { hashPassword, verifyPassword } from './passwords';
import { recordAudit } from './record-audit';

/** Checks the current password, stores the new hash and ends every other session. Returns the new epoch. */
export async function changePassword(
  ctx: ServiceContext,
  actor: Actor,
  currentPassword: string,
  newPassword: string,
): Promise<number> {
  const user = ctx.db.select().from(users).where(eq(users.id, actor.id)).get();
  if (!user || !(await verifyPassword(user.passwordHash, currentPassword))) {
    throw badRequest('The current password is not right.', 'wrong_password');
  }
  if (currentPassword === newPassword) throw badRequest('Choose a password different from the current one.', 'same_password');
  const passwordHash = await hashPassword(newPassword);
  return ctx.db.transaction((tx) => {
    const updated = tx
      .update(users)
      .set({ passwordHash, sessionEpoch: sql`${users.sessionEpoch} + 1` })
      .where(eq(users.id, actor.id))
      .returning({ epoch: users.sessionEpoch })
      .get();
    recordAudit(tx, { actorId: actor.id, action: 'account.password_changed', subjectType: 'user', subjectId: actor.id });
    return updated!.epoch;
  });
}
