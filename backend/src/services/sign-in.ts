import { eq } from 'drizzle-orm';
import { AppError } from '../http/errors';
import { users } from '../db/schema';
import type { Actor, ServiceContext } from './context';
import { verifyAgainstDecoy, verifyPassword } from './passwords';
import { startSession } from './sessions';

// One message for every failure, so the form does not reveal which accounts exist.
const invalidCredentials = () => new AppError(401, 'invalid_credentials', 'The e-mail or password is not right.');

export async function signIn(
  ctx: ServiceContext,
  email: string,
  password: string,
): Promise<{ user: Actor; sessionId: string }> {
  const user = ctx.db.select().from(users).where(eq(users.email, email)).get();
  const ok = user ? await verifyPassword(user.passwordHash, password) : await verifyAgainstDecoy(password);
  if (!user || !ok || user.disabled) throw invalidCredentials();
  ctx.db.update(users).set({ lastLoginAt: ctx.now().toISOString() }).where(eq(users.id, user.id)).run();
  return { user: { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin }, sessionId: startSession(ctx, user.id) };
}
