/** Drizzle queries for devices, filings, versions and the wizard's per-version data. */
import { and, asc, desc, eq, inArray, isNull, or, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import {
  antennas,
  deviceModules,
  devices,
  filings,
  filingVersions,
  marketSelections,
  simultaneousGroupMembers,
  simultaneousGroups,
  stepDrafts,
  transmitterAntennas,
  transmitters,
  usePositionPowerModes,
  usePositions,
  usePositionSeparations,
  memberships,
} from '../../db/schema';
import type { DataStep, DeviceStep, MarketsStep, RadiosStep, UsePositionsStep } from '../../constants/schemas/filings';
import type { DeviceInfo, PowerModeTrigger } from '../../constants/schemas/device-file';
import type { CoTransmissionGroup } from '../../constants/schemas/co-transmission';

const latestVersion = sql<number>`(select max(${filingVersions.number}) from ${filingVersions} where ${filingVersions.filingId} = ${filings.id})`;

const summaryColumns = {
  filing: filings,
  device: devices,
  version: filingVersions,
  ownerName: sql<string>`coalesce(${memberships.name}, '')`,
};

function summaryQuery(db: Db) {
  return (
    db
      .select(summaryColumns)
      .from(filings)
      .innerJoin(filingVersions, and(eq(filingVersions.filingId, filings.id), eq(filingVersions.number, latestVersion)))
      // Each version names its own device row (version N+1 gets a copy); older rows fall back to the filing's.
      .innerJoin(devices, eq(devices.id, sql`coalesce(${filingVersions.deviceId}, ${filings.deviceId})`))
      // The owner's name as the filing's organisation knows it.
      .leftJoin(memberships, and(eq(memberships.userId, filings.ownerUserId), eq(memberships.organisationId, filings.organisationId)))
  );
}

export type FilingRow = NonNullable<ReturnType<typeof findFiling>>;

export function listFilings(db: Db, organisationId: number, q: string | undefined, sort: 'updated' | 'name' | 'state', includeArchived = false) {
  const pattern = q ? `%${q.replace(/[%_\\]/g, (c) => `\\${c}`)}%` : undefined;
  const where = and(
    eq(filings.organisationId, organisationId),
    includeArchived ? undefined : isNull(filings.archivedAt),
    pattern ? or(sql`${devices.name} like ${pattern} escape '\\'`, sql`${devices.model} like ${pattern} escape '\\'`, sql`${devices.applicant} like ${pattern} escape '\\'`) : undefined,
  );
  const order = sort === 'name' ? [sql`${devices.name} collate nocase`, desc(filings.updatedAt)] : sort === 'state' ? [asc(filingVersions.state), desc(filings.updatedAt)] : [desc(filings.updatedAt)];
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

/** The device row's columns of the device identity (module grants are rows of their own). */
function deviceColumns({ modules: _m, ...info }: DeviceInfo | DeviceStep) {
  return info;
}

export function insertDevice(db: Db, organisationId: number, info: DeviceInfo) {
  const device = db
    .insert(devices)
    .values({ organisationId, ...deviceColumns(info) })
    .returning()
    .get();
  writeModules(db, device.id, info.modules);
  return device;
}

export function updateDevice(db: Db, deviceId: number, info: DeviceInfo | DeviceStep) {
  db.update(devices)
    .set({ ...deviceColumns(info), updatedAt: new Date().toISOString() })
    .where(eq(devices.id, deviceId))
    .run();
  writeModules(db, deviceId, info.modules);
}

export type ModuleRow = typeof deviceModules.$inferSelect;

export function readModules(db: Db, deviceId: number): ModuleRow[] {
  return db.select().from(deviceModules).where(eq(deviceModules.deviceId, deviceId)).orderBy(asc(deviceModules.sortOrder)).all();
}

/**
 * Updates a device's module grants in place (a rename keeps the row, so transmitters stay in
 * their module); a removed module leaves its transmitters in no module.
 */
function writeModules(db: Db, deviceId: number, modules: DeviceStep['modules']) {
  const old = db.select({ id: deviceModules.id, key: deviceModules.key }).from(deviceModules).where(eq(deviceModules.deviceId, deviceId)).all();
  const match = matchRows(old, modules);
  if (match.removed.length) {
    db.update(transmitters).set({ moduleId: null }).where(inArray(transmitters.moduleId, match.removed)).run();
    db.delete(deviceModules).where(inArray(deviceModules.id, match.removed)).run();
  }
  for (const id of match.kept)
    db.update(deviceModules)
      .set({ key: parkedKey(id) })
      .where(eq(deviceModules.id, id))
      .run();
  modules.forEach((m, sortOrder) => {
    const values = {
      key: m.id,
      name: m.name,
      fccGranteeCode: m.fccGranteeCode,
      fccProductCode: m.fccProductCode,
      isedCompanyNumber: m.isedCompanyNumber,
      isedUpn: m.isedUpn,
      minSeparationM: m.minSeparationM ?? null,
      conditions: m.conditions,
      sortOrder,
    };
    const id = match.rowOf.get(m);
    if (id) db.update(deviceModules).set(values).where(eq(deviceModules.id, id)).run();
    else
      db.insert(deviceModules)
        .values({ deviceId, ...values })
        .run();
  });
}

/** The module grants of a version's device, label → row. */
export function moduleIdsByKey(db: Db, versionId: number): Map<string, number> {
  return new Map(
    db
      .select({ id: deviceModules.id, key: deviceModules.key })
      .from(deviceModules)
      .innerJoin(filingVersions, eq(filingVersions.deviceId, deviceModules.deviceId))
      .where(eq(filingVersions.id, versionId))
      .all()
      .map((m) => [m.key, m.id]),
  );
}

export function touchFiling(db: Db, filingId: number) {
  db.update(filings).set({ updatedAt: new Date().toISOString() }).where(eq(filings.id, filingId)).run();
}

export function readRadios(db: Db, versionId: number): RadiosStep {
  const ants = db.select().from(antennas).where(eq(antennas.versionId, versionId)).orderBy(asc(antennas.sortOrder)).all();
  const keyById = new Map(ants.map((a) => [a.id, a.key]));
  const moduleKey = new Map([...moduleIdsByKey(db, versionId)].map(([key, id]) => [id, key]));
  const txs = db.select().from(transmitters).where(eq(transmitters.versionId, versionId)).orderBy(asc(transmitters.sortOrder)).all();
  const more = new Map<number, string[]>();
  if (txs.length) {
    const links = db
      .select({ transmitterId: transmitterAntennas.transmitterId, antennaId: transmitterAntennas.antennaId })
      .from(transmitterAntennas)
      .where(
        inArray(
          transmitterAntennas.transmitterId,
          txs.map((t) => t.id),
        ),
      )
      .orderBy(asc(transmitterAntennas.sortOrder))
      .all();
    for (const l of links) more.set(l.transmitterId, [...(more.get(l.transmitterId) ?? []), keyById.get(l.antennaId)!]);
  }
  return {
    antennas: ants.map((a) => ({ id: a.key, gainDbi: a.gainDbi, location: a.location, rowId: a.id })),
    // In the schema's field order, optional fields only when stated, so an unchanged step compares equal.
    transmitters: txs.map((t) => ({
      id: t.key,
      technology: t.technology,
      band: t.band,
      frequencyMinHz: t.frequencyMinHz,
      frequencyMaxHz: t.frequencyMaxHz,
      maxTuneUpPowerDbm: t.maxTuneUpPowerDbm,
      ...(t.tuneUpTargetDbm !== null ? { tuneUpTargetDbm: t.tuneUpTargetDbm } : {}),
      ...(t.tuneUpToleranceDb !== null ? { tuneUpToleranceDb: t.tuneUpToleranceDb } : {}),
      mode: t.mode,
      modulation: t.modulation,
      bandwidth: t.bandwidth,
      dutyCycle: t.dutyCycle,
      dutyCyclePreset: t.dutyCyclePreset,
      antennaId: keyById.get(t.antennaId)!,
      moreAntennaIds: more.get(t.id) ?? [],
      antennaUse: t.antennaUse,
      ...(t.moduleId !== null && moduleKey.has(t.moduleId) ? { moduleId: moduleKey.get(t.moduleId)! } : {}),
      rowId: t.id,
    })),
  };
}

/**
 * Which stored row each wanted row is: by its rowId when it names a row of this version, else by
 * label among the rows not yet taken. Rows left over are the removed ones.
 */
function matchRows<W extends { rowId?: number; id: string }>(existing: { id: number; key: string }[], wanted: W[]) {
  const byId = new Map(existing.map((r) => [r.id, r]));
  const taken = new Set<number>();
  const rowOf = new Map<W, number>();
  for (const w of wanted) {
    if (w.rowId !== undefined && byId.has(w.rowId) && !taken.has(w.rowId)) {
      rowOf.set(w, w.rowId);
      taken.add(w.rowId);
    }
  }
  for (const w of wanted) {
    if (rowOf.has(w)) continue;
    const row = existing.find((r) => r.key === w.id && !taken.has(r.id));
    if (row) {
      rowOf.set(w, row.id);
      taken.add(row.id);
    }
  }
  return { rowOf, removed: existing.filter((r) => !taken.has(r.id)).map((r) => r.id), kept: [...taken] };
}

/** Labels are unique per version; kept rows wait on a placeholder no label can be, so two labels can swap. */
const parkedKey = (id: number) => `~parked-${id}`;

/**
 * Updates a version's antennas and transmitters in place. A rename changes the label only, so
 * separations (by antenna row) and co-transmission combinations (by transmitter row) stay; a
 * removed antenna takes its separations with it, a removed transmitter its place in combinations.
 */
export function writeRadios(db: Db, versionId: number, radios: RadiosStep) {
  const oldAntennas = db.select({ id: antennas.id, key: antennas.key }).from(antennas).where(eq(antennas.versionId, versionId)).all();
  const oldTxs = db.select({ id: transmitters.id, key: transmitters.key }).from(transmitters).where(eq(transmitters.versionId, versionId)).all();
  const ant = matchRows(oldAntennas, radios.antennas);
  const tx = matchRows(oldTxs, radios.transmitters);
  if (tx.removed.length) db.delete(transmitters).where(inArray(transmitters.id, tx.removed)).run();
  for (const id of tx.kept)
    db.update(transmitters)
      .set({ key: parkedKey(id) })
      .where(eq(transmitters.id, id))
      .run();
  for (const id of ant.kept)
    db.update(antennas)
      .set({ key: parkedKey(id) })
      .where(eq(antennas.id, id))
      .run();

  const antennaRow = new Map<string, number>();
  radios.antennas.forEach((a, sortOrder) => {
    const values = { key: a.id, gainDbi: a.gainDbi, location: a.location, sortOrder };
    const id = ant.rowOf.get(a);
    if (id) db.update(antennas).set(values).where(eq(antennas.id, id)).run();
    antennaRow.set(
      a.id,
      id ??
        db
          .insert(antennas)
          .values({ versionId, ...values })
          .returning()
          .get().id,
    );
  });
  const moduleRow = moduleIdsByKey(db, versionId);
  radios.transmitters.forEach((t, sortOrder) => {
    const { id: key, rowId: _r, antennaId, moreAntennaIds, moduleId, tuneUpTargetDbm, tuneUpToleranceDb, ...fields } = t;
    const values = {
      key,
      ...fields,
      tuneUpTargetDbm: tuneUpTargetDbm ?? null,
      tuneUpToleranceDb: tuneUpToleranceDb ?? null,
      antennaId: antennaRow.get(antennaId)!,
      moduleId: moduleId !== undefined ? (moduleRow.get(moduleId) ?? null) : null,
      sortOrder,
    };
    let id = tx.rowOf.get(t);
    if (id) {
      db.update(transmitters).set(values).where(eq(transmitters.id, id)).run();
      db.delete(transmitterAntennas).where(eq(transmitterAntennas.transmitterId, id)).run();
    } else
      id = db
        .insert(transmitters)
        .values({ versionId, ...values })
        .returning()
        .get().id;
    if (moreAntennaIds.length) {
      db.insert(transmitterAntennas)
        .values(moreAntennaIds.map((a, i) => ({ transmitterId: id, antennaId: antennaRow.get(a)!, sortOrder: i })))
        .run();
    }
  });
  if (ant.removed.length) db.delete(antennas).where(inArray(antennas.id, ant.removed)).run();
  if (tx.removed.length) dropShrunkCombinations(db, versionId);
}

/** A combination that lost members down to one transmitter is no combination any more. */
function dropShrunkCombinations(db: Db, versionId: number) {
  db.delete(simultaneousGroups)
    .where(and(eq(simultaneousGroups.versionId, versionId), sql`(select count(*) from ${simultaneousGroupMembers} where ${simultaneousGroupMembers.groupId} = ${simultaneousGroups.id}) < 2`))
    .run();
}

/** A version's rows of one table (antennas or transmitters), label → row. */
function rowIdsByKey(db: Db, table: typeof antennas | typeof transmitters, versionId: number): Map<string, number> {
  const rows = db.select({ id: table.id, key: table.key }).from(table).where(eq(table.versionId, versionId)).all();
  return new Map(rows.map((r) => [r.key, r.id]));
}

export const antennaIdsByKey = (db: Db, versionId: number) => rowIdsByKey(db, antennas, versionId);
export const transmitterIdsByKey = (db: Db, versionId: number) => rowIdsByKey(db, transmitters, versionId);

export function readUsePositions(db: Db, versionId: number): UsePositionsStep {
  const positions = db.select().from(usePositions).where(eq(usePositions.versionId, versionId)).orderBy(asc(usePositions.sortOrder)).all();
  const modes = positions.length
    ? db
        .select({
          usePositionId: usePositionPowerModes.usePositionId,
          transmitterKey: transmitters.key,
          reducedTuneUpPowerDbm: usePositionPowerModes.reducedTuneUpPowerDbm,
          trigger: usePositionPowerModes.trigger,
        })
        .from(usePositionPowerModes)
        .innerJoin(transmitters, eq(transmitters.id, usePositionPowerModes.transmitterId))
        .where(
          inArray(
            usePositionPowerModes.usePositionId,
            positions.map((p) => p.id),
          ),
        )
        .orderBy(asc(usePositionPowerModes.sortOrder))
        .all()
    : [];
  const seps = positions.length
    ? db
        .select({ usePositionId: usePositionSeparations.usePositionId, antennaKey: antennas.key, separationM: usePositionSeparations.separationM, sortOrder: antennas.sortOrder })
        .from(usePositionSeparations)
        .innerJoin(antennas, eq(antennas.id, usePositionSeparations.antennaId))
        .where(
          inArray(
            usePositionSeparations.usePositionId,
            positions.map((p) => p.id),
          ),
        )
        .orderBy(asc(antennas.sortOrder))
        .all()
    : [];
  return {
    usePositions: positions.map((p) => ({
      id: p.key,
      kind: p.kind,
      separations: seps.filter((s) => s.usePositionId === p.id).map((s) => ({ antennaId: s.antennaKey, separationM: s.separationM })),
      rowId: p.id,
      // Only when there are any, as the step schema gives them, so an unchanged step compares equal.
      ...powerModesOf(modes.filter((m) => m.usePositionId === p.id)),
    })),
  };
}

function powerModesOf(rows: { transmitterKey: string; reducedTuneUpPowerDbm: number; trigger: PowerModeTrigger }[]) {
  return rows.length ? { powerModes: rows.map((m) => ({ transmitterId: m.transmitterKey, reducedTuneUpPowerDbm: m.reducedTuneUpPowerDbm, trigger: m.trigger })) } : {};
}

/**
 * Updates a version's use positions in place (a rename keeps the row); antenna and transmitter
 * keys must already be resolved (see service). Power modes are stored by transmitter row.
 */
export function writeUsePositions(db: Db, versionId: number, step: UsePositionsStep, antennaIds: Map<string, number>) {
  const old = db.select({ id: usePositions.id, key: usePositions.key }).from(usePositions).where(eq(usePositions.versionId, versionId)).all();
  const match = matchRows(old, step.usePositions);
  if (match.removed.length) db.delete(usePositions).where(inArray(usePositions.id, match.removed)).run();
  for (const id of match.kept)
    db.update(usePositions)
      .set({ key: parkedKey(id) })
      .where(eq(usePositions.id, id))
      .run();
  if (match.kept.length) {
    db.delete(usePositionSeparations).where(inArray(usePositionSeparations.usePositionId, match.kept)).run();
    db.delete(usePositionPowerModes).where(inArray(usePositionPowerModes.usePositionId, match.kept)).run();
  }
  const transmitterIds = transmitterIdsByKey(db, versionId);
  step.usePositions.forEach((p, sortOrder) => {
    const values = { key: p.id, kind: p.kind, sortOrder };
    let id = match.rowOf.get(p);
    if (id) db.update(usePositions).set(values).where(eq(usePositions.id, id)).run();
    else
      id = db
        .insert(usePositions)
        .values({ versionId, ...values })
        .returning()
        .get().id;
    if (p.separations.length) {
      db.insert(usePositionSeparations)
        .values(p.separations.map((s) => ({ usePositionId: id, antennaId: antennaIds.get(s.antennaId)!, separationM: s.separationM })))
        .run();
    }
    if (p.powerModes?.length) {
      db.insert(usePositionPowerModes)
        .values(
          p.powerModes.map((m, i) => ({ usePositionId: id, transmitterId: transmitterIds.get(m.transmitterId)!, reducedTuneUpPowerDbm: m.reducedTuneUpPowerDbm, trigger: m.trigger, sortOrder: i })),
        )
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

/** Every combination with the use position it holds in (null: every position), by label, in order. */
export function readCoTransmissionGroups(db: Db, versionId: number): CoTransmissionGroup[] {
  const rows = db
    .select({ groupId: simultaneousGroups.id, key: transmitters.key, positionKey: usePositions.key })
    .from(simultaneousGroups)
    .innerJoin(simultaneousGroupMembers, eq(simultaneousGroupMembers.groupId, simultaneousGroups.id))
    .innerJoin(transmitters, eq(transmitters.id, simultaneousGroupMembers.transmitterId))
    .leftJoin(usePositions, eq(usePositions.id, simultaneousGroups.usePositionId))
    .where(eq(simultaneousGroups.versionId, versionId))
    .orderBy(asc(simultaneousGroups.sortOrder), asc(simultaneousGroupMembers.sortOrder))
    .all();
  const groups = new Map<number, CoTransmissionGroup>();
  for (const r of rows) {
    const g = groups.get(r.groupId);
    if (g) g.transmitterIds.push(r.key);
    else groups.set(r.groupId, { usePositionId: r.positionKey ?? null, transmitterIds: [r.key] });
  }
  return [...groups.values()];
}

/** Combinations that hold in every use position (the device file's list), by transmitter label. */
export function readSimultaneous(db: Db, versionId: number): string[][] {
  return readCoTransmissionGroups(db, versionId)
    .filter((g) => g.usePositionId === null)
    .map((g) => g.transmitterIds);
}

/** Combinations that hold in one use position only. */
export function readSimultaneousAt(db: Db, versionId: number): { usePositionId: string; transmitterIds: string[] }[] {
  return readCoTransmissionGroups(db, versionId).filter((g): g is { usePositionId: string; transmitterIds: string[] } => g.usePositionId !== null);
}

/** Replaces a version's combinations that hold in every use position (the device file's list). */
export function writeSimultaneous(db: Db, versionId: number, groups: string[][]) {
  writeCoTransmissionGroups(
    db,
    versionId,
    groups.map((transmitterIds) => ({ usePositionId: null, transmitterIds })),
  );
}

/** Replaces all of a version's combinations; every label must name one of its transmitters and use positions (callers check). */
export function writeCoTransmissionGroups(db: Db, versionId: number, groups: CoTransmissionGroup[]) {
  db.delete(simultaneousGroups).where(eq(simultaneousGroups.versionId, versionId)).run();
  const txRow = transmitterIdsByKey(db, versionId);
  const positionRow = usePositionIdsByKey(db, versionId);
  groups.forEach((g, sortOrder) => {
    const usePositionId = g.usePositionId === null ? null : positionRow.get(g.usePositionId)!;
    const group = db.insert(simultaneousGroups).values({ versionId, sortOrder, usePositionId }).returning().get();
    db.insert(simultaneousGroupMembers)
      .values(g.transmitterIds.map((key, i) => ({ groupId: group.id, transmitterId: txRow.get(key)!, sortOrder: i })))
      .run();
  });
}

export function usePositionIdsByKey(db: Db, versionId: number): Map<string, number> {
  const rows = db.select({ id: usePositions.id, key: usePositions.key }).from(usePositions).where(eq(usePositions.versionId, versionId)).all();
  return new Map(rows.map((r) => [r.key, r.id]));
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

export function setArchived(db: Db, filingId: number, state: { archivedAt: string | null; archivedByUserId: number | null }) {
  db.update(filings).set(state).where(eq(filings.id, filingId)).run();
}

export function isArchived(db: Db, organisationId: number, filingId: number): boolean {
  const row = db
    .select({ archivedAt: filings.archivedAt })
    .from(filings)
    .where(and(eq(filings.organisationId, organisationId), eq(filings.id, filingId)))
    .get();
  return Boolean(row?.archivedAt);
}

/** Filings of the organisation imported from a file with this SHA-256, oldest first. */
export function findImportsOf(db: Db, organisationId: number, importSha256: string) {
  return summaryQuery(db)
    .where(and(eq(filings.organisationId, organisationId), eq(filings.importSha256, importSha256)))
    .orderBy(asc(filings.id))
    .all();
}

export function setImportSha256(db: Db, filingId: number, importSha256: string) {
  db.update(filings).set({ importSha256 }).where(eq(filings.id, filingId)).run();
}
