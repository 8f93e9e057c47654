/**
 * Drizzle queries for versions, review threads, signatures, the people of a version, and a
 * version's canonical content (the rows its signature hash covers).
 */
import { and, asc, desc, eq, inArray, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { auditLog, deviceModules, devices, filings, filingVersions, membershipRoles, memberships, reviewComments, reviewThreads, users, versionEditors, versionSignatures } from '../../db/schema';
import type { VersionState } from '../../constants/schemas/filings';

export type VersionRow = typeof filingVersions.$inferSelect;
export type SignatureRow = typeof versionSignatures.$inferSelect;

export function listVersions(db: Db, filingId: number) {
  return db
    .select({ version: filingVersions, signature: versionSignatures })
    .from(filingVersions)
    .leftJoin(versionSignatures, eq(versionSignatures.versionId, filingVersions.id))
    .where(eq(filingVersions.filingId, filingId))
    .orderBy(asc(filingVersions.number))
    .all();
}

export function findVersion(db: Db, filingId: number, number: number): VersionRow | undefined {
  return db
    .select()
    .from(filingVersions)
    .where(and(eq(filingVersions.filingId, filingId), eq(filingVersions.number, number)))
    .get();
}

/** Moves a version from one state to the next; false when it was no longer in `from` (someone else got there first). */
export function changeVersionState(db: Db, versionId: number, from: VersionState, to: VersionState): boolean {
  const r = db
    .update(filingVersions)
    .set({ state: to })
    .where(and(eq(filingVersions.id, versionId), eq(filingVersions.state, from)))
    .run();
  return r.changes === 1;
}

export function findDevice(db: Db, deviceId: number) {
  return db.select().from(devices).where(eq(devices.id, deviceId)).get();
}

/** A copy of a device row (every column, whatever the schema has grown) and its module grants, for the next version. */
export function copyDevice(db: Db, deviceId: number) {
  const { id: _id, createdAt: _c, updatedAt: _u, ...rest } = findDevice(db, deviceId)!;
  const copy = db.insert(devices).values(rest).returning().get();
  const modules = db.select().from(deviceModules).where(eq(deviceModules.deviceId, deviceId)).all();
  if (modules.length)
    db.insert(deviceModules)
      .values(modules.map(({ id: _m, deviceId: _d, ...m }) => ({ ...m, deviceId: copy.id })))
      .run();
  return copy;
}

export function insertVersion(db: Db, filingId: number, number: number, deviceId: number) {
  const version = db.insert(filingVersions).values({ filingId, number, deviceId }).returning().get();
  // The filing's own device pointer follows its latest version.
  db.update(filings).set({ deviceId, updatedAt: new Date().toISOString() }).where(eq(filings.id, filingId)).run();
  return version;
}

export function addVersionEditor(db: Db, versionId: number, userId: number) {
  db.insert(versionEditors).values({ versionId, userId }).onConflictDoNothing().run();
}

export function versionEditorIds(db: Db, versionId: number): number[] {
  return db
    .select({ userId: versionEditors.userId })
    .from(versionEditors)
    .where(eq(versionEditors.versionId, versionId))
    .all()
    .map((r) => r.userId);
}

// --- threads --------------------------------------------------------------------------------

export function insertThread(db: Db, v: { versionId: number; step: string; rowRef: string | null; createdByUserId: number }) {
  return db.insert(reviewThreads).values(v).returning().get();
}

export function insertComment(db: Db, v: { threadId: number; authorUserId: number; body: string }) {
  return db.insert(reviewComments).values(v).returning().get();
}

export function findThread(db: Db, versionId: number, threadId: number) {
  return db
    .select()
    .from(reviewThreads)
    .where(and(eq(reviewThreads.id, threadId), eq(reviewThreads.versionId, versionId)))
    .get();
}

export function setThreadState(db: Db, threadId: number, state: 'open' | 'resolved', userId: number | null) {
  db.update(reviewThreads)
    .set({ state, resolvedByUserId: state === 'resolved' ? userId : null, resolvedAt: state === 'resolved' ? new Date().toISOString() : null })
    .where(eq(reviewThreads.id, threadId))
    .run();
}

export function listThreads(db: Db, versionId: number) {
  const threads = db
    .select({ thread: reviewThreads, authorName: users.name })
    .from(reviewThreads)
    .innerJoin(users, eq(users.id, reviewThreads.createdByUserId))
    .where(eq(reviewThreads.versionId, versionId))
    .orderBy(asc(reviewThreads.id))
    .all();
  const comments = threads.length
    ? db
        .select({ comment: reviewComments, authorName: users.name })
        .from(reviewComments)
        .innerJoin(users, eq(users.id, reviewComments.authorUserId))
        .where(
          inArray(
            reviewComments.threadId,
            threads.map((t) => t.thread.id),
          ),
        )
        .orderBy(asc(reviewComments.id))
        .all()
    : [];
  return threads.map((t) => ({ ...t, comments: comments.filter((c) => c.comment.threadId === t.thread.id) }));
}

// --- signatures ----------------------------------------------------------------------------

export function insertSignature(db: Db, v: typeof versionSignatures.$inferInsert) {
  return db.insert(versionSignatures).values(v).returning().get();
}

export function findSignature(db: Db, versionId: number): SignatureRow | undefined {
  return db.select().from(versionSignatures).where(eq(versionSignatures.versionId, versionId)).get();
}

// --- people --------------------------------------------------------------------------------

/** Active members of an organisation who hold the role. */
export function membersWithRole(db: Db, organisationId: number, role: string) {
  return db
    .select({ id: users.id, name: sql<string>`coalesce(nullif(${memberships.name}, ''), ${users.name})`, email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .innerJoin(membershipRoles, eq(membershipRoles.membershipId, memberships.id))
    .where(and(eq(memberships.organisationId, organisationId), eq(membershipRoles.role, role as never), eq(memberships.active, true), eq(users.active, true)))
    .orderBy(asc(users.id))
    .all();
}

export function usersByIds(db: Db, ids: number[]) {
  if (!ids.length) return [];
  return db.select({ id: users.id, name: users.name, email: users.email, active: users.active }).from(users).where(inArray(users.id, ids)).all();
}

export function passwordHashOf(db: Db, userId: number): string | null {
  return db.select({ h: users.passwordHash }).from(users).where(eq(users.id, userId)).get()?.h ?? null;
}

// --- timeline ------------------------------------------------------------------------------

const TIMELINE_LIMIT = 200;

/** The audit entries about one filing, newest first. */
export function filingTimeline(db: Db, organisationId: number, filingId: number) {
  return db
    .select({ entry: auditLog, actorName: users.name })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.actorUserId))
    .where(and(eq(auditLog.organisationId, organisationId), eq(auditLog.targetType, 'filing'), eq(auditLog.targetId, String(filingId))))
    .orderBy(desc(auditLog.id))
    .limit(TIMELINE_LIMIT)
    .all();
}

// --- canonical content ---------------------------------------------------------------------

/**
 * Every table whose rows make up a version's content, with how to select one version's rows.
 * The signature hash covers all of them; a new table whose rows belong to a version is added
 * here and gets the frozen-version triggers (see DEVELOPERS.md, "Signed versions are frozen").
 * Review threads, comments and the editors list are about the version, not its content: they
 * are frozen too but not hashed.
 */
export const VERSION_CONTENT_TABLES: readonly { table: string; where: string; addedLater?: true }[] = [
  { table: 'filing_versions', where: 'id = :v' },
  { table: 'devices', where: 'id = (select device_id from filing_versions where id = :v)' },
  { table: 'device_modules', where: 'device_id = (select device_id from filing_versions where id = :v)', addedLater: true },
  { table: 'antennas', where: 'version_id = :v' },
  { table: 'transmitters', where: 'version_id = :v' },
  { table: 'use_positions', where: 'version_id = :v' },
  { table: 'use_position_separations', where: 'use_position_id in (select id from use_positions where version_id = :v)' },
  { table: 'market_selections', where: 'version_id = :v' },
  { table: 'simultaneous_groups', where: 'version_id = :v' },
  { table: 'step_drafts', where: 'version_id = :v' },
  { table: 'screening_results', where: 'version_id = :v' },
  { table: 'simultaneous_group_members', where: 'group_id in (select id from simultaneous_groups where version_id = :v)' },
  { table: 'transmitter_antennas', where: 'transmitter_id in (select id from transmitters where version_id = :v)', addedLater: true },
  { table: 'use_position_power_modes', where: 'use_position_id in (select id from use_positions where version_id = :v)', addedLater: true },
  { table: 'lab_measurements', where: 'version_id = :v' },
  { table: 'lab_liquid_checks', where: 'version_id = :v' },
  { table: 'lab_system_checks', where: 'version_id = :v' },
  { table: 'lab_instruments', where: 'version_id = :v' },
  { table: 'lab_uncertainty_components', where: 'version_id = :v' },
  { table: 'evidence_files', where: 'version_id = :v' },
  { table: 'evidence_explanations', where: 'version_id = :v' },
];
/**
 * Tables with a version_id that hold what is computed or built from a version (its lab results,
 * its package): written after signing too, and recomputed from the frozen rows with the engine
 * and rule-set versions they record, so neither frozen nor part of the hash.
 */
export const VERSION_DERIVED_TABLES = ['lab_results', 'packages'] as const;
/** Tables with a version_id that are frozen but are not part of the hashed content. */
export const VERSION_REVIEW_TABLES = ['version_editors', 'review_threads', 'review_comments', 'version_signatures'] as const;
/** Columns left out of the hash because signing itself changes them. */
export const UNHASHED_COLUMNS: Record<string, string[]> = { filing_versions: ['state'] };
/**
 * Columns added after versions were first signed, with the value every older row got. A column
 * holding that value is left out of the canonical content (as is an `addedLater` table with no
 * rows), so a signature made before the column existed still verifies; any other value is hashed.
 */
export const LATER_COLUMN_DEFAULTS: Record<string, Record<string, unknown>> = {
  devices: {
    fcc_grantee_code: '',
    fcc_product_code: '',
    ised_company_number: '',
    ised_upn: '',
    hvin: '',
    pmn: '',
    fvin: '',
    model_variants: '[]',
    integration: 'host',
  },
  transmitters: {
    tune_up_target_dbm: null,
    tune_up_tolerance_db: null,
    mode: '',
    modulation: '',
    bandwidth: '',
    duty_cycle_preset: '',
    module_id: null,
    antenna_use: 'mimo',
  },
};

export function readVersionRows(db: Db, versionId: number): { table: string; rows: Record<string, unknown>[] }[] {
  return VERSION_CONTENT_TABLES.map(({ table, where, addedLater }) => ({
    table,
    addedLater,
    rows: db.all<Record<string, unknown>>(sql.raw(`select * from "${table}" where ${where.replaceAll(':v', String(Math.trunc(versionId)))}`)),
  }))
    .filter((t) => !(t.addedLater && t.rows.length === 0))
    .map(({ table, rows }) => ({ table, rows }));
}
