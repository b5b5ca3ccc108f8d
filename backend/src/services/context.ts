import type { Logger } from 'pino';
import type { Config } from '../config';
import type { Db } from '../db/client';
import type { Mailer } from '../mail/mailer';
import type { BlobStore } from '../storage/blob-store';
import type { ScanPool } from '../jobs/scan-pool';
import type { SpectrumDataThread } from '../storage/data-thread';

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
  /** Worker threads for scans and for rebuilding solution models (threads start on first use). */
  scanPool: ScanPool;
  /** Parses and packs stored files for the `/data` route off the web thread. */
  spectrumData: SpectrumDataThread;
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
