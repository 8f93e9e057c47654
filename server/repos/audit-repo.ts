/** Drizzle queries for the append-only audit trail. */
import { and, desc, eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { auditLog, memberships } from '../../db/schema';

export type AuditInsert = typeof auditLog.$inferInsert;

export function insertAudit(db: Db, values: AuditInsert): void {
  db.insert(auditLog).values(values).run();
}

/** One organisation's entries, newest first, with the actor's name as that organisation knows it. */
export function listOrganisationAudit(db: Db, organisationId: number, limit: number) {
  return db
    .select({ entry: auditLog, actorName: memberships.name })
    .from(auditLog)
    .leftJoin(memberships, and(eq(memberships.userId, auditLog.actorUserId), eq(memberships.organisationId, organisationId)))
    .where(eq(auditLog.organisationId, organisationId))
    .orderBy(desc(auditLog.id))
    .limit(limit)
    .all()
    .map((r) => ({ ...r.entry, actorName: r.actorName }));
}
