import { readFileSync } from 'node:fs';
import path from 'node:path';
import { z } from 'zod';

const flag = z
  .enum(['0', '1', 'true', 'false', 'yes', 'no'])
  .transform((v) => v === '1' || v === 'true' || v === 'yes');

const envSchema = z.object({
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().default('0.0.0.0'),
  DATA_DIR: z.string().default('./data'),
  /** Public address used in links inside e-mails; defaults to http://localhost:PORT. */
  PUBLIC_URL: z.url().optional(),
  /** At least 32 characters; when absent one is generated once and kept in DATA_DIR. */
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters.').optional(),
  SMTP_URL: z.string().optional(),
  MAIL_FROM: z.string().default('Redward <redward@localhost>'),
  MAIL_CATCHER_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
  /** Run the local mail catcher; on by default unless SMTP_URL points elsewhere. */
  MAIL_CATCHER: flag.optional(),
  REDWARD_DEMO: flag.default(true),
  /** With demo data: also generate and scan the demo campaigns' synthetic spectra. */
  REDWARD_DEMO_SPECTRA: flag.default(true),
  INVITATION_TTL_HOURS: z.coerce.number().positive().max(24 * 90).default(72),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  /** Set when a reverse proxy terminates TLS in front of Redward (Express `trust proxy`). */
  TRUST_PROXY: flag.default(false),
  UPLOAD_MAX_FILE_MB: z.coerce.number().positive().default(512),
  UPLOAD_MAX_TOTAL_MB: z.coerce.number().positive().default(1024),
  UPLOAD_MAX_FILES: z.coerce.number().int().positive().default(5000),
  ARCHIVE_MAX_ENTRIES: z.coerce.number().int().positive().default(20000),
  ARCHIVE_MAX_EXPANDED_MB: z.coerce.number().positive().default(4096),
  /** Largest expanded ÷ compressed size of an archive; spectra compress far less than this. */
  ARCHIVE_MAX_RATIO: z.coerce.number().positive().default(200),
  /** Worker threads for scans; defaults to the number of cores. */
  SCAN_THREADS: z.coerce.number().int().positive().max(64).optional(),
  /** Wall-clock limit of one file's scan; past it the item fails and its worker thread is replaced. */
  SCAN_TIME_LIMIT_S: z.coerce.number().positive().max(3600).default(60),
  /** 1: while people's requests are being answered, scans leave one core to the web thread (issue 13). */
  SCAN_YIELD_TO_WEB: z.enum(['0', '1']).default('1'),
  /** Run the background job runner in this process (tests and the import command may not). */
  JOB_RUNNER: flag.default(true),
  /** How long a runner's claim on a job lasts without renewal; after a crash the job waits this long. */
  JOB_LEASE_SECONDS: z.coerce.number().positive().max(3600).default(30),
  /**
   * Where scan items wait: "sqlite" (the embedded queue: this server's or `npm run jobs`' threads
   * take them from the database) or a Redis address, redis://host:6379 (BullMQ: `npm run jobs` on
   * any number of machines takes them and posts results over HTTP).
   */
  JOB_QUEUE: z
    .string()
    .default('sqlite')
    .refine((v) => v === 'sqlite' || /^redis:\/\/[^\s]+$/.test(v), 'JOB_QUEUE must be "sqlite" or a Redis address such as redis://127.0.0.1:6379.'),
  /** For `npm run jobs` with a Redis queue: the Redward server that hands out files and records results. */
  REDWARD_SERVER_URL: z.url().optional(),
  /** For `npm run jobs` with a Redis queue: a worker token (rwwkr_…) an administrator made for this machine. */
  REDWARD_WORKER_TOKEN: z.string().startsWith('rwwkr_', 'REDWARD_WORKER_TOKEN must be a worker token (rwwkr_…), made on the server with npm run worker-token.').optional(),
  /** Largest distance between a spectrum's and a target's coordinates for a positional link. */
  LINK_TOLERANCE_ARCSEC: z.coerce.number().positive().max(60).default(2),
  /**
   * A catalogue import with more rows carrying photometry than this stores targets and fluxes in
   * the request and fits their photo-z in a job (answer 202 with the job id); smaller ones fit in
   * the request (≈ 1,100 sources/s on one thread).
   */
  PHOTOZ_JOB_THRESHOLD: z.coerce.number().int().min(0).default(2000),
});

export interface Config {
  port: number;
  host: string;
  dataDir: string;
  databasePath: string;
  uploadsDir: string;
  publicUrl: string | undefined;
  sessionSecret: string | undefined;
  smtpUrl: string;
  mailFrom: string;
  mailCatcher: { enabled: boolean; port: number };
  demo: boolean;
  demoSpectra: boolean;
  invitationTtlHours: number;
  logLevel: z.infer<typeof envSchema>['LOG_LEVEL'];
  trustProxy: boolean;
  uploads: {
    maxFileBytes: number;
    maxTotalBytes: number;
    maxFiles: number;
    archive: { maxEntries: number; maxExpandedBytes: number; maxEntryBytes: number; maxRatio: number };
  };
  jobs: {
    runner: boolean;
    scanThreads: number | undefined;
    scanTimeLimitMs: number;
    /** Scans use one thread fewer while API requests are being answered (at least one thread). */
    yieldToWeb: boolean;
    leaseMs: number;
    queue: { kind: 'sqlite' } | { kind: 'redis'; url: string };
    /** Only for remote workers (`npm run jobs` with a Redis queue). */
    worker: { serverUrl: string | undefined; token: string | undefined };
  };
  linkToleranceArcsec: number;
  /** Rows with photometry above which an import fits its photo-z in a job. */
  photoZJobThreshold: number;
  version: string;
}

const MB = 1024 * 1024;

function readVersion(): string {
  const pkgPath = new URL('../../package.json', import.meta.url);
  return (JSON.parse(readFileSync(pkgPath, 'utf8')) as { version: string }).version;
}

/**
 * The only reader of the environment. Parsed once at boot; a bad value stops the start with
 * a sentence naming the variable.
 */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  const dataDir = path.resolve(e.DATA_DIR);
  const catcherEnabled = e.MAIL_CATCHER ?? e.SMTP_URL === undefined;
  return {
    port: e.PORT,
    host: e.HOST,
    dataDir,
    databasePath: path.join(dataDir, 'redward.sqlite'),
    uploadsDir: path.join(dataDir, 'uploads'),
    publicUrl: e.PUBLIC_URL?.replace(/\/$/, ''),
    sessionSecret: e.SESSION_SECRET,
    smtpUrl: e.SMTP_URL ?? `smtp://127.0.0.1:${e.MAIL_CATCHER_PORT}`,
    mailFrom: e.MAIL_FROM,
    mailCatcher: { enabled: catcherEnabled, port: e.MAIL_CATCHER_PORT },
    demo: e.REDWARD_DEMO,
    demoSpectra: e.REDWARD_DEMO_SPECTRA,
    invitationTtlHours: e.INVITATION_TTL_HOURS,
    logLevel: e.LOG_LEVEL,
    trustProxy: e.TRUST_PROXY,
    uploads: {
      maxFileBytes: e.UPLOAD_MAX_FILE_MB * MB,
      maxTotalBytes: e.UPLOAD_MAX_TOTAL_MB * MB,
      maxFiles: e.UPLOAD_MAX_FILES,
      archive: {
        maxEntries: e.ARCHIVE_MAX_ENTRIES,
        maxExpandedBytes: e.ARCHIVE_MAX_EXPANDED_MB * MB,
        maxEntryBytes: e.UPLOAD_MAX_FILE_MB * MB,
        maxRatio: e.ARCHIVE_MAX_RATIO,
      },
    },
    jobs: {
      runner: e.JOB_RUNNER,
      scanThreads: e.SCAN_THREADS,
      scanTimeLimitMs: e.SCAN_TIME_LIMIT_S * 1000,
      yieldToWeb: e.SCAN_YIELD_TO_WEB === '1',
      leaseMs: e.JOB_LEASE_SECONDS * 1000,
      queue: e.JOB_QUEUE === 'sqlite' ? { kind: 'sqlite' } : { kind: 'redis', url: e.JOB_QUEUE },
      worker: { serverUrl: e.REDWARD_SERVER_URL?.replace(/\/$/, ''), token: e.REDWARD_WORKER_TOKEN },
    },
    linkToleranceArcsec: e.LINK_TOLERANCE_ARCSEC,
    photoZJobThreshold: e.PHOTOZ_JOB_THRESHOLD,
    version: readVersion(),
  };
}
