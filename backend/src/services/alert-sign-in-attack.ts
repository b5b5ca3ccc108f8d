import { and, eq } from 'drizzle-orm';
import { users } from '../db/schema';
import type { ServiceContext } from './context';

/**
 * Tells every active installation admin that sign-ins to one account are being refused after
 * many failures from several addresses: someone is guessing its password, and its owner cannot
 * sign in until the window passes. A failed e-mail is logged, not fatal (the refusal stands).
 */
export async function alertSignInAttack(ctx: ServiceContext, p: { email: string; failures: number; windowMinutes: number }): Promise<void> {
  const account = ctx.db.select({ id: users.id }).from(users).where(eq(users.email, p.email)).get();
  const admins = ctx.db
    .select({ email: users.email })
    .from(users)
    .where(and(eq(users.isAdmin, true), eq(users.disabled, false)))
    .all();
  const subject = `Sign-ins to ${p.email} stopped after ${p.failures} failed attempts`;
  const text = [
    `Redward received ${p.failures} wrong passwords for ${p.email} within ${p.windowMinutes} minutes.`,
    ...(account ? [] : ['No account has this address; someone is trying addresses at random.']),
    `Every sign-in to this address is refused until ${p.windowMinutes} minutes after the first of these failures, the right password included.`,
    '',
    'What you can do:',
    '- tell the account owner, and ask them to choose a new password once they can sign in;',
    '- if the attempts come from addresses you can block, block them at your firewall or proxy;',
    '- if the account may be compromised, disable it under Admin → Accounts, or sign it out everywhere.',
  ].join('\n');
  for (const admin of admins) {
    try {
      await ctx.mailer.send({ to: admin.email, subject, text });
    } catch (err) {
      ctx.logger.warn({ err, to: admin.email }, 'sign-in alert e-mail could not be sent');
    }
  }
}
