import { randomBytes } from 'node:crypto';
import { and, count, eq, gt, isNull, lt, ne, sql } from 'drizzle-orm';
import { preparedQuery } from '../db/prepared';
import { sessions, users } from '../db/schema';
import { notFound } from '../http/errors';
import type { Actor, ServiceContext } from './context';
import { recordAudit } from './record-audit';

/** How long a sign-in lasts, from the moment it was made (not extended by use). */
export const SESSION_TTL_MS = 14 * 24 * 3600 * 1000;
/** `last_seen_at` is rewritten only when older than this, so most requests write nothing. */
const LAST_SEEN_RESOLUTION_MS = 5 * 60 * 1000;

const iso = (d: Date) => d.toISOString();

/** Records a new signed-in browser and returns the id its cookie will carry. */
export function startSession(ctx: ServiceContext, userId: number): string {
  const id = randomBytes(32).toString('base64url');
  const now = ctx.now();
  ctx.db.transaction((tx) => {
    // Sessions that ran out are of no further use; tidying them here keeps the table small.
    tx.delete(sessions).where(and(eq(sessions.userId, userId), lt(sessions.expiresAt, iso(now)))).run();
    tx.insert(sessions)
      .values({ id, userId, createdAt: iso(now), lastSeenAt: iso(now), expiresAt: iso(new Date(now.getTime() + SESSION_TTL_MS)) })
      .run();
  });
  return id;
}

/**
 * The person behind a session cookie, or null when the session is unknown, ended or expired, or
 * its account disabled. One primary-key lookup joined to the user.
 */
// Every signed-in request asks this.
const sessionWithUser = preparedQuery((db) =>
  db
    .select({ id: users.id, email: users.email, name: users.name, isAdmin: users.isAdmin, disabled: users.disabled, lastSeenAt: sessions.lastSeenAt, expiresAt: sessions.expiresAt, revokedAt: sessions.revokedAt })
    .from(sessions)
    .innerJoin(users, eq(users.id, sessions.userId))
    .where(eq(sessions.id, sql.placeholder('sessionId')))
    .prepare(),
);

export function findSessionUser(ctx: ServiceContext, sessionId: string): Actor | null {
  const now = ctx.now();
  const row = sessionWithUser(ctx.db).get({ sessionId });
  if (!row || row.disabled || row.revokedAt !== null || row.expiresAt <= iso(now)) return null;
  if (now.getTime() - Date.parse(row.lastSeenAt) > LAST_SEEN_RESOLUTION_MS) {
    ctx.db.update(sessions).set({ lastSeenAt: iso(now) }).where(eq(sessions.id, sessionId)).run();
  }
  return { id: row.id, email: row.email, name: row.name, isAdmin: row.isAdmin };
}

/** Ends one session (signing out). Unknown or already ended sessions are left as they are. */
export function endSession(ctx: ServiceContext, sessionId: string): void {
  ctx.db.update(sessions).set({ revokedAt: iso(ctx.now()) }).where(and(eq(sessions.id, sessionId), isNull(sessions.revokedAt))).run();
}

const live = (ctx: ServiceContext) => and(isNull(sessions.revokedAt), gt(sessions.expiresAt, iso(ctx.now())));

/**
 * Ends every live session of a user except `keep` (the browser that changed the password).
 * Runs inside the caller's transaction when given one. Returns how many ended.
 */
export function endUserSessions(ctx: ServiceContext, userId: number, keep?: string, tx: Pick<ServiceContext['db'], 'update'> = ctx.db): number {
  const except = keep === undefined ? undefined : ne(sessions.id, keep);
  return tx
    .update(sessions)
    .set({ revokedAt: iso(ctx.now()) })
    .where(and(eq(sessions.userId, userId), live(ctx), except))
    .run().changes;
}

/** Live sessions per user, for the admin's user list. */
export function countLiveSessions(ctx: ServiceContext): Map<number, number> {
  return new Map(
    ctx.db
      .select({ userId: sessions.userId, n: count() })
      .from(sessions)
      .where(live(ctx))
      .groupBy(sessions.userId)
      .all()
      .map((r) => [r.userId, r.n]),
  );
}

/**
 * An admin's "sign out everywhere": ends every session of the account (theirs too when they name
 * themselves). Personal access tokens are separate credentials and keep working; the owner or a
 * disabled account ends those.
 */
export function signOutEverywhere(ctx: ServiceContext, actor: Actor, userId: number): number {
  return ctx.db.transaction((tx) => {
    const user = tx.select({ id: users.id }).from(users).where(eq(users.id, userId)).get();
    if (!user) throw notFound('No such user.', 'user_not_found');
    const ended = endUserSessions(ctx, userId, undefined, tx);
    recordAudit(tx, { actorId: actor.id, action: 'user.signed_out_everywhere', subjectType: 'user', subjectId: userId, after: { sessionsEnded: ended } });
    return ended;
  });
}
