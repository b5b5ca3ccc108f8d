import { eq } from 'drizzle-orm';
import { users } from '../db/schema';
import type { Actor, ServiceContext } from './context';

/** The user behind a session, or null when the account is gone, disabled or the session outdated. */
export function findSessionUser(ctx: ServiceContext, userId: number, epoch: number): Actor | null {
  const user = ctx.db.select().from(users).where(eq(users.id, userId)).get();
  if (!user || user.disabled || user.sessionEpoch !== epoch) return null;
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin };
}
