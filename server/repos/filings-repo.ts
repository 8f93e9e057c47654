/** Drizzle queries for devices, filings, versions and the wizard's per-version data. */
import { and, asc, desc, eq, inArray, or, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import {
  antennas,
  devices,
  filings,
  filingVersions,
  marketSelections,
  simultaneousGroups,
  stepDrafts,
  transmitters,
  usePositions,
  usePositionSeparations,
  memberships,
} from '../../db/schema';
import type { DataStep, MarketsStep, RadiosStep, UsePositionsStep } from '../../constants/schemas/filings';
import type { DeviceInfo } from '../../constants/schemas/device-file';

const latestVersion = sql<number>`(select max(${filingVersions.number}) from ${filingVersions} where ${filingVersions.filingId} = ${filings.id})`;

const summaryColumns = {
  filing: filings,
  device: devices,
  version: filingVersions,
  ownerName: sql<string>`coalesce(${memberships.name}, '')`,
};

function summaryQuery(db: Db) {
  return db
    .select(summaryColumns)
    .from(filings)
    .innerJoin(filingVersions, and(eq(filingVersions.filingId, filings.id), eq(filingVersions.number, latestVersion)))
    // Each version names its own device row (version N+1 gets a copy); older rows fall back to the filing's.
    .innerJoin(devices, eq(devices.id, sql`coalesce(${filingVersions.deviceId}, ${filings.deviceId})`))
    // The owner's name as the filing's organisation knows it.
    .leftJoin(memberships, and(eq(memberships.userId, filings.ownerUserId), eq(memberships.organisationId, filings.organisationId)));
}

export type FilingRow = NonNullable<ReturnType<typeof findFiling>>;

export function listFilings(db: Db, organisationId: number, q: string | undefined, sort: 'updated' | 'name' | 'state') {
  const pattern = q ? `%${q.replace(/[%_\\]/g, (c) => `\\${c}`)}%` : undefined;
  const where = and(
    eq(filings.organisationId, organisationId),
    pattern
      ? or(
          sql`${devices.name} like ${pattern} escape '\\'`,
          sql`${devices.model} like ${pattern} escape '\\'`,
          sql`${devices.applicant} like ${pattern} escape '\\'`,
        )
      : undefined,
  );
  const order =
    sort === 'name' ? [sql`${devices.name} collate nocase`, desc(filings.updatedAt)] : sort === 'state' ? [asc(filingVersions.state), desc(filings.updatedAt)] : [desc(filings.updatedAt)];
  return summaryQuery(db)
    .where(where)
    .orderBy(...order)
    .all();
}

export function findFiling(db: Db, organisationId: number, filingId: number) {
  return summaryQuery(db)
    .where(and(eq(filings.organisationId, organisationId), eq(filings.id, filingId)))
    .get();
}

export function marketsByVersion(db: Db, versionIds: number[]) {
  if (!versionIds.length) return new Map<number, string[]>();
  const rows = db
    .select({ versionId: marketSelections.versionId, regime: marketSelections.regime })
    .from(marketSelections)
    .where(inArray(marketSelections.versionId, versionIds))
    .orderBy(asc(marketSelections.sortOrder))
    .all();
  const map = new Map<number, string[]>();
  for (const r of rows) map.set(r.versionId, [...(map.get(r.versionId) ?? []), r.regime]);
  return map;
}

export function insertDevice(db: Db, organisationId: number, info: DeviceInfo) {
  return db.insert(devices).values({ organisationId, ...info }).returning().get();
}

export function updateDevice(db: Db, deviceId: number, info: DeviceInfo) {
  db.update(devices)
    .set({ ...info, updatedAt: new Date().toISOString() })
    .where(eq(devices.id, deviceId))
    .run();
}

export function touchFiling(db: Db, filingId: number) {
  db.update(filings).set({ updatedAt: new Date().toISOString() }).where(eq(filings.id, filingId)).run();
}

export function readRadios(db: Db, versionId: number): RadiosStep {
  const ants = db.select().from(antennas).where(eq(antennas.versionId, versionId)).orderBy(asc(antennas.sortOrder)).all();
  const keyById = new Map(ants.map((a) => [a.id, a.key]));
  const txs = db.select().from(transmitters).where(eq(transmitters.versionId, versionId)).orderBy(asc(transmitters.sortOrder)).all();
  return {
    antennas: ants.map((a) => ({ id: a.key, gainDbi: a.gainDbi, location: a.location })),
    transmitters: txs.map((t) => ({
      id: t.key,
      technology: t.technology,
      band: t.band,
      frequencyMinHz: t.frequencyMinHz,
      frequencyMaxHz: t.frequencyMaxHz,
      maxTuneUpPowerDbm: t.maxTuneUpPowerDbm,
      dutyCycle: t.dutyCycle,
      antennaId: keyById.get(t.antennaId)!,
    })),
  };
}

/**
 * Replaces a version's antennas and transmitters. Antennas are matched by id so that the
 * separations entered for them under Use positions survive an edit of gain or location.
 */
export function writeRadios(db: Db, versionId: number, radios: RadiosStep) {
  db.delete(transmitters).where(eq(transmitters.versionId, versionId)).run();
  const existing = db.select().from(antennas).where(eq(antennas.versionId, versionId)).all();
  const wanted = new Set(radios.antennas.map((a) => a.id));
  const removed = existing.filter((a) => !wanted.has(a.key)).map((a) => a.id);
  if (removed.length) db.delete(antennas).where(inArray(antennas.id, removed)).run();
  const idByKey = new Map(existing.filter((a) => wanted.has(a.key)).map((a) => [a.key, a.id]));
  radios.antennas.forEach((a, sortOrder) => {
    const id = idByKey.get(a.id);
    if (id) {
      db.update(antennas).set({ gainDbi: a.gainDbi, location: a.location, sortOrder }).where(eq(antennas.id, id)).run();
    } else {
      idByKey.set(a.id, db.insert(antennas).values({ versionId, key: a.id, gainDbi: a.gainDbi, location: a.location, sortOrder }).returning().get().id);
    }
  });
  if (radios.transmitters.length) {
    db.insert(transmitters)
      .values(
        radios.transmitters.map((t, sortOrder) => ({
          versionId,
          key: t.id,
          technology: t.technology,
          band: t.band,
          frequencyMinHz: t.frequencyMinHz,
          frequencyMaxHz: t.frequencyMaxHz,
          maxTuneUpPowerDbm: t.maxTuneUpPowerDbm,
          dutyCycle: t.dutyCycle,
          antennaId: idByKey.get(t.antennaId)!,
          sortOrder,
        })),
      )
      .run();
  }
}

export function antennaIdsByKey(db: Db, versionId: number): Map<string, number> {
  return new Map(
    db
      .select({ id: antennas.id, key: antennas.key })
      .from(antennas)
      .where(eq(antennas.versionId, versionId))
      .all()
      .map((a) => [a.key, a.id]),
  );
}

export function readUsePositions(db: Db, versionId: number): UsePositionsStep {
  const positions = db.select().from(usePositions).where(eq(usePositions.versionId, versionId)).orderBy(asc(usePositions.sortOrder)).all();
  const seps = positions.length
    ? db
        .select({ usePositionId: usePositionSeparations.usePositionId, antennaKey: antennas.key, separationM: usePositionSeparations.separationM, sortOrder: antennas.sortOrder })
        .from(usePositionSeparations)
        .innerJoin(antennas, eq(antennas.id, usePositionSeparations.antennaId))
        .where(inArray(usePositionSeparations.usePositionId, positions.map((p) => p.id)))
        .orderBy(asc(antennas.sortOrder))
        .all()
    : [];
  return {
    usePositions: positions.map((p) => ({
      id: p.key,
      kind: p.kind,
      separations: seps.filter((s) => s.usePositionId === p.id).map((s) => ({ antennaId: s.antennaKey, separationM: s.separationM })),
    })),
  };
}

/** Replaces a version's use positions; antenna keys must already be resolved (see service). */
export function writeUsePositions(db: Db, versionId: number, step: UsePositionsStep, antennaIds: Map<string, number>) {
  db.delete(usePositions).where(eq(usePositions.versionId, versionId)).run();
  step.usePositions.forEach((p, sortOrder) => {
    const row = db.insert(usePositions).values({ versionId, key: p.id, kind: p.kind, sortOrder }).returning().get();
    if (p.separations.length) {
      db.insert(usePositionSeparations)
        .values(p.separations.map((s) => ({ usePositionId: row.id, antennaId: antennaIds.get(s.antennaId)!, separationM: s.separationM })))
        .run();
    }
  });
}

export function readMarkets(db: Db, versionId: number): MarketsStep {
  const rows = db.select().from(marketSelections).where(eq(marketSelections.versionId, versionId)).orderBy(asc(marketSelections.sortOrder)).all();
  return {
    markets: rows.map((m) => ({ regime: m.regime, tier: m.tier, ...(m.fccSarScreening ? { fccSarScreening: m.fccSarScreening } : {}) })),
  };
}

export function writeMarkets(db: Db, versionId: number, step: MarketsStep) {
  db.delete(marketSelections).where(eq(marketSelections.versionId, versionId)).run();
  if (step.markets.length) {
    db.insert(marketSelections)
      .values(step.markets.map((m, sortOrder) => ({ versionId, regime: m.regime, tier: m.tier, fccSarScreening: m.fccSarScreening ?? null, sortOrder })))
      .run();
  }
}

export function readSimultaneous(db: Db, versionId: number): string[][] {
  return db
    .select()
    .from(simultaneousGroups)
    .where(eq(simultaneousGroups.versionId, versionId))
    .orderBy(asc(simultaneousGroups.sortOrder))
    .all()
    .map((g) => g.transmitterKeys);
}

export function writeSimultaneous(db: Db, versionId: number, groups: string[][]) {
  db.delete(simultaneousGroups).where(eq(simultaneousGroups.versionId, versionId)).run();
  if (groups.length) db.insert(simultaneousGroups).values(groups.map((transmitterKeys, sortOrder) => ({ versionId, transmitterKeys, sortOrder }))).run();
}

export function readDrafts(db: Db, versionId: number) {
  return db.select().from(stepDrafts).where(eq(stepDrafts.versionId, versionId)).all();
}

export function writeDraft(db: Db, versionId: number, step: DataStep, data: unknown) {
  const updatedAt = new Date().toISOString();
  db.insert(stepDrafts)
    .values({ versionId, step, data, updatedAt })
    .onConflictDoUpdate({ target: [stepDrafts.versionId, stepDrafts.step], set: { data, updatedAt } })
    .run();
  return updatedAt;
}

export function clearDraft(db: Db, versionId: number, step: DataStep) {
  db.delete(stepDrafts)
    .where(and(eq(stepDrafts.versionId, versionId), eq(stepDrafts.step, step)))
    .run();
}

export function insertFiling(db: Db, organisationId: number, deviceId: number, ownerUserId: number) {
  const filing = db.insert(filings).values({ organisationId, deviceId, ownerUserId }).returning().get();
  const version = db.insert(filingVersions).values({ filingId: filing.id, number: 1, deviceId }).returning().get();
  return { filing, version };
}
