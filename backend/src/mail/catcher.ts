import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { Db } from '../db/client';
import { mailMessages } from '../db/schema';

export interface MailCatcher {
  port: number;
  close(): Promise<void>;
}

const MAX_MESSAGE_BYTES = 5 * 1024 * 1024;

function addressText(a: AddressObject | AddressObject[] | undefined): string {
  if (!a) return '';
  return (Array.isArray(a) ? a : [a]).map((x) => x.text).join(', ');
}

/**
 * A local stand-in for the hosted mail service: an SMTP server on loopback that stores every
 * message it receives in the database, where admins read it inside the app.
 */
export async function startMailCatcher(db: Db, port: number): Promise<MailCatcher> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: MAX_MESSAGE_BYTES,
    banner: 'Redward local mail catcher',
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        if ((stream as unknown as { sizeExceeded?: boolean }).sizeExceeded) {
          callback(Object.assign(new Error('Message too large for the mail catcher'), { responseCode: 552 }));
          return;
        }
        const raw = Buffer.concat(chunks);
        simpleParser(raw)
          .then((parsed) => {
            const envelopeTo = session.envelope.rcptTo.map((r) => r.address).join(', ');
            const envelopeFrom = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
            db.insert(mailMessages)
              .values({
                fromAddress: addressText(parsed.from) || envelopeFrom,
                toAddress: addressText(parsed.to) || envelopeTo,
                subject: parsed.subject ?? '(no subject)',
                textBody: parsed.text ?? '',
                htmlBody: typeof parsed.html === 'string' ? parsed.html : null,
                raw: raw.toString('utf8'),
              })
              .run();
            callback();
          })
          .catch((err: Error) => callback(err));
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', (err: NodeJS.ErrnoException) => {
      reject(
        err.code === 'EADDRINUSE'
          ? new Error(`The mail catcher cannot listen on 127.0.0.1:${port}: the port is in use. Set MAIL_CATCHER_PORT to a free port.`)
          : err,
      );
    });
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address() as AddressInfo;
  return {
    port: address.port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
