/** Drizzle queries for submission packages and the filing versions they are built from. */
import { and, desc, eq, max, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { devices, filings, filingVersions, organisations, packages, screeningResults } from '../../db/schema';

/** One version of a filing in the organisation, with its device and whether it is the latest. */
export function findVersion(db: Db, organisationId: number, filingId: number, number: number) {
  const row = db
    .select({ filing: filings, device: devices, version: filingVersions, organisationName: organisations.name })
    .from(filingVersions)
    .innerJoin(filings, eq(filings.id, filingVersions.filingId))
    // The version's own device row (an older version keeps the name and model it was filed with).
    .innerJoin(devices, eq(devices.id, sql`coalesce(${filingVersions.deviceId}, ${filings.deviceId})`))
    .innerJoin(organisations, eq(organisations.id, filings.organisationId))
    .where(and(eq(filings.organisationId, organisationId), eq(filings.id, filingId), eq(filingVersions.number, number)))
    .get();
  if (!row) return undefined;
  const latest = db
    .select({ n: max(filingVersions.number) })
    .from(filingVersions)
    .where(eq(filingVersions.filingId, filingId))
    .get();
  return { ...row, isLatest: latest?.n === number };
}
export type VersionRow = NonNullable<ReturnType<typeof findVersion>>;

/** A stored screening result of the version for exactly this input and these engine/rule-set versions. */
export function findScreeningOutput(db: Db, versionId: number, inputSha256: string, engineVersion: string, ruleSetVersion: string) {
  return db
    .select({ output: screeningResults.output })
    .from(screeningResults)
    .where(
      and(
        eq(screeningResults.versionId, versionId),
        eq(screeningResults.inputSha256, inputSha256),
        eq(screeningResults.engineVersion, engineVersion),
        eq(screeningResults.ruleSetVersion, ruleSetVersion),
      ),
    )
    .get()?.output;
}

export type PackageRow = typeof packages.$inferSelect;

export function findPackage(db: Db, versionId: number, kind: 'signed' | 'preview'): PackageRow | undefined {
  return db
    .select()
    .from(packages)
    .where(and(eq(packages.versionId, versionId), eq(packages.kind, kind)))
    .get();
}

/** Replaces the version's package of this kind; returns the row it replaced, if any. */
export function replacePackage(db: Db, row: Omit<typeof packages.$inferInsert, 'id' | 'builtAt'> & { builtAt: string }): { replaced?: PackageRow; row: PackageRow } {
  const replaced = findPackage(db, row.versionId, row.kind);
  if (replaced) db.delete(packages).where(eq(packages.id, replaced.id)).run();
  return { replaced, row: db.insert(packages).values(row).returning().get() };
}

/** Packages with this zip hash or manifest hash, with the filing and version they belong to. */
export function findPackagesBy(db: Db, column: 'sha256' | 'manifestSha256', sha256: string) {
  return (
    db
      .select({ pkg: packages, filingId: filings.id, organisationId: filings.organisationId, versionNumber: filingVersions.number, deviceName: devices.name, deviceModel: devices.model })
      .from(packages)
      .innerJoin(filingVersions, eq(filingVersions.id, packages.versionId))
      .innerJoin(filings, eq(filings.id, filingVersions.filingId))
      // The version's own device row (an older version keeps the name and model it was filed with).
      .innerJoin(devices, eq(devices.id, sql`coalesce(${filingVersions.deviceId}, ${filings.deviceId})`))
      .where(eq(packages[column], sha256))
      .orderBy(desc(packages.id))
      .all()
  );
}

export function allStorageKeys(db: Db): string[] {
  return db
    .select({ key: packages.storageKey })
    .from(packages)
    .all()
    .map((r) => r.key);
}
