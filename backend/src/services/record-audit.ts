import type { Db } from '../db/client';
import { auditEvents } from '../db/schema';

type Tx = Pick<Db, 'insert'>;

export interface AuditEntry {
  actorId: number | null;
  action: string;
  subjectType: string;
  subjectId?: number | null;
  campaignId?: number | null;
  before?: unknown;
  after?: unknown;
}

/** Appends one audit event; called inside the same transaction as the change it records. */
export function recordAudit(tx: Tx, entry: AuditEntry): void {
  tx.insert(auditEvents)
    .values({
      actorId: entry.actorId,
      action: entry.action,
      subjectType: entry.subjectType,
      subjectId: entry.subjectId ?? null,
      campaignId: entry.campaignId ?? null,
      before: entry.before ?? null,
      after: entry.after ?? null,
    })
    .run();
}
