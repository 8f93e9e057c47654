/**
 * Lab results of a filing's current version: the engineer's measurements, liquid checks, system
 * checks, instruments and uncertainty budget (read by every role, replaced by the engineer), and
 * the computed lab results — stored with the engine and rule-set versions like screening.
 */
import { createHash } from 'node:crypto';
import type { Db } from '../../db/client';
import { LAB_SETS, type LabData, type LabSet, type Measurement } from '../../constants/schemas/lab';
import { ENGINE_VERSION, RULE_SET_VERSION } from '../../calc/versions';
import { computeLabResults, labResultsInput, labScreeningRows, type LabResultsInput } from '../../calc/lab/lab-results';
import { screenParsed } from '../../calc/screening/screen';
import { forbidden, unprocessable } from '../http-error';
import { zodFieldErrors } from '../middleware/validate';
import * as repo from '../repos/lab-repo';
import * as filingsRepo from '../repos/filings-repo';
import { recordAudit } from './audit';
import { getFiling, loadFiling, matchesRevision, requireEditable, stepRevision, type FilingActor } from './filings-service';
import { screeningInputFor } from './screening-service';

export const LAB_CAUTIONS = [
  'Reported SAR and checks are summaries of the lab’s measurements; the accredited lab and the certifying body decide.',
  'Tolerances marked “from memory” should be verified against the standards; follow the applicable regulations.',
];

export function requireEngineer(actor: FilingActor) {
  if (!actor.roles.includes('engineer')) throw forbidden('Only a test engineer can change lab results. This needs the engineer role.');
}

type SetRows = { [S in LabSet]: LabData[(typeof LAB_SETS)[S]['key']] };

const READERS: { [S in LabSet]: (db: Db, versionId: number) => SetRows[S] } = {
  measurements: repo.readMeasurements,
  'liquid-checks': repo.readLiquidChecks,
  'system-checks': repo.readSystemChecks,
  instruments: repo.readInstruments,
  'uncertainty-budget': repo.readBudget,
};
const WRITERS: { [S in LabSet]: (db: Db, versionId: number, rows: SetRows[S]) => void } = {
  measurements: repo.writeMeasurements,
  'liquid-checks': repo.writeLiquidChecks,
  'system-checks': repo.writeSystemChecks,
  instruments: repo.writeInstruments,
  'uncertainty-budget': repo.writeBudget,
};

/** A set's rows with the revision a save names in If-Match (a hash of the stored rows). */
export function readLabSet(db: Db, actor: FilingActor, filingId: number, set: LabSet) {
  const row = loadFiling(db, actor, filingId);
  const rows = READERS[set](db, row.version.id);
  return { version: row.version.number, [LAB_SETS[set].key]: rows, revision: stepRevision(rows) };
}

/** Thrown when a save names a revision that is no longer the stored one: nothing was written. */
export class StaleLabSet extends Error {
  constructor(readonly current: Record<string, unknown>) {
    super('stale lab set');
  }
}

/**
 * Problems with the ids a measurement names: transmitters and use positions of the device data,
 * liquid and system checks of the lab data. Keyed like zod paths, each message saying what exists.
 */
export function measurementReferenceProblems(
  rows: Pick<Measurement, 'transmitterId' | 'usePositionId' | 'liquidCheckId' | 'systemCheckId'>[],
  known: { transmitters: Set<string>; usePositions: Set<string>; liquidChecks: Set<string>; systemChecks: Set<string> },
  pathOf: (index: number, field: string) => string = (i, f) => `measurements.${i}.${f}`,
): Record<string, string> {
  const fields: Record<string, string> = {};
  const list = (s: Set<string>) => (s.size ? [...s].slice(0, 12).join(', ') : 'none yet');
  rows.forEach((m, i) => {
    if (!known.transmitters.has(m.transmitterId)) fields[pathOf(i, 'transmitterId')] = `Unknown transmitter “${m.transmitterId}”; this filing has ${list(known.transmitters)}.`;
    if (!known.usePositions.has(m.usePositionId)) fields[pathOf(i, 'usePositionId')] = `Unknown use position “${m.usePositionId}”; this filing has ${list(known.usePositions)}.`;
    if (m.liquidCheckId !== null && !known.liquidChecks.has(m.liquidCheckId))
      fields[pathOf(i, 'liquidCheckId')] = `Unknown liquid check “${m.liquidCheckId}”; enter it under liquid checks first (${list(known.liquidChecks)}).`;
    if (m.systemCheckId !== null && !known.systemChecks.has(m.systemCheckId))
      fields[pathOf(i, 'systemCheckId')] = `Unknown system check “${m.systemCheckId}”; enter it under system checks first (${list(known.systemChecks)}).`;
  });
  return fields;
}

export function knownIds(db: Db, versionId: number) {
  return {
    transmitters: new Set(filingsRepo.readRadios(db, versionId).transmitters.map((t) => t.id)),
    usePositions: new Set(filingsRepo.readUsePositions(db, versionId).usePositions.map((p) => p.id)),
    liquidChecks: new Set(repo.readLiquidChecks(db, versionId).map((l) => l.id)),
    systemChecks: new Set(repo.readSystemChecks(db, versionId).map((s) => s.id)),
  };
}

/** Replaces one lab data set of the current version in one transaction (all or nothing). */
export function replaceLabSet(db: Db, actor: FilingActor, filingId: number, set: LabSet, body: unknown, ifMatch?: string) {
  requireEngineer(actor);
  const row = loadFiling(db, actor, filingId);
  requireEditable(row);
  const parsed = LAB_SETS[set].body.safeParse(body);
  if (!parsed.success) {
    const fields = zodFieldErrors(parsed.error);
    throw unprocessable(`${Object.keys(fields).length} field(s) need fixing; nothing was saved.`, fields);
  }
  const rows = (parsed.data as Record<string, unknown>)[LAB_SETS[set].key] as SetRows[typeof set];
  if (ifMatch) {
    // Synchronous from here to the write (better-sqlite3): no other save lands in between.
    const revision = stepRevision(READERS[set](db, row.version.id));
    if (!matchesRevision(ifMatch, revision) && stepRevision(rows) !== revision) throw new StaleLabSet(readLabSet(db, actor, filingId, set));
  }
  if (set === 'measurements') {
    const fields = measurementReferenceProblems(rows as Measurement[], knownIds(db, row.version.id));
    if (Object.keys(fields).length) throw unprocessable(`${Object.keys(fields).length} id(s) do not match this filing; nothing was saved.`, fields);
  }
  db.transaction((tx) => {
    (WRITERS[set] as (db: Db, versionId: number, rows: unknown) => void)(tx, row.version.id, rows);
    filingsRepo.touchFiling(tx, filingId);
    recordAudit(tx, {
      organisationId: actor.organisationId,
      actorUserId: actor.id,
      action: `lab.${set}.replace`,
      targetType: 'filing',
      targetId: filingId,
      details: { version: row.version.number, rows: (rows as unknown[]).length },
    });
  });
  return readLabSet(db, actor, filingId, set);
}

/** The version data the lab results are computed from (the wizard's steps, as stored). */
export interface LabVersionData {
  markets: { regime: string; tier: string }[];
  transmitters: unknown[];
  usePositions: unknown[];
}

/** The engine input for one version: its device data, screening rows and lab data. */
export function labInputOf(db: Db, versionId: number, data: LabVersionData, screeningRows: Parameters<typeof labScreeningRows>[0], lab: LabData = repo.readLabData(db, versionId)): LabResultsInput {
  return labResultsInput.parse({
    markets: data.markets.map((m) => ({ regime: m.regime, tier: m.tier })),
    transmitters: data.transmitters,
    usePositions: data.usePositions,
    simultaneous: filingsRepo.readSimultaneous(db, versionId),
    simultaneousAt: filingsRepo.readSimultaneousAt(db, versionId),
    screening: labScreeningRows(screeningRows),
    measurements: lab.measurements,
    liquidChecks: lab.liquidChecks,
    systemChecks: lab.systemChecks,
    instruments: lab.instruments,
    uncertainty: lab.components,
  });
}

/** The engine input for a filing's lab results: device data, screening rows and lab data. */
export function labInputFor(db: Db, detail: ReturnType<typeof getFiling>, lab: LabData = repo.readLabData(db, detail.version.id)): LabResultsInput {
  const screening = screenParsed(screeningInputFor(detail));
  const { markets } = detail.data.markets;
  return labInputOf(db, detail.version.id, { markets, transmitters: detail.data.radios.transmitters, usePositions: detail.data['use-positions'].usePositions }, screening.rows, lab);
}

/**
 * The stored lab results of a version for this input (JSON text of the output without its top
 * derivation). Each distinct input is computed once and stored with the engine and rule-set
 * versions; lab results are derived, so a signed version may gain a stored result too.
 */
export function storedLabResults(db: Db, versionId: number, input: LabResultsInput): { output: string; computedAt: string } {
  const inputJson = JSON.stringify(input);
  const inputSha256 = createHash('sha256').update(inputJson).digest('hex');
  const stored = repo.findLabResult(db, versionId, inputSha256, ENGINE_VERSION, RULE_SET_VERSION);
  if (stored) return stored;
  const { derivation: _d, ...result } = computeLabResults(input);
  const output = JSON.stringify(result);
  const { computedAt } = repo.insertLabResult(db, { versionId, engineVersion: ENGINE_VERSION, ruleSetVersion: RULE_SET_VERSION, inputSha256, input: inputJson, output });
  return { output, computedAt };
}

/**
 * The lab results of a filing's current data as a JSON body in two pieces (the versions, then the
 * stored output), sent one after the other: joining them would copy an answer of tens of MB once
 * more. An unchanged filing is answered from the store.
 */
export function labResultsForFiling(db: Db, actor: FilingActor, filingId: number): [string, string] {
  const detail = getFiling(db, actor, filingId);
  const stored = storedLabResults(db, detail.version.id, labInputFor(db, detail));
  const meta = {
    filingId,
    version: detail.version.number,
    engineVersion: ENGINE_VERSION,
    ruleSetVersion: RULE_SET_VERSION,
    computedAt: stored.computedAt,
    cautions: LAB_CAUTIONS,
  };
  return [`${JSON.stringify(meta).slice(0, -1)},`, stored.output.slice(1)];
}
