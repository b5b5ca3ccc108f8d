import { sql } from 'drizzle-orm';
import { index, integer, real, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';
import type { GradeScheme } from '../contracts/grades';

// Timestamps are ISO-8601 UTC strings: readable in the SQLite shell and sortable as text.
const now = sql`(strftime('%Y-%m-%dT%H:%M:%fZ', 'now'))`;
const createdAt = () => text('created_at').notNull().default(now);

export const users = sqliteTable('users', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  email: text('email').notNull().unique(),
  name: text('name').notNull(),
  passwordHash: text('password_hash').notNull(),
  isAdmin: integer('is_admin', { mode: 'boolean' }).notNull().default(false),
  disabled: integer('disabled', { mode: 'boolean' }).notNull().default(false),
  /** Bumped on password change: sessions issued under an older epoch are refused. */
  sessionEpoch: integer('session_epoch').notNull().default(0),
  lastLoginAt: text('last_login_at'),
  createdAt: createdAt(),
});

export const campaigns = sqliteTable('campaigns', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  name: text('name').notNull(),
  description: text('description').notNull().default(''),
  zMin: real('z_min').notNull().default(0),
  zMax: real('z_max').notNull().default(9),
  /** Agreement tolerance between two readings, in |Δz|/(1+z). */
  tolerance: real('tolerance').notNull().default(0.003),
  gradeScheme: text('grade_scheme', { mode: 'json' }).$type<GradeScheme>().notNull(),
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
