/** Drizzle queries for evidence records, read-back texts and explanations. */
import { and, asc, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { documentTexts, evidenceExplanations, evidenceFiles, filingVersions, users } from '../../db/schema';

export type EvidenceRow = typeof evidenceFiles.$inferSelect;
export type NewEvidence = typeof evidenceFiles.$inferInsert;

const carriedFromVersion = sql<number | null>`(select v.number from evidence_files e join filing_versions v on v.id = e.version_id where e.id = ${evidenceFiles.carriedFromId})`;

/** Every record of a version (current and replaced), oldest first, with names for display. */
export function listEvidence(db: Db, versionId: number) {
  return db
    .select({ row: evidenceFiles, uploaderName: users.name, carriedFromVersion })
    .from(evidenceFiles)
    .innerJoin(users, eq(users.id, evidenceFiles.uploadedByUserId))
    .where(eq(evidenceFiles.versionId, versionId))
    .orderBy(asc(evidenceFiles.id))
    .all();
}

export function findEvidence(db: Db, versionId: number, id: number): EvidenceRow | undefined {
  return db
    .select()
    .from(evidenceFiles)
    .where(and(eq(evidenceFiles.versionId, versionId), eq(evidenceFiles.id, id)))
    .get();
}

export function insertEvidence(db: Db, values: NewEvidence): EvidenceRow {
  return db.insert(evidenceFiles).values(values).returning().get();
}

export function markReplaced(db: Db, oldId: number, newId: number): void {
  db.update(evidenceFiles).set({ replacedById: newId }).where(eq(evidenceFiles.id, oldId)).run();
}

export function deleteEvidence(db: Db, id: number): void {
  db.delete(evidenceFiles).where(eq(evidenceFiles.id, id)).run();
}

/** How many records anywhere point to these bytes. */
export function countBySha256(db: Db, sha256: string): number {
  return (
    db
      .select({ n: sql<number>`count(*)` })
      .from(evidenceFiles)
      .where(eq(evidenceFiles.sha256, sha256))
      .get()?.n ?? 0
  );
}

/** Bytes of the version's current evidence, each distinct content counted once. */
export function usedBytes(db: Db, versionId: number): number {
  const row = db
    .select({ total: sql<number>`coalesce(sum(size_bytes), 0)` })
    .from(
      db
        .selectDistinct({ sha256: evidenceFiles.sha256, size_bytes: evidenceFiles.sizeBytes })
        .from(evidenceFiles)
        .where(and(eq(evidenceFiles.versionId, versionId), isNull(evidenceFiles.replacedById)))
        .as('distinct_files'),
    )
    .get();
  return row?.total ?? 0;
}

/** Every hash the evidence tables reference (the start-up sweep keeps these). */
export function allEvidenceHashes(db: Db): string[] {
  return db
    .selectDistinct({ sha256: evidenceFiles.sha256 })
    .from(evidenceFiles)
    .all()
    .map((r) => r.sha256);
}

export function findDocumentText(db: Db, sha256: string) {
  return db.select().from(documentTexts).where(eq(documentTexts.sha256, sha256)).get();
}

export function documentTextsFor(db: Db, hashes: string[]) {
  if (!hashes.length) return [];
  return db.select().from(documentTexts).where(inArray(documentTexts.sha256, hashes)).all();
}

export function saveDocumentText(db: Db, values: typeof documentTexts.$inferInsert): void {
  db.insert(documentTexts).values(values).onConflictDoNothing().run();
}

export function listExplanations(db: Db, versionId: number) {
  return db
    .select({ row: evidenceExplanations, userName: users.name })
    .from(evidenceExplanations)
    .innerJoin(users, eq(users.id, evidenceExplanations.userId))
    .where(eq(evidenceExplanations.versionId, versionId))
    .all();
}

export function upsertExplanation(db: Db, values: { versionId: number; evidenceId: number; findingKey: string; reason: string; userId: number }) {
  return db
    .insert(evidenceExplanations)
    .values(values)
    .onConflictDoUpdate({
      target: [evidenceExplanations.evidenceId, evidenceExplanations.findingKey],
      set: { reason: values.reason, userId: values.userId, at: sql`(strftime('%Y-%m-%dT%H:%M:%fZ', 'now'))` },
    })
    .returning()
    .get();
}

/**
 * Carries a version's current evidence into a new version by reference: new rows with the same
 * hash (no bytes copied), pointing back to where they came from, with their explanations.
 * Call it in the transaction that creates the new version.
 */
export function carryEvidenceForward(db: Db, fromVersionId: number, toVersionId: number): number {
  const current = db
    .select()
    .from(evidenceFiles)
    .where(and(eq(evidenceFiles.versionId, fromVersionId), isNull(evidenceFiles.replacedById)))
    .orderBy(asc(evidenceFiles.id))
    .all();
  const explanations = db.select().from(evidenceExplanations).where(eq(evidenceExplanations.versionId, fromVersionId)).all();
  for (const old of current) {
    const { id, versionId: _v, replacesId: _r, replacedById: _b, carriedFromId: _c, ...rest } = old;
    const copy = db
      .insert(evidenceFiles)
      .values({ ...rest, versionId: toVersionId, carriedFromId: id })
      .returning({ id: evidenceFiles.id })
      .get();
    for (const e of explanations.filter((x) => x.evidenceId === id)) {
      db.insert(evidenceExplanations).values({ versionId: toVersionId, evidenceId: copy.id, findingKey: e.findingKey, reason: e.reason, userId: e.userId, at: e.at }).run();
    }
  }
  return current.length;
}

/** A record of any version of the filing. */
export function findEvidenceInFiling(db: Db, filingId: number, id: number): EvidenceRow | undefined {
  return db
    .select({ row: evidenceFiles })
    .from(evidenceFiles)
    .innerJoin(filingVersions, eq(filingVersions.id, evidenceFiles.versionId))
    .where(and(eq(filingVersions.filingId, filingId), eq(evidenceFiles.id, id)))
    .get()?.row;
}
