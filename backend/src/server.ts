import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { pino } from 'pino';
import { createApp } from './app';
import type { Config } from './config';
import { openDatabase } from './db/client';
import { seedDemoIfEmpty } from './demo/seed-demo';
import { startMailCatcher, type MailCatcher } from './mail/catcher';
import { createSmtpMailer } from './mail/mailer';
import type { ServiceContext } from './services/context';
import { loadSessionSecret } from './session-secret';

export interface RunningServer {
  url: string;
  port: number;
  ctx: ServiceContext;
  mailCatcher: MailCatcher | null;
  seeded: boolean;
  close(): Promise<void>;
}

/**
 * Boots Redward: migrations, demo seed on a new database, the local mail catcher, then the
 * HTTP server. Used by `npm start`, `npm run dev` and the browser tests.
 */
export async function startServer(config: Config, now: () => Date = () => new Date()): Promise<RunningServer> {
  const logger = pino({ level: config.logLevel });
  const db = openDatabase(config.databasePath);
  const mailCatcher = config.mailCatcher.enabled ? await startMailCatcher(db, config.mailCatcher.port) : null;
  // When the catcher took an ephemeral port (MAIL_CATCHER_PORT=0), send to where it listens.
  const smtpUrl = mailCatcher && config.mailCatcher.port === 0 ? `smtp://127.0.0.1:${mailCatcher.port}` : config.smtpUrl;
  const mailer = createSmtpMailer(smtpUrl, config.mailFrom);
  const ctx: ServiceContext = { config, db, mailer, logger, now };
  const seeded = config.demo ? await seedDemoIfEmpty(ctx) : false;
  const app = createApp(ctx, loadSessionSecret(config.dataDir, config.sessionSecret));

  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(config.port, config.host, () => resolve(s));
    s.once('error', (err: NodeJS.ErrnoException) =>
      reject(err.code === 'EADDRINUSE' ? new Error(`Port ${config.port} is in use. Set PORT to a free port.`) : err),
    );
  });
  const port = (server.address() as AddressInfo).port;
  return {
    url: `http://localhost:${port}`,
    port,
    ctx,
    mailCatcher,
    seeded,
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections();
      await mailCatcher?.close();
      mailer.close();
      db.$client.close();
    },
  };
}
