import { createHash, randomBytes } from 'node:crypto';
import { and, desc, eq, isNull } from 'drizzle-orm';
import type { ApiToken } from '../contracts/auth';
import { apiTokens, users } from '../db/schema';
import { conflict, notFound } from '../http/errors';
import type { Actor, ServiceContext } from './context';
import { recordAudit } from './record-audit';

const TOKEN_PREFIX = 'rwpat_';
const hash = (token: string) => createHash('sha256').update(token).digest('hex');

const view = (t: typeof apiTokens.$inferSelect): ApiToken => ({
  id: t.id,
  name: t.name,
  prefix: t.prefix,
  createdAt: t.createdAt,
  lastUsedAt: t.lastUsedAt,
  revokedAt: t.revokedAt,
});

/** Creates a token for scripts; the plain token is returned once and never stored. */
export function createApiToken(ctx: ServiceContext, actor: Actor, name: string): { token: string; apiToken: ApiToken } {
  const token = TOKEN_PREFIX + randomBytes(32).toString('base64url');
  return ctx.db.transaction((tx) => {
    const row = tx.insert(apiTokens).values({ userId: actor.id, name, tokenHash: hash(token), prefix: token.slice(0, TOKEN_PREFIX.length + 6) }).returning().get();
    recordAudit(tx, { actorId: actor.id, action: 'token.created', subjectType: 'api_token', subjectId: row.id, after: { name, prefix: row.prefix } });
    return { token, apiToken: view(row) };
  });
}

export function listApiTokens(ctx: ServiceContext, actor: Actor): ApiToken[] {
  return ctx.db.select().from(apiTokens).where(eq(apiTokens.userId, actor.id)).orderBy(desc(apiTokens.id)).all().map(view);
}

export function revokeApiToken(ctx: ServiceContext, actor: Actor, tokenId: number): ApiToken {
  return ctx.db.transaction((tx) => {
    const row = tx.select().from(apiTokens).where(and(eq(apiTokens.id, tokenId), eq(apiTokens.userId, actor.id))).get();
    if (!row) throw notFound('No such token.', 'token_not_found');
    if (row.revokedAt) throw conflict('This token is already revoked.', 'token_revoked');
    const revoked = tx.update(apiTokens).set({ revokedAt: ctx.now().toISOString() }).where(eq(apiTokens.id, tokenId)).returning().get();
    recordAudit(tx, { actorId: actor.id, action: 'token.revoked', subjectType: 'api_token', subjectId: tokenId, after: { prefix: row.prefix } });
    return view(revoked);
  });
}

/** The person behind a bearer token, or null for an unknown, revoked or disabled one. */
export function findTokenUser(ctx: ServiceContext, token: string): Actor | null {
  if (!token.startsWith(TOKEN_PREFIX)) return null;
  const row = ctx.db
    .select({ tokenId: apiTokens.id, id: users.id, email: users.email, name: users.name, isAdmin: users.isAdmin, disabled: users.disabled })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(and(eq(apiTokens.tokenHash, hash(token)), isNull(apiTokens.revokedAt)))
    .get();
  if (!row || row.disabled) return null;
  ctx.db.update(apiTokens).set({ lastUsedAt: ctx.now().toISOString() }).where(eq(apiTokens.id, row.tokenId)).run();
  return { id: row.id, email: row.email, name: row.name, isAdmin: row.isAdmin };
}
