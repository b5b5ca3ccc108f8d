import { createHash, randomBytes } from 'node:crypto';
import { desc, eq, and, isNull } from 'drizzle-orm';
import type { WorkerToken } from '../contracts/workers';
import { workerTokens } from '../db/schema';
import { conflict, notFound } from '../http/errors';
import type { Actor, ServiceContext } from './context';
import { recordAudit } from './record-audit';

/** Distinct from personal tokens (rwpat_), so the session middleware can tell the two kinds apart. */
export const WORKER_TOKEN_PREFIX = 'rwwkr_';
const hash = (token: string) => createHash('sha256').update(token).digest('hex');

/** A scan worker as the worker routes see it. */
export interface WorkerIdentity {
  tokenId: number;
  name: string;
}

const view = (t: typeof workerTokens.$inferSelect): WorkerToken => ({
  id: t.id,
  name: t.name,
  prefix: t.prefix,
  createdAt: t.createdAt,
  lastUsedAt: t.lastUsedAt,
  revokedAt: t.revokedAt,
});

/** Creates a worker token (the plain token is returned once and never stored). `actor` null: made on the server's console. */
export function createWorkerToken(ctx: Pick<ServiceContext, 'db'>, actor: Actor | null, name: string): { token: string; workerToken: WorkerToken } {
  const token = WORKER_TOKEN_PREFIX + randomBytes(32).toString('base64url');
  return ctx.db.transaction((tx) => {
    const row = tx
      .insert(workerTokens)
      .values({ name, tokenHash: hash(token), prefix: token.slice(0, WORKER_TOKEN_PREFIX.length + 6), createdBy: actor?.id ?? null })
      .returning()
      .get();
    recordAudit(tx, { actorId: actor?.id ?? null, action: 'worker_token.created', subjectType: 'worker_token', subjectId: row.id, after: { name, prefix: row.prefix } });
    return { token, workerToken: view(row) };
  });
}

export function listWorkerTokens(ctx: ServiceContext): WorkerToken[] {
  return ctx.db.select().from(workerTokens).orderBy(desc(workerTokens.id)).all().map(view);
}

export function revokeWorkerToken(ctx: ServiceContext, actor: Actor, tokenId: number): WorkerToken {
  return ctx.db.transaction((tx) => {
    const row = tx.select().from(workerTokens).where(eq(workerTokens.id, tokenId)).get();
    if (!row) throw notFound('No such worker token.', 'worker_token_not_found');
    if (row.revokedAt) throw conflict('This worker token is already revoked.', 'worker_token_revoked');
    const revoked = tx.update(workerTokens).set({ revokedAt: ctx.now().toISOString() }).where(eq(workerTokens.id, tokenId)).returning().get();
    recordAudit(tx, { actorId: actor.id, action: 'worker_token.revoked', subjectType: 'worker_token', subjectId: tokenId, after: { prefix: row.prefix } });
    return view(revoked);
  });
}

// A busy worker authenticates twice per item; writing last_used_at each time would add a write
// per request for a figure that is only read by people. Once a minute per token is plenty.
const LAST_USED_EVERY_MS = 60_000;

/** The worker behind a bearer token, or null for an unknown or revoked one. */
export function findWorker(ctx: ServiceContext, token: string): WorkerIdentity | null {
  if (!token.startsWith(WORKER_TOKEN_PREFIX)) return null;
  const row = ctx.db
    .select({ id: workerTokens.id, name: workerTokens.name, lastUsedAt: workerTokens.lastUsedAt })
    .from(workerTokens)
    .where(and(eq(workerTokens.tokenHash, hash(token)), isNull(workerTokens.revokedAt)))
    .get();
  if (!row) return null;
  const now = ctx.now();
  if (!row.lastUsedAt || now.getTime() - Date.parse(row.lastUsedAt) > LAST_USED_EVERY_MS) {
    ctx.db.update(workerTokens).set({ lastUsedAt: now.toISOString() }).where(eq(workerTokens.id, row.id)).run();
  }
  return { tokenId: row.id, name: row.name };
}
