import type { Logger } from 'pino';
import type { Config } from '../config';
import type { Db } from '../db/client';
import type { Mailer } from '../mail/mailer';

/** What every use-case may depend on; built once at boot (or once per test app). */
export interface ServiceContext {
  config: Config;
  db: Db;
  mailer: Mailer;
  logger: Logger;
  /** Injected so tests can move time (invitation expiry) without sleeping. */
  now: () => Date;
}

/** The signed-in person as the services see them. */
export interface Actor {
  id: number;
  email: string;
  name: string;
  isAdmin: boolean;
}
