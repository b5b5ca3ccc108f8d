import { eq } from 'drizzle-orm';
import { users } from '../db/schema';
import type { Actor, ServiceContext } from './context';
import { recordAudit } from './record-audit';

export function updateAccount(ctx: ServiceContext, actor: Actor, name: string): Actor {
  return ctx.db.transaction((tx) => {
    tx.update(users).set({ name }).where(eq(users.id, actor.id)).run();
    recordAudit(tx, {
      actorId: actor.id,
      action: 'account.renamed',
      subjectType: 'user',
      subjectId: actor.id,
      before: { name: actor.name },
      after: { name },
    });
    return { ...actor, name };
  });
}
