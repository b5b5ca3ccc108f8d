import { eq } from 'drizzle-orm';
import { emailSchema, newPasswordSchema } from '../contracts/auth';
import { users } from '../db/schema';
import { badRequest, conflict } from '../http/errors';
import type { ServiceContext } from './context';
import { hashPassword } from './passwords';
import { recordAudit } from './record-audit';

/** Creates an installation admin: the way into an installation started without demo data. */
export async function createAdminAccount(ctx: Pick<ServiceContext, 'db'>, rawEmail: string, name: string, password: string): Promise<number> {
  const email = emailSchema.safeParse(rawEmail);
  if (!email.success) throw badRequest(`"${rawEmail}" is not a valid e-mail address.`);
  const pw = newPasswordSchema.safeParse(password);
  if (!pw.success) throw badRequest(pw.error.issues[0]!.message);
  if (!name.trim()) throw badRequest('Give the admin a name.');
  if (ctx.db.select({ id: users.id }).from(users).where(eq(users.email, email.data)).get()) {
    throw conflict(`An account for ${email.data} already exists.`);
  }
  const passwordHash = await hashPassword(password);
  return ctx.db.transaction((tx) => {
    const row = tx.insert(users).values({ email: email.data, name: name.trim(), passwordHash, isAdmin: true }).returning().get();
    recordAudit(tx, { actorId: null, action: 'user.created', subjectType: 'user', subjectId: row.id, after: { email: row.email, isAdmin: true, via: 'command line' } });
    return row.id;
  });
}
