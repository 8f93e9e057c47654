/** Appends to the audit trail. Rows are never updated or deleted (the migration's triggers refuse it). */
import type { Db } from '../../db/client';
import { insertAudit } from '../repos/audit-repo';

export interface AuditEntry {
  organisationId?: number | null;
  actorUserId?: number | null;
  action: string;
  targetType?: string;
  targetId?: string | number;
  details?: Record<string, unknown>;
}

export function recordAudit(db: Db, entry: AuditEntry): void {
  insertAudit(db, {
    organisationId: entry.organisationId ?? null,
    actorUserId: entry.actorUserId ?? null,
    action: entry.action,
    targetType: entry.targetType ?? null,
    targetId: entry.targetId === undefined ? null : String(entry.targetId),
    details: entry.details ?? null,
  });
}
