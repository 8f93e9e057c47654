/** Drizzle queries for the append-only audit trail. */
import { and, desc, eq, inArray, or, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { auditLog, memberships } from '../../db/schema';

export type AuditInsert = typeof auditLog.$inferInsert;

export function insertAudit(db: Db, values: AuditInsert): void {
  db.insert(auditLog).values(values).run();
}

export interface AuditFilters {
  filingId?: number;
  actorUserId?: number;
  /** Exact actions and action prefixes, any of which matches. */
  actions?: { actions: readonly string[]; prefixes: readonly string[] };
}

/**
 * One organisation's entries, newest first, with the actor's name as that organisation knows it.
 * A filing's entries are those about the filing itself and about its evidence (which name the
 * filing in their details).
 */
export function listOrganisationAudit(db: Db, organisationId: number, limit: number, filters: AuditFilters = {}) {
  const where: SQL[] = [eq(auditLog.organisationId, organisationId)];
  if (filters.filingId !== undefined) {
    const id = filters.filingId;
    where.push(or(and(eq(auditLog.targetType, 'filing'), eq(auditLog.targetId, String(id))), and(eq(auditLog.targetType, 'evidence'), sql`json_extract(${auditLog.details}, '$.filingId') = ${id}`))!);
  }
  if (filters.actorUserId !== undefined) where.push(eq(auditLog.actorUserId, filters.actorUserId));
  if (filters.actions) {
    const { actions, prefixes } = filters.actions;
    // LIKE with the prefix's own % and _ escaped, so "user." never matches "users" or "user_x".
    const like = prefixes.map((p) => sql`${auditLog.action} LIKE ${`${p.replace(/[\\%_]/g, (c) => `\\${c}`)}%`} ESCAPE '\\'`);
    where.push(or(...(actions.length ? [inArray(auditLog.action, [...actions])] : []), ...like)!);
  }
  return db
    .select({ entry: auditLog, actorName: memberships.name })
    .from(auditLog)
    .leftJoin(memberships, and(eq(memberships.userId, auditLog.actorUserId), eq(memberships.organisationId, organisationId)))
    .where(and(...where))
    .orderBy(desc(auditLog.id))
    .limit(limit)
    .all()
    .map((r) => ({ ...r.entry, actorName: r.actorName }));
}
