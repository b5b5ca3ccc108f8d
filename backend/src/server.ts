import type { Server } from 'node:http';
import type { Express } from 'express';
import type { AddressInfo } from 'node:net';
import { pino } from 'pino';
import { createApp } from './app';
import type { Config } from './config';
import { openDatabase } from './db/client';
import { seedDemoIfEmpty } from './demo/seed-demo';
import { createJobQueue } from './jobs/job-queue';
import { createScanPool } from './jobs/scan-pool';
import { startMailCatcher, type MailCatcher } from './mail/catcher';
import { createSmtpMailer } from './mail/mailer';
import type { ServiceContext } from './services/context';
import { loadSessionSecret } from './session-secret';
import { BlobStore } from './storage/blob-store';
import { createSpectrumDataThread } from './storage/data-thread';

export interface Redward {
  app: Express;
  ctx: ServiceContext;
  mailCatcher: MailCatcher | null;
  seeded: boolean;
  /** Stops the job runner, the scan pool, the spectrum-data thread and the mail catcher, and closes the mailer and database. */
  close(): Promise<void>;
}

/**
 * Assembles Redward without listening: migrations, demo seed on a new database, the local
 * mail catcher and the HTTP application. API tests drive `app` directly.
 */
export async function createRedward(config: Config, now: () => Date = () => new Date()): Promise<Redward> {
  const logger = pino({ level: config.logLevel });
  const db = openDatabase(config.databasePath);
  const mailCatcher = config.mailCatcher.enabled ? await startMailCatcher(db, config.mailCatcher.port) : null;
  // When the catcher took an ephemeral port (MAIL_CATCHER_PORT=0), send to where it listens.
  const smtpUrl = mailCatcher && config.mailCatcher.port === 0 ? `smtp://127.0.0.1:${mailCatcher.port}` : config.smtpUrl;
  const mailer = createSmtpMailer(smtpUrl, config.mailFrom);
  const store = new BlobStore(config.uploadsDir);
  const pool = createScanPool(config.jobs.scanThreads, { timeLimitMs: config.jobs.scanTimeLimitMs });
  const spectrumData = createSpectrumDataThread();
  const ctx: ServiceContext = { config, db, mailer, logger, now, store, scanPool: pool, spectrumData, wakeJobRunner: () => {} };
  const seeded = config.demo ? await seedDemoIfEmpty(ctx) : false;
  let stopJobs = async () => {
    await pool.destroy();
  };
  if (config.jobs.runner) {
    const runner = createJobQueue(ctx, store, pool);
    ctx.wakeJobRunner = () => runner.wake();
    runner.start();
    stopJobs = async () => {
      await runner.stop();
      await pool.destroy();
    };
  }
  const app = createApp(ctx, loadSessionSecret(config.dataDir, config.sessionSecret));
  return {
    app,
    ctx,
    mailCatcher,
    seeded,
    async close() {
      await stopJobs();
      await spectrumData.destroy();
      await mailCatcher?.close();
      mailer.close();
      db.$client.close();
    },
  };
}

export interface RunningServer extends Redward {
  url: string;
  port: number;
}

/** Boots Redward and listens on PORT. Used by `npm start`, `npm run dev` and the browser tests. */
export async function startServer(config: Config, now: () => Date = () => new Date()): Promise<RunningServer> {
  const redward = await createRedward(config, now);
  // The first reader's /data answer should not wait for the thread to load the readers under tsx.
  await redward.ctx.spectrumData.warm();
  const server: Server = await new Promise((resolve, reject) => {
    const s = redward.app.listen(config.port, config.host, () => resolve(s));
    s.once('error', (err: NodeJS.ErrnoException) =>
      reject(err.code === 'EADDRINUSE' ? new Error(`Port ${config.port} is in use. Set PORT to a free port.`) : err),
    );
  });
  const port = (server.address() as AddressInfo).port;
  return {
    ...redward,
    url: `http://localhost:${port}`,
    port,
    async close() {
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      });
      await redward.close();
    },
  };
}
