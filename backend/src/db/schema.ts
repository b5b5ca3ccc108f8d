import { sql } from 'drizzle-orm';
import { blob, customType, index, integer, real, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { readStoredGradeScheme, type GradeScheme } from '../contracts/grades';
import type { FluxUnit } from '../spectra/types';
import type { StoredLineMeasurements } from '../contracts/line-measurements';

// Timestamps are ISO-8601 UTC strings: readable in the SQLite shell and sortable as text.
const now = sql`(strftime('%Y-%m-%dT%H:%M:%fZ', 'now'))`;
const createdAt = () => text('created_at').notNull().default(now);

/**
 * A grade scheme, stored as JSON text as written. Read through readStoredGradeScheme, so schemes
 * saved with the numeric codes of before (4 … 0) come back as text codes without being rewritten.
 */
const gradeSchemeJson = customType<{ data: GradeScheme; driverData: string }>({
  dataType: () => 'text',
  toDriver: (scheme) => JSON.stringify(scheme),
  fromDriver: (stored) => readStoredGradeScheme(JSON.parse(stored)),
});

export const users = sqliteTable('users', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  email: text('email').notNull().unique(),
  name: text('name').notNull(),
  passwordHash: text('password_hash').notNull(),
  isAdmin: integer('is_admin', { mode: 'boolean' }).notNull().default(false),
  disabled: integer('disabled', { mode: 'boolean' }).notNull().default(false),
  lastLoginAt: text('last_login_at'),
  createdAt: createdAt(),
});

export const campaigns = sqliteTable('campaigns', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  name: text('name').notNull(),
  description: text('description').notNull().default(''),
  zMin: real('z_min').notNull().default(0),
  zMax: real('z_max').notNull().default(9),
  /** The scan's log-λ grid: 'default' (1e-4 dex ≈ 69 km/s) or 'native' (each file's own median pixel). */
  gridStep: text('grid_step', { enum: ['default', 'native'] }).notNull().default('default'),
  /** Agreement tolerance between two readings, in |Δz|/(1+z). */
  tolerance: real('tolerance').notNull().default(0.003),
  gradeScheme: gradeSchemeJson('grade_scheme').notNull(),
  createdBy: integer('created_by').references(() => users.id),
  createdAt: createdAt(),
  updatedAt: text('updated_at').notNull().default(now),
});

export const memberships = sqliteTable(
  'memberships',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    userId: integer('user_id').notNull().references(() => users.id),
    campaignId: integer('campaign_id').notNull().references(() => campaigns.id),
    role: text('role', { enum: ['lead', 'reader', 'observer'] }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('memberships_user_campaign').on(t.userId, t.campaignId), index('memberships_campaign').on(t.campaignId)],
);

export const invitations = sqliteTable(
  'invitations',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    /** sha-256 of the token; the token itself exists only in the e-mail. */
    tokenHash: text('token_hash').notNull().unique(),
    email: text('email').notNull(),
    campaignId: integer('campaign_id').notNull().references(() => campaigns.id),
    role: text('role', { enum: ['lead', 'reader', 'observer'] }).notNull(),
    invitedBy: integer('invited_by').notNull().references(() => users.id),
    expiresAt: text('expires_at').notNull(),
    acceptedAt: text('accepted_at'),
    acceptedBy: integer('accepted_by').references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index('invitations_campaign').on(t.campaignId)],
);

export const auditEvents = sqliteTable(
  'audit_events',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    /** Null for events the system itself records (demo seed, migrations). */
    actorId: integer('actor_id').references(() => users.id),
    action: text('action').notNull(),
    subjectType: text('subject_type').notNull(),
    subjectId: integer('subject_id'),
    campaignId: integer('campaign_id').references(() => campaigns.id),
    before: text('before', { mode: 'json' }),
    after: text('after', { mode: 'json' }),
    createdAt: createdAt(),
  },
  (t) => [index('audit_events_subject').on(t.subjectType, t.subjectId), index('audit_events_campaign').on(t.campaignId)],
);

/**
 * One signed-in browser. The session cookie carries only `id` (sealed by iron-session), so
 * signing out, a password change or an admin's "sign out everywhere" ends a session by setting
 * `revoked_at`, and every request finds it by primary key.
 */
export const sessions = sqliteTable(
  'sessions',
  {
    /** 32 random bytes, base64url. */
    id: text('id').primaryKey(),
    userId: integer('user_id').notNull().references(() => users.id),
    createdAt: createdAt(),
    /** Refreshed at most every few minutes, so reads stay reads. */
    lastSeenAt: text('last_seen_at').notNull(),
    expiresAt: text('expires_at').notNull(),
    revokedAt: text('revoked_at'),
  },
  (t) => [index('sessions_user').on(t.userId)],
);

export const mailMessages = sqliteTable('mail_messages', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  fromAddress: text('from_address').notNull(),
  toAddress: text('to_address').notNull(),
  subject: text('subject').notNull(),
  textBody: text('text_body').notNull(),
  htmlBody: text('html_body'),
  /** The message as received, for anyone who needs to see the headers. */
  raw: text('raw').notNull(),
  receivedAt: createdAt(),
});

// ── Ingest: stored files, targets, spectra, durable jobs, scan results ─────────────────────────

/** Every uploaded file, once, by content. The bytes live under DATA_DIR/uploads/<aa>/<sha256>. */
export const storedFiles = sqliteTable('stored_files', {
  sha256: text('sha256').primaryKey(),
  sizeBytes: integer('size_bytes').notNull(),
  createdAt: createdAt(),
});

export const targets = sqliteTable(
  'targets',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    campaignId: integer('campaign_id').notNull().references(() => campaigns.id),
    /** The catalogue's own identifier, unique within the campaign. */
    catalogueId: text('catalogue_id').notNull(),
    /** Degrees, J2000. */
    ra: real('ra'),
    dec: real('dec'),
    magnitude: real('magnitude'),
    photoZ: real('photo_z'),
    /** The photometric redshift's 68 % range. */
    photoZLow: real('photo_z_low'),
    photoZHigh: real('photo_z_high'),
    imageFamily: text('image_family'),
    priority: integer('priority'),
    /** Catalogue columns Redward has no field for, kept as they were. */
    extra: text('extra', { mode: 'json' }).$type<Record<string, string>>().notNull().default({}),
    createdAt: createdAt(),
    updatedAt: text('updated_at').notNull().default(now),
  },
  (t) => [uniqueIndex('targets_campaign_catalogue_id').on(t.campaignId, t.catalogueId), index('targets_family').on(t.campaignId, t.imageFamily)],
);

export const JOB_STATES = ['queued', 'running', 'done', 'failed', 'cancelled'] as const;
export type JobState = (typeof JOB_STATES)[number];

/**
 * Durable background work. A runner claims a job by setting a lease; a job whose lease ran out
 * (its runner crashed) is queued again on the next start. Items record per-file progress, so
 * a resumed job neither repeats nor loses work.
 */
export const jobs = sqliteTable(
  'jobs',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    kind: text('kind', { enum: ['ingest', 'scan', 'photoz'] }).notNull(),
    campaignId: integer('campaign_id').notNull().references(() => campaigns.id),
    createdBy: integer('created_by').references(() => users.id),
    state: text('state', { enum: JOB_STATES }).notNull().default('queued'),
    done: integer('done').notNull().default(0),
    total: integer('total').notNull().default(0),
    attempts: integer('attempts').notNull().default(0),
    leaseExpiresAt: text('lease_expires_at'),
    cancelRequested: integer('cancel_requested', { mode: 'boolean' }).notNull().default(false),
    /** Settings the job runs with (redshift range, engine options), fixed when it is queued. */
    settings: text('settings', { mode: 'json' }).$type<Record<string, unknown>>().notNull().default({}),
    /** Failures of the job itself (not of one file), as a sentence. */
    failure: text('failure'),
    createdAt: createdAt(),
    startedAt: text('started_at'),
    finishedAt: text('finished_at'),
  },
  (t) => [index('jobs_state').on(t.state), index('jobs_campaign').on(t.campaignId)],
);

export const JOB_ITEM_STATES = ['pending', 'done', 'failed'] as const;

export const jobItems = sqliteTable(
  'job_items',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    jobId: integer('job_id').notNull().references(() => jobs.id),
    /** The file as the person named it (archive entries as "archive.zip/folder/file.fits"). */
    fileName: text('file_name').notNull(),
    sha256: text('sha256').references(() => storedFiles.sha256),
    spectrumId: integer('spectrum_id'),
    state: text('state', { enum: JOB_ITEM_STATES }).notNull().default('pending'),
    /** What happened: stored (new spectrum), duplicate (already in the campaign), rescanned. */
    outcome: text('outcome', { enum: ['stored', 'duplicate', 'rescanned'] }),
    errorCode: text('error_code'),
    errorMessage: text('error_message'),
  },
  (t) => [index('job_items_job_state').on(t.jobId, t.state)],
);

export const spectra = sqliteTable(
  'spectra',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    campaignId: integer('campaign_id').notNull().references(() => campaigns.id),
    sha256: text('sha256').notNull().references(() => storedFiles.sha256),
    fileName: text('file_name').notNull(),
    targetId: integer('target_id').references(() => targets.id),
    /** How the target was found: catalogue id in the file name, the OBJECT keyword, position, or by hand. */
    linkMethod: text('link_method', { enum: ['file-name', 'object-keyword', 'position', 'manual'] }),
    objectName: text('object_name'),
    ra: real('ra'),
    dec: real('dec'),
    instrument: text('instrument'),
    exposureS: real('exposure_s'),
    dateObs: text('date_obs'),
    /** The file's flux unit, normalised (null for spectra stored before units were read: re-read from the file). */
    fluxUnit: text('flux_unit', { mode: 'json' }).$type<FluxUnit>(),
    medium: text('medium', { enum: ['air', 'vacuum'] }).notNull(),
    pixels: integer('pixels').notNull(),
    wavelengthMin: real('wavelength_min').notNull(),
    wavelengthMax: real('wavelength_max').notNull(),
    snrMedian: real('snr_median'),
    errorsEstimated: integer('errors_estimated', { mode: 'boolean' }).notNull(),
    warnings: text('warnings', { mode: 'json' }).$type<string[]>().notNull().default([]),
    uploadJobId: integer('upload_job_id').references(() => jobs.id),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('spectra_campaign_sha256').on(t.campaignId, t.sha256), index('spectra_target').on(t.targetId)],
);

/**
 * The engine's answer for one spectrum. A re-scan adds a row and moves `is_current`; older
 * results stay for the record.
 */
export const scanResults = sqliteTable(
  'scan_results',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    spectrumId: integer('spectrum_id').notNull().references(() => spectra.id),
    jobId: integer('job_id').references(() => jobs.id),
    engineVersion: text('engine_version').notNull(),
    settings: text('settings', { mode: 'json' }).$type<Record<string, unknown>>().notNull(),
    spectrumClass: text('spectrum_class').notNull(),
    /** Top solution, denormalised for sorting and filtering the spectra list. */
    zBest: real('z_best'),
    zBestErr: real('z_best_err'),
    solutions: text('solutions', { mode: 'json' }).notNull(),
    lineMatches: text('line_matches', { mode: 'json' }).notNull(),
    meta: text('meta', { mode: 'json' }).notNull(),
    /** χ²(z) curves packed as float32 (see services/scan-curves.ts). */
    curves: blob('curves', { mode: 'buffer' }).notNull(),
    isCurrent: integer('is_current', { mode: 'boolean' }).notNull().default(true),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex('scan_results_one_current').on(t.spectrumId).where(sql`${t.isCurrent} = 1`),
    index('scan_results_spectrum').on(t.spectrumId),
  ],
);

// ── Reading: assignments and readings ──────────────────────────────────────────────────────────

export const READING_ORDERS = ['first', 'second'] as const;

/** Who reads which spectrum, and in which of the two independent readings. */
export const assignments = sqliteTable(
  'assignments',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    spectrumId: integer('spectrum_id').notNull().references(() => spectra.id),
    readerId: integer('reader_id').notNull().references(() => users.id),
    readingOrder: text('reading_order', { enum: READING_ORDERS }).notNull(),
    assignedBy: integer('assigned_by').references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex('assignments_spectrum_reader').on(t.spectrumId, t.readerId),
    uniqueIndex('assignments_spectrum_order').on(t.spectrumId, t.readingOrder),
    index('assignments_reader').on(t.readerId),
  ],
);

export const SPECTRUM_CLASSES = ['galaxy', 'quasar', 'star', 'lyman-break', 'unknown'] as const;

/**
 * One person's verdict on one spectrum. A reader revises their reading in place until it is
 * confirmed; each revision's before/after is in the audit trail and `revision` counts them.
 */
export const readings = sqliteTable(
  'readings',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    spectrumId: integer('spectrum_id').notNull().references(() => spectra.id),
    readerId: integer('reader_id').notNull().references(() => users.id),
    readingOrder: text('reading_order', { enum: READING_ORDERS }).notNull(),
    z: real('z').notNull(),
    zErr: real('z_err'),
    /** The grade's code in the campaign's scheme ("sure"; "4" in schemes made before codes were words). */
    grade: text('grade').notNull(),
    spectrumClass: text('spectrum_class', { enum: SPECTRUM_CLASSES }).notNull(),
    lines: text('lines', { mode: 'json' }).$type<string[]>().notNull(),
    /**
     * The lines used, measured in the data at the reading's z when it was saved, with the flux
     * unit and the resolution floor of its error. Null for readings saved before lines were measured.
     */
    lineMeasurements: text('line_measurements', { mode: 'json' }).$type<StoredLineMeasurements>(),
    note: text('note').notNull().default(''),
    /** Time the reader spent on the spectrum, summed over revisions, milliseconds. */
    timeSpentMs: integer('time_spent_ms').notNull().default(0),
    revision: integer('revision').notNull().default(1),
    /** Set when the reading is part of a confirmed redshift; it can no longer be revised. */
    lockedAt: text('locked_at'),
    createdAt: createdAt(),
    updatedAt: text('updated_at').notNull().default(now),
  },
  (t) => [uniqueIndex('readings_spectrum_reader').on(t.spectrumId, t.readerId), index('readings_reader').on(t.readerId)],
);

// ── Release: confirmed redshifts and disagreements ──────────────────────────────────────────────

/**
 * The released redshift of a spectrum. Never changed in place: a correction adds a row that
 * supersedes the current one (`is_current` moves, `supersedes_id` points back), so the history
 * of every released value stays readable.
 */
export const confirmedRedshifts = sqliteTable(
  'confirmed_redshifts',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    spectrumId: integer('spectrum_id').notNull().references(() => spectra.id),
    z: real('z').notNull(),
    zErr: real('z_err'),
    /** The grade's code in the campaign's scheme ("sure"; "4" in schemes made before codes were words). */
    grade: text('grade').notNull(),
    spectrumClass: text('spectrum_class', { enum: SPECTRUM_CLASSES }).notNull(),
    lines: text('lines', { mode: 'json' }).$type<string[]>().notNull(),
    /** The measurements of `lines` taken from the readings behind this value; null before lines were measured. */
    lineMeasurements: text('line_measurements', { mode: 'json' }).$type<StoredLineMeasurements>(),
    method: text('method', { enum: ['agreement', 'settlement', 'correction'] }).notNull(),
    firstReadingId: integer('first_reading_id').references(() => readings.id),
    secondReadingId: integer('second_reading_id').references(() => readings.id),
    /** Who settled or corrected; null when two readings agreed. */
    decidedBy: integer('decided_by').references(() => users.id),
    reason: text('reason'),
    supersedesId: integer('supersedes_id'),
    isCurrent: integer('is_current', { mode: 'boolean' }).notNull().default(true),
    supersededAt: text('superseded_at'),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex('confirmed_one_current').on(t.spectrumId).where(sql`${t.isCurrent} = 1`),
    index('confirmed_spectrum').on(t.spectrumId),
  ],
);

export const disagreements = sqliteTable(
  'disagreements',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    spectrumId: integer('spectrum_id').notNull().references(() => spectra.id),
    campaignId: integer('campaign_id').notNull().references(() => campaigns.id),
    firstReadingId: integer('first_reading_id').notNull().references(() => readings.id),
    secondReadingId: integer('second_reading_id').notNull().references(() => readings.id),
    /** Which tests failed: 'z', 'grade', 'class'. */
    reasons: text('reasons', { mode: 'json' }).$type<string[]>().notNull(),
    state: text('state', { enum: ['open', 'settled', 'agreed-on-revision'] }).notNull().default('open'),
    /** A third reader the lead asked to settle it (null: the lead settles). */
    delegatedTo: integer('delegated_to').references(() => users.id),
    confirmedId: integer('confirmed_id').references(() => confirmedRedshifts.id),
    openedAt: createdAt(),
    closedAt: text('closed_at'),
  },
  (t) => [
    uniqueIndex('disagreements_one_open').on(t.spectrumId).where(sql`${t.state} = 'open'`),
    index('disagreements_campaign').on(t.campaignId, t.state),
  ],
);

/** Personal access tokens for scripts. Only a hash is stored; the token is shown once. */
export const apiTokens = sqliteTable(
  'api_tokens',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    userId: integer('user_id').notNull().references(() => users.id),
    name: text('name').notNull(),
    tokenHash: text('token_hash').notNull().unique(),
    /** The first characters, so a person can tell their tokens apart. */
    prefix: text('prefix').notNull(),
    lastUsedAt: text('last_used_at'),
    revokedAt: text('revoked_at'),
    createdAt: createdAt(),
  },
  (t) => [index('api_tokens_user').on(t.userId)],
);

// ── Photometry: catalogue fluxes and their photometric redshifts ──────────────────────────────

/**
 * One band of one target as the catalogue gave it, and in nJy for the fit. A non-detection is a
 * measurement (zero or negative flux with its error; for magnitudes, the limit as given); a band
 * not observed has no row.
 */
export const targetPhotometry = sqliteTable(
  'target_photometry',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    targetId: integer('target_id').notNull().references(() => targets.id),
    /** A shipped filter's file stem or the name of one of the campaign's own curves. */
    filter: text('filter').notNull(),
    fluxNjy: real('flux_njy').notNull(),
    errNjy: real('err_njy').notNull(),
    /** The cells as the catalogue wrote them, and their unit: 'nJy', 'uJy' or 'ABmag'. */
    givenValue: real('given_value').notNull(),
    givenError: real('given_error').notNull(),
    unit: text('unit').notNull(),
  },
  (t) => [uniqueIndex('target_photometry_band').on(t.targetId, t.filter)],
);

/** A campaign's own filter curve (two-column text, validated by parseFilterCurve). Names are never reused. */
export const campaignFilters = sqliteTable(
  'campaign_filters',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    campaignId: integer('campaign_id').notNull().references(() => campaigns.id),
    name: text('name').notNull(),
    curveText: text('curve_text').notNull(),
    createdBy: integer('created_by').references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('campaign_filters_name').on(t.campaignId, t.name)],
);

/** The column mapping of a campaign's last accepted catalogue import, proposed again next time. */
export const catalogueMappings = sqliteTable('catalogue_mappings', {
  campaignId: integer('campaign_id').primaryKey().references(() => campaigns.id),
  mapping: text('mapping', { mode: 'json' }).$type<Record<string, unknown>>().notNull(),
  updatedAt: text('updated_at').notNull().default(now),
});

/**
 * A target's photometric redshift computed from its catalogue fluxes; recomputed (replaced) when
 * its photometry changes. P(z) is float32 on the fit's redshift grid (see services/photo-z-fits.ts).
 */
export const photoZFits = sqliteTable(
  'photo_z_fits',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    targetId: integer('target_id').notNull().references(() => targets.id),
    z: real('z').notNull(),
    z68Low: real('z68_low').notNull(),
    z68High: real('z68_high').notNull(),
    z95Low: real('z95_low').notNull(),
    z95High: real('z95_high').notNull(),
    pLowZ: real('p_low_z').notNull(),
    /** 'galaxy' or 'star': whichever of the best galaxy and the best star has the lower χ². */
    fitClass: text('fit_class').notNull(),
    starChi2: real('star_chi2').notNull(),
    galaxyChi2: real('galaxy_chi2').notNull(),
    galaxyTemplate: text('galaxy_template').notNull(),
    starTemplate: text('star_template'),
    /** The bands that carried a measurement, in fit order. */
    filters: text('filters', { mode: 'json' }).$type<string[]>().notNull(),
    /** Template set and redshift grid the fit used, so a stored P(z) can be read back and stated in exports. */
    templateSet: text('template_set').notNull(),
    gridZMax: real('grid_z_max').notNull(),
    gridStep: real('grid_step').notNull(),
    posterior: blob('posterior', { mode: 'buffer' }).notNull(),
    computedAt: text('computed_at').notNull(),
  },
  (t) => [uniqueIndex('photo_z_fits_target').on(t.targetId)],
);

/**
 * Credentials of scan workers (`npm run jobs` with JOB_QUEUE=redis://…) on other machines. A
 * worker token belongs to no person and grants only the worker routes (take an item's file, post
 * its result); only a hash is stored, the token is shown once.
 */
export const workerTokens = sqliteTable('worker_tokens', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  name: text('name').notNull(),
  tokenHash: text('token_hash').notNull().unique(),
  /** The first characters, so an admin can tell tokens apart. */
  prefix: text('prefix').notNull(),
  createdBy: integer('created_by').references(() => users.id),
  lastUsedAt: text('last_used_at'),
  revokedAt: text('revoked_at'),
  createdAt: createdAt(),
});
