/**
 * The audit trail: appending to it (rows are never updated or deleted: the migration's triggers
 * refuse it) and the admin's filtered reading of it.
 */
import type { Db } from '../../db/client';
import { AUDIT_KIND_ACTIONS, AUDIT_LIST_LIMIT, auditKindOf, type AuditQuery } from '../../constants/schemas/audit';
import { unprocessable } from '../http-error';
import { insertAudit, listOrganisationAudit } from '../repos/audit-repo';
import { findFiling } from '../repos/filings-repo';
import { findMembership } from '../repos/users-repo';

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

/**
 * The admin's activity view: the organisation's entries, newest first, filtered by filing, person
 * and kind. A filing or person the organisation does not have is a 422 that says so (the same
 * words whether it exists elsewhere or not). Each entry says its kind and, when it is about a
 * filing, which one.
 */
export function listActivity(db: Db, organisationId: number, query: AuditQuery) {
  const fields: Record<string, string> = {};
  if (query.filing !== undefined && !findFiling(db, organisationId, query.filing)) fields.filing = `Your organisation has no filing ${query.filing}.`;
  if (query.person !== undefined && !findMembership(db, query.person, organisationId)) fields.person = `Your organisation has no person ${query.person}.`;
  if (Object.keys(fields).length) throw unprocessable(Object.values(fields).join(' '), fields);
  const kind = query.kind && AUDIT_KIND_ACTIONS[query.kind];
  const entries = listOrganisationAudit(db, organisationId, AUDIT_LIST_LIMIT + 1, {
    filingId: query.filing,
    actorUserId: query.person,
    actions: kind ? { actions: kind.actions ?? [], prefixes: kind.prefixes ?? [] } : undefined,
  });
  return {
    entries: entries.slice(0, AUDIT_LIST_LIMIT).map((e) => ({ ...e, kind: auditKindOf(e.action), filingId: filingOf(e) })),
    /** More entries match than are listed: narrow the filters to see older ones. */
    more: entries.length > AUDIT_LIST_LIMIT,
  };
}

function filingOf(e: { targetType: string | null; targetId: string | null; details: unknown }): number | null {
  if (e.targetType === 'filing' && e.targetId) return Number(e.targetId);
  const d = e.details as { filingId?: unknown } | null;
  return e.targetType === 'evidence' && typeof d?.filingId === 'number' ? d.filingId : null;
}
