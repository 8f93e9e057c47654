/** Drizzle queries for a version's lab data, its stored lab results and remembered import mappings. */
import { and, asc, count, eq, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { labImportMappings, labInstruments, labLiquidChecks, labMeasurements, labResults, labSystemChecks, labUncertaintyComponents } from '../../db/schema';
import type { BudgetComponent, ImportMapping, Instrument, LabData, LiquidCheck, Measurement, SystemCheck } from '../../constants/schemas/lab';

/** SQLite caps bound parameters per statement; rows are inserted in chunks below it. */
const INSERT_CHUNK = 400;
function insertChunked<T>(rows: T[], insert: (chunk: T[]) => void) {
  for (let i = 0; i < rows.length; i += INSERT_CHUNK) insert(rows.slice(i, i + INSERT_CHUNK));
}

export function countMeasurements(db: Db, versionId: number): number {
  return db.select({ n: count() }).from(labMeasurements).where(eq(labMeasurements.versionId, versionId)).get()?.n ?? 0;
}

/** The columns of a measurement under the row schema's names (one object per row, no second mapping). */
const MEASUREMENT_COLUMNS = {
  id: labMeasurements.key,
  transmitterId: labMeasurements.transmitterKey,
  usePositionId: labMeasurements.usePositionKey,
  testPosition: labMeasurements.testPosition,
  channel: labMeasurements.channel,
  frequencyHz: labMeasurements.frequencyHz,
  testSeparationM: labMeasurements.testSeparationM,
  measuredPowerDbm: labMeasurements.measuredPowerDbm,
  tuneUpPowerDbm: labMeasurements.tuneUpPowerDbm,
  testDutyCycle: labMeasurements.testDutyCycle,
  sar1gWPerKg: labMeasurements.sar1gWPerKg,
  sar10gWPerKg: labMeasurements.sar10gWPerKg,
  repeatSarWPerKg: labMeasurements.repeatSarWPerKg,
  driftDb: labMeasurements.driftDb,
  testDate: labMeasurements.testDate,
  peakXMm: labMeasurements.peakXMm,
  peakYMm: labMeasurements.peakYMm,
  liquidCheckId: labMeasurements.liquidCheckKey,
  systemCheckId: labMeasurements.systemCheckKey,
};

export function readMeasurements(db: Db, versionId: number): Measurement[] {
  return db.select(MEASUREMENT_COLUMNS).from(labMeasurements).where(eq(labMeasurements.versionId, versionId)).orderBy(asc(labMeasurements.sortOrder)).all();
}

export function writeMeasurements(db: Db, versionId: number, rows: Measurement[]) {
  db.delete(labMeasurements).where(eq(labMeasurements.versionId, versionId)).run();
  insertChunked(
    rows.map((m, sortOrder) => ({
      versionId,
      key: m.id,
      transmitterKey: m.transmitterId,
      usePositionKey: m.usePositionId,
      testPosition: m.testPosition,
      channel: m.channel,
      frequencyHz: m.frequencyHz,
      testSeparationM: m.testSeparationM,
      measuredPowerDbm: m.measuredPowerDbm,
      tuneUpPowerDbm: m.tuneUpPowerDbm,
      testDutyCycle: m.testDutyCycle,
      sar1gWPerKg: m.sar1gWPerKg,
      sar10gWPerKg: m.sar10gWPerKg,
      repeatSarWPerKg: m.repeatSarWPerKg,
      driftDb: m.driftDb,
      testDate: m.testDate,
      peakXMm: m.peakXMm,
      peakYMm: m.peakYMm,
      liquidCheckKey: m.liquidCheckId,
      systemCheckKey: m.systemCheckId,
      sortOrder,
    })),
    (chunk) => db.insert(labMeasurements).values(chunk).run(),
  );
}

// Liquid checks, system checks and instruments: plain rows keyed by the user's id.
type KeyedTable = typeof labLiquidChecks | typeof labSystemChecks | typeof labInstruments;

function readKeyed<T>(db: Db, table: KeyedTable, versionId: number): T[] {
  const rows = db.select().from(table).where(eq(table.versionId, versionId)).orderBy(asc(table.sortOrder)).all() as { id: number; versionId: number; sortOrder: number; key: string }[];
  return rows.map(({ id: _rowId, versionId: _versionId, sortOrder: _sortOrder, key, ...rest }) => ({ id: key, ...rest }) as T);
}

function writeKeyed(db: Db, table: KeyedTable, versionId: number, rows: { id: string }[]) {
  db.delete(table).where(eq(table.versionId, versionId)).run();
  insertChunked(
    rows.map(({ id, ...rest }, sortOrder) => ({ versionId, key: id, ...rest, sortOrder })),
    (chunk) =>
      db
        .insert(table)
        .values(chunk as never)
        .run(),
  );
}

export const readLiquidChecks = (db: Db, versionId: number) => readKeyed<LiquidCheck>(db, labLiquidChecks, versionId);
export const writeLiquidChecks = (db: Db, versionId: number, rows: LiquidCheck[]) => writeKeyed(db, labLiquidChecks, versionId, rows);
export const readSystemChecks = (db: Db, versionId: number) => readKeyed<SystemCheck>(db, labSystemChecks, versionId);
export const writeSystemChecks = (db: Db, versionId: number, rows: SystemCheck[]) => writeKeyed(db, labSystemChecks, versionId, rows);
export const readInstruments = (db: Db, versionId: number) => readKeyed<Instrument>(db, labInstruments, versionId);
export const writeInstruments = (db: Db, versionId: number, rows: Instrument[]) => writeKeyed(db, labInstruments, versionId, rows);

export function readBudget(db: Db, versionId: number): BudgetComponent[] {
  return db
    .select()
    .from(labUncertaintyComponents)
    .where(eq(labUncertaintyComponents.versionId, versionId))
    .orderBy(asc(labUncertaintyComponents.sortOrder))
    .all()
    .map((c) => ({ name: c.name, valuePct: c.valuePct, distribution: c.distribution, divisor: c.divisor, sensitivity: c.sensitivity, degreesOfFreedom: c.degreesOfFreedom }));
}

export function writeBudget(db: Db, versionId: number, rows: BudgetComponent[]) {
  db.delete(labUncertaintyComponents).where(eq(labUncertaintyComponents.versionId, versionId)).run();
  insertChunked(
    rows.map((c, sortOrder) => ({ versionId, ...c, sortOrder })),
    (chunk) => db.insert(labUncertaintyComponents).values(chunk).run(),
  );
}

export function readLabData(db: Db, versionId: number): LabData {
  return {
    measurements: readMeasurements(db, versionId),
    liquidChecks: readLiquidChecks(db, versionId),
    systemChecks: readSystemChecks(db, versionId),
    instruments: readInstruments(db, versionId),
    components: readBudget(db, versionId),
  };
}

export function findLabResult(db: Db, versionId: number, inputSha256: string, engineVersion: string, ruleSetVersion: string) {
  return db
    .select({ id: labResults.id, output: labResults.output, computedAt: labResults.computedAt })
    .from(labResults)
    .where(and(eq(labResults.versionId, versionId), eq(labResults.inputSha256, inputSha256), eq(labResults.engineVersion, engineVersion), eq(labResults.ruleSetVersion, ruleSetVersion)))
    .get();
}

export function insertLabResult(db: Db, row: { versionId: number; engineVersion: string; ruleSetVersion: string; inputSha256: string; input: string; output: string }) {
  // Only the id and time come back: the output (megabytes for thousands of rows) is the caller's already.
  return db.insert(labResults).values(row).returning({ id: labResults.id, computedAt: labResults.computedAt }).get();
}

export function findImportMapping(db: Db, organisationId: number, headerSha256: string): ImportMapping | undefined {
  return db
    .select({ mapping: labImportMappings.mapping })
    .from(labImportMappings)
    .where(and(eq(labImportMappings.organisationId, organisationId), eq(labImportMappings.headerSha256, headerSha256)))
    .get()?.mapping as ImportMapping | undefined;
}

export function saveImportMapping(db: Db, organisationId: number, headerSha256: string, mapping: ImportMapping) {
  const updatedAt = new Date().toISOString();
  db.insert(labImportMappings)
    .values({ organisationId, headerSha256, mapping, updatedAt })
    .onConflictDoUpdate({ target: [labImportMappings.organisationId, labImportMappings.headerSha256], set: { mapping, updatedAt } })
    .run();
}

/** The lab tables a new version copies by value (rows name transmitters and positions by their labels). */
const LAB_VERSION_TABLES = ['lab_measurements', 'lab_liquid_checks', 'lab_system_checks', 'lab_instruments', 'lab_uncertainty_components'] as const;

/** Copies a version's lab data into a new version (its stored results are recomputed there). */
export function copyLabData(db: Db, fromVersionId: number, toVersionId: number): void {
  for (const table of LAB_VERSION_TABLES) {
    const columns = db
      .all<{ name: string }>(sql.raw(`select name from pragma_table_info('${table}')`))
      .map((c) => c.name)
      .filter((c) => c !== 'id' && c !== 'version_id');
    const list = columns.map((c) => `"${c}"`).join(', ');
    db.run(sql.raw(`insert into "${table}" ("version_id", ${list}) select ${Math.trunc(toVersionId)}, ${list} from "${table}" where "version_id" = ${Math.trunc(fromVersionId)} order by "id"`));
  }
}
