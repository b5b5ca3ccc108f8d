import { desc, eq } from 'drizzle-orm';
import type { MailMessage, MailSummary } from '../contracts/admin';
import { mailMessages } from '../db/schema';
import { notFound } from '../http/errors';
import type { ServiceContext } from './context';

const MAIL_LIST_LIMIT = 500;

export function listCaughtMail(ctx: ServiceContext): MailSummary[] {
  return ctx.db
    .select({
      id: mailMessages.id,
      from: mailMessages.fromAddress,
      to: mailMessages.toAddress,
      subject: mailMessages.subject,
      receivedAt: mailMessages.receivedAt,
    })
    .from(mailMessages)
    .orderBy(desc(mailMessages.id))
    .limit(MAIL_LIST_LIMIT)
    .all();
}

export function getCaughtMail(ctx: ServiceContext, id: number): MailMessage {
  const m = ctx.db.select().from(mailMessages).where(eq(mailMessages.id, id)).get();
  if (!m) throw notFound('No such message.', 'mail_not_found');
  return { id: m.id, from: m.fromAddress, to: m.toAddress, subject: m.subject, receivedAt: m.receivedAt, text: m.textBody, html: m.htmlBody };
}
