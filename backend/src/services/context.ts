import type { Logger } from 'pino';
import type { Config } from '../config';
import type { Db } from '../db/client';
import type { Mailer } from '../mail/mailer';
import type { BlobStore } from '../storage/blob-store';

/** What every use-case may depend on; built once at boot (or once per test app). */
export interface ServiceContext {
  config: Config;
  db: Db;
  mailer: Mailer;
  logger: Logger;
  /** Injected so tests can move time (invitation expiry) without sleeping. */
  now: () => Date;
  /** Where uploaded files live, by content. */
  store: BlobStore;
  /** Tells the job runner (when this process has one) that work was queued. */
  wakeJobRunner: () => void;
}

/** The signed-in person as the services see them. */
export interface Actor {
  id: number;
  email: string;
  name: string;
  isAdmin: boolean;
}
