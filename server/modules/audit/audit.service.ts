import { auditEvents } from '../../../db/schema/audit';
import type { DbOrTx } from '../../../db/client';

export interface AuditEntry {
  actorUserId: number | null;
  organisationId?: number | null;
  action: string;
  entityType: string;
  entityId: string | number;
  details?: Record<string, unknown>;
}

/** Write one audit event; pass the transaction so that the event and the change commit together. */
export async function audit(tx: DbOrTx, entry: AuditEntry): Promise<void> {
  await tx.insert(auditEvents).values({
    actorUserId: entry.actorUserId,
    organisationId: entry.organisationId ?? null,
    action: entry.action,
    entityType: entry.entityType,
    entityId: String(entry.entityId),
    details: entry.details ?? {},
  });
}
