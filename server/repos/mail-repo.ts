/** Drizzle queries for the mail outbox. Every read is scoped to one organisation. */
import { and, desc, eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { mailMessages } from '../../db/schema';

export type MailRow = typeof mailMessages.$inferSelect;

export function insertMail(db: Db, values: typeof mailMessages.$inferInsert): void {
  db.insert(mailMessages).values(values).run();
}

export function listOrganisationMail(db: Db, organisationId: number, limit: number): MailRow[] {
  return db.select().from(mailMessages).where(eq(mailMessages.organisationId, organisationId)).orderBy(desc(mailMessages.id)).limit(limit).all();
}

export function findOrganisationMail(db: Db, organisationId: number, id: number): MailRow | undefined {
  return db
    .select()
    .from(mailMessages)
    .where(and(eq(mailMessages.id, id), eq(mailMessages.organisationId, organisationId)))
    .get();
}
