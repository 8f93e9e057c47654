/**
 * Filings: create (from nothing or from a device description file), read with each step's
 * completion, save a wizard step (autosave), and export the device file. Specialists change
 * filings; every member of the organisation may read them. A step that does not validate is
 * kept as a draft so a reload loses nothing, while the last valid data stays as it was.
 */
import { createHash } from 'node:crypto';
import type { Db } from '../../db/client';
import {
  DATA_STEPS,
  EDITABLE_STATES,
  STEP_SCHEMAS,
  type DataStep,
  type FilingDetail,
  type FilingSummary,
  type RadiosStep,
  type StepStatus,
  type UsePositionsStep,
  type VersionState,
  STEP_LABELS,
  VERSION_STATE_LABELS,
  zDeviceStep,
} from '../../constants/schemas/filings';
import { DEVICE_FILE_FORMAT, USE_POSITION_LABELS, powerModeIssues, zDeviceInfo, type DeviceFile, type DeviceFileInput } from '../../constants/schemas/device-file';
import type { Role } from '../../constants/schemas/roles';
import { conflict, forbidden, HttpError, notFound, unprocessable } from '../http-error';
import { ruleSetWarnings } from '../../calc/versions';
import { zodFieldErrors } from '../middleware/validate';
import * as repo from '../repos/filings-repo';
import * as labRepo from '../repos/lab-repo';
import { addVersionEditor } from '../repos/review-repo';
import { recordAudit } from './audit';
import { evidenceStepStatus } from './evidence-step';

export interface FilingActor {
  id: number;
  organisationId: number;
  roles: Role[];
}

export const canEdit = (actor: FilingActor) => actor.roles.includes('specialist');

function requireEditor(actor: FilingActor) {
  if (!canEdit(actor)) throw forbidden('Only a compliance specialist can change a filing’s device data. This needs the specialist role.');
}

export function loadFiling(db: Db, actor: FilingActor, filingId: number): repo.FilingRow {
  const row = repo.findFiling(db, actor.organisationId, filingId);
  if (!row) throw notFound('No such filing in your organisation.');
  return row;
}

export function requireEditable(row: repo.FilingRow) {
  const state = row.version.state as VersionState;
  if (state === 'signed') throw conflict(`Version ${row.version.number} is signed and frozen. Start version ${row.version.number + 1} to make changes.`);
  if (!EDITABLE_STATES.includes(state)) {
    throw conflict(`Version ${row.version.number} is ${VERSION_STATE_LABELS[state].toLowerCase()}; its data cannot change until the approver returns it.`);
  }
}

function toSummary(row: repo.FilingRow, markets: string[]): FilingSummary {
  return {
    id: row.filing.id,
    device: { name: row.device.name, model: row.device.model, applicant: row.device.applicant, productType: row.device.productType },
    version: { id: row.version.id, number: row.version.number, state: row.version.state as VersionState },
    markets,
    owner: { id: row.filing.ownerUserId, name: row.ownerName },
    updatedAt: row.filing.updatedAt,
    createdAt: row.filing.createdAt,
    archivedAt: row.filing.archivedAt,
  };
}

export function listFilings(db: Db, actor: FilingActor, q: string | undefined, sort: 'updated' | 'name' | 'state', includeArchived = false): FilingSummary[] {
  const rows = repo.listFilings(db, actor.organisationId, q, sort, includeArchived);
  const markets = repo.marketsByVersion(
    db,
    rows.map((r) => r.version.id),
  );
  return rows.map((r) => toSummary(r, markets.get(r.version.id) ?? []));
}

/** The device step's fields of a stored device row and its module grants. */
export function deviceStepOf(device: repo.FilingRow['device'], modules: repo.ModuleRow[] = []): FilingDetail['data']['device'] {
  return {
    name: device.name,
    model: device.model,
    applicant: device.applicant,
    productType: device.productType,
    hardwareVersion: device.hardwareVersion,
    firmwareVersion: device.firmwareVersion,
    fccGranteeCode: device.fccGranteeCode,
    fccProductCode: device.fccProductCode,
    isedCompanyNumber: device.isedCompanyNumber,
    isedUpn: device.isedUpn,
    hvin: device.hvin,
    pmn: device.pmn,
    fvin: device.fvin,
    modelVariants: device.modelVariants,
    integration: device.integration,
    // In the schema's field order, optional fields only when stated, so an unchanged step compares equal.
    modules: modules.map((m) => ({
      id: m.key,
      name: m.name,
      fccGranteeCode: m.fccGranteeCode,
      fccProductCode: m.fccProductCode,
      isedCompanyNumber: m.isedCompanyNumber,
      isedUpn: m.isedUpn,
      ...(m.minSeparationM !== null ? { minSeparationM: m.minSeparationM } : {}),
      conditions: m.conditions,
      rowId: m.id,
    })),
  };
}

const STEP_READERS: { [S in DataStep]: (db: Db, row: repo.FilingRow) => FilingDetail['data'][S] } = {
  device: (db, row) => deviceStepOf(row.device, repo.readModules(db, row.device.id)),
  radios: (db, row) => repo.readRadios(db, row.version.id),
  'use-positions': (db, row) => repo.readUsePositions(db, row.version.id),
  markets: (db, row) => repo.readMarkets(db, row.version.id),
};

function readData(db: Db, row: repo.FilingRow): FilingDetail['data'] {
  return {
    device: STEP_READERS.device(db, row),
    radios: STEP_READERS.radios(db, row),
    'use-positions': STEP_READERS['use-positions'](db, row),
    markets: STEP_READERS.markets(db, row),
  };
}

/** Each step's completion, computed from the data (never ticked by hand). */
export function stepStatuses(data: FilingDetail['data'], draftSteps: Set<DataStep>, lab: { measurements: number } = { measurements: 0 }): StepStatus[] {
  const device: string[] = zDeviceStep.safeParse(data.device).success ? [] : ['Fill in the device name, model, applicant and product type.'];
  if (data.device.integration === 'host-with-module' && !data.device.modules.length) device.push('Add the grant of the certified module inside (its FCC ID or ISED number and its conditions).');
  const radios: string[] = [];
  if (!data.radios.antennas.length) radios.push('Add at least one antenna.');
  if (!data.radios.transmitters.length) radios.push('Add at least one transmitter.');
  if (data.device.modules.length && !data.radios.transmitters.some((t) => t.moduleId)) {
    radios.push('Say which transmitters belong to the certified module, so its grant conditions reach screening.');
  }
  const positions: string[] = [];
  if (!data['use-positions'].usePositions.length) positions.push('Add at least one use position.');
  const usedAntennas = [...new Set(data.radios.transmitters.flatMap((t) => [t.antennaId, ...t.moreAntennaIds]))];
  for (const p of data['use-positions'].usePositions) {
    const given = new Set(p.separations.map((s) => s.antennaId));
    const missing = usedAntennas.filter((a) => !given.has(a));
    if (missing.length) positions.push(`“${p.id}” (${USE_POSITION_LABELS[p.kind].toLowerCase()}) has no separation for antenna ${missing.join(', ')}.`);
    for (const m of p.powerModes ?? []) {
      // A later Radios save can lower the maximum under a stored reduction: say so here (screening leaves it out).
      const max = data.radios.transmitters.find((t) => t.id === m.transmitterId)?.maxTuneUpPowerDbm;
      if (max !== undefined && m.reducedTuneUpPowerDbm >= max)
        positions.push(`“${p.id}”: the reduced power of ${m.transmitterId} (${m.reducedTuneUpPowerDbm} dBm) is not below its maximum tune-up power (${max} dBm).`);
    }
  }
  const markets: string[] = data.markets.markets.length ? [] : ['Pick at least one market.'];
  const byStep: Record<DataStep, string[]> = { device, radios, 'use-positions': positions, markets };
  const ruleSet = ruleSetWarnings(data.markets.markets.map((m) => m.regime)).map((w) => w.message);
  const statuses: StepStatus[] = DATA_STEPS.map((step) => {
    const problems = [...byStep[step]];
    if (draftSteps.has(step)) problems.push('Some changes have errors and are not saved yet.');
    return { step, complete: problems.length === 0, problems, hasDraft: draftSteps.has(step), warnings: step === 'markets' ? ruleSet : [] };
  });
  const incomplete = statuses.filter((s) => !s.complete).map((s) => s.step);
  statuses.push({
    step: 'screening',
    complete: incomplete.length === 0,
    problems: incomplete.length ? [`Finish ${incomplete.map((s) => STEP_LABELS[s]).join(', ')} to screen every combination.`] : [],
    hasDraft: false,
    warnings: ruleSet,
  });
  // Lab steps: complete once the lab's measurements are in; their checks are in the lab results.
  const measured = lab.measurements > 0;
  statuses.push(
    { step: 'measurements', complete: measured, problems: measured ? [] : ['Import or enter the lab’s SAR measurements (test engineer).'], hasDraft: false, warnings: [] },
    { step: 'co-transmission', complete: measured, problems: measured ? [] : ['Sums follow once measurements are in.'], hasDraft: false, warnings: [] },
  );
  return statuses;
}

export function getFiling(db: Db, actor: FilingActor, filingId: number): FilingDetail {
  const row = loadFiling(db, actor, filingId);
  const data = readData(db, row);
  const drafts = repo.readDrafts(db, row.version.id);
  const markets = data.markets.markets.map((m) => m.regime);
  const steps = stepStatuses(data, new Set(drafts.map((d) => d.step)), { measurements: labRepo.countMeasurements(db, row.version.id) });
  steps.push(evidenceStepStatus(db, row.version.id, { data, steps }));
  return {
    ...toSummary(row, markets),
    editable: canEdit(actor) && !row.filing.archivedAt && EDITABLE_STATES.includes(row.version.state as VersionState),
    steps,
    data,
    simultaneous: repo.readSimultaneous(db, row.version.id),
    drafts: Object.fromEntries(drafts.map((d) => [d.step, { data: d.data, updatedAt: d.updatedAt }])),
    revisions: stepRevisions(data),
  };
}

/**
 * A step's revision is a hash of its stored data: a save that names the revision it started from
 * (If-Match) is refused when someone saved different data since. A save of exactly
 * the stored data is never stale, so two tabs saving the same thing do not conflict.
 */
export const stepRevision = (data: unknown) => createHash('sha256').update(JSON.stringify(data)).digest('hex').slice(0, 24);

const stepRevisions = (data: FilingDetail['data']) => Object.fromEntries(DATA_STEPS.map((s) => [s, stepRevision(data[s])])) as Record<DataStep, string>;

export function createFiling(db: Db, actor: FilingActor, input: DeviceFileInput['device']): FilingDetail {
  requireEditor(actor);
  const device = zDeviceInfo.parse(input);
  const id = db.transaction((tx) => {
    const dev = repo.insertDevice(tx, actor.organisationId, device);
    const { filing, version } = repo.insertFiling(tx, actor.organisationId, dev.id, actor.id);
    addVersionEditor(tx, version.id, actor.id);
    recordAudit(tx, {
      organisationId: actor.organisationId,
      actorUserId: actor.id,
      action: 'filing.create',
      targetType: 'filing',
      targetId: filing.id,
      details: { device: device.name, model: device.model },
    });
    return filing.id;
  });
  return getFiling(db, actor, id);
}

/** The parsed file's fingerprint: the same device file imported twice gives the same hash. */
export const deviceFileSha256 = (file: DeviceFile) => createHash('sha256').update(JSON.stringify(file)).digest('hex');

/**
 * Creates a filing from a whole device description file, in one transaction. A file this
 * organisation imported before gives a warning naming the earlier filing; with `refuseDuplicate`
 * (the app asks first) it is a 409 `duplicate_import` instead and nothing is created.
 */
export function importDeviceFile(db: Db, actor: FilingActor, file: DeviceFile, { refuseDuplicate = false } = {}): FilingDetail & { warnings: string[] } {
  requireEditor(actor);
  const importSha256 = deviceFileSha256(file);
  const earlier = repo.findImportsOf(db, actor.organisationId, importSha256);
  const duplicateWarning = earlier.length
    ? `This device file was already imported as “${earlier[0].device.name} ${earlier[0].device.model}”${earlier[0].filing.archivedAt ? ' (archived)' : ''} on ${earlier[0].filing.createdAt.slice(0, 10)}.`
    : null;
  if (duplicateWarning && refuseDuplicate) throw new HttpError(409, 'duplicate_import', `${duplicateWarning} Open that filing, or import again to start a second one.`);
  const id = db.transaction((tx) => {
    const dev = repo.insertDevice(tx, actor.organisationId, file.device);
    const { filing, version } = repo.insertFiling(tx, actor.organisationId, dev.id, actor.id);
    repo.setImportSha256(tx, filing.id, importSha256);
    repo.writeRadios(tx, version.id, { antennas: file.antennas, transmitters: file.transmitters });
    repo.writeUsePositions(tx, version.id, { usePositions: file.usePositions }, repo.antennaIdsByKey(tx, version.id));
    repo.writeMarkets(tx, version.id, { markets: file.markets });
    repo.writeCoTransmissionGroups(
      tx,
      version.id,
      file.simultaneous.map((g) => (Array.isArray(g) ? { usePositionId: null, transmitterIds: g } : { usePositionId: g.usePositionId ?? null, transmitterIds: g.transmitterIds })),
    );
    addVersionEditor(tx, version.id, actor.id);
    recordAudit(tx, {
      organisationId: actor.organisationId,
      actorUserId: actor.id,
      action: 'filing.import',
      targetType: 'filing',
      targetId: filing.id,
      details: { device: file.device.name, transmitters: file.transmitters.length, usePositions: file.usePositions.length, ...(earlier.length ? { duplicateOf: earlier[0].filing.id } : {}) },
    });
    return filing.id;
  });
  return { ...getFiling(db, actor, id), warnings: duplicateWarning ? [`${duplicateWarning} This is a second filing from the same file.`] : [] };
}

const withoutRowId = <T extends { rowId?: number }>({ rowId: _rowId, ...rest }: T): Omit<T, 'rowId'> => rest;

export function exportDeviceFile(db: Db, actor: FilingActor, filingId: number): DeviceFile {
  const row = loadFiling(db, actor, filingId);
  const data = readData(db, row);
  // Row numbers belong to this database; the file relates its parts by label.
  return {
    format: DEVICE_FILE_FORMAT,
    device: { ...data.device, modules: data.device.modules.map(withoutRowId) },
    markets: data.markets.markets,
    antennas: data.radios.antennas.map(withoutRowId),
    transmitters: data.radios.transmitters.map(withoutRowId),
    usePositions: data['use-positions'].usePositions.map(withoutRowId),
    // Every-position groups stay bare lists (the format files were written in before positions).
    simultaneous: repo.readCoTransmissionGroups(db, row.version.id).map((g) => (g.usePositionId === null ? g.transmitterIds : { transmitterIds: g.transmitterIds, usePositionId: g.usePositionId })),
  };
}

export type SaveStepResult =
  | { saved: true; filing: FilingDetail }
  | { saved: false; draftSavedAt: string; fields: Record<string, string> }
  /** The save named a revision that is no longer the stored one: nothing was written. */
  | { saved: false; stale: true; current: { data: unknown; revision: string; updatedAt: string } };

/** An If-Match value as browsers and tools send it: `"rev"`, `W/"rev"`, a list, or `*`. */
export function matchesRevision(ifMatch: string, revision: string): boolean {
  return ifMatch.split(',').some((tag) => {
    const t = tag.trim().replace(/^W\//, '').replace(/^"|"$/g, '');
    return t === '*' || t === revision;
  });
}

/**
 * Saves one wizard step. Valid input replaces the step's data (and clears its draft); invalid
 * input is kept as a draft and reported field by field, and the stored data is left untouched.
 */
export function saveStep(db: Db, actor: FilingActor, filingId: number, step: DataStep, body: unknown, ifMatch?: string): SaveStepResult {
  requireEditor(actor);
  const row = loadFiling(db, actor, filingId);
  requireEditable(row);
  const versionId = row.version.id;

  const parsed = STEP_SCHEMAS[step].safeParse(body);
  if (ifMatch) {
    // saveStep runs synchronously from here to the write (better-sqlite3), so no other request
    // can save between this check and the write below.
    const current = STEP_READERS[step](db, row);
    const revision = stepRevision(current);
    const sameAsStored = parsed.success && stepRevision(parsed.data) === revision;
    if (!matchesRevision(ifMatch, revision) && !sameAsStored) return { saved: false, stale: true, current: { data: current, revision, updatedAt: row.filing.updatedAt } };
  }

  const fields = parsed.success ? {} : zodFieldErrors(parsed.error);
  if (parsed.success && step === 'radios') {
    // A transmitter's module must be one of the device's module grants (Device step).
    const modules = repo.moduleIdsByKey(db, versionId);
    (parsed.data as RadiosStep).transmitters.forEach((t, i) => {
      if (t.moduleId !== undefined && !modules.has(t.moduleId)) fields[`transmitters.${i}.moduleId`] = `No module “${t.moduleId}” under Device.`;
    });
  }
  if (parsed.success && step === 'use-positions') {
    // Separations must name antennas that exist under Radios.
    const antennaIds = repo.antennaIdsByKey(db, versionId);
    (parsed.data as UsePositionsStep).usePositions.forEach((p, i) =>
      p.separations.forEach((s, j) => {
        if (!antennaIds.has(s.antennaId)) fields[`usePositions.${i}.separations.${j}.antennaId`] = `No antenna “${s.antennaId}” under Radios.`;
      }),
    );
    // A reduced power names a transmitter under Radios and stays below its maximum.
    const maxDbmOf = new Map(repo.readRadios(db, versionId).transmitters.map((t) => [t.id as string | undefined, t.maxTuneUpPowerDbm as number | undefined]));
    const addIssue = ({ path, message }: { path: (string | number)[]; message: string }) => void (fields[path.join('.')] ??= message);
    (parsed.data as UsePositionsStep).usePositions.forEach((p, i) => powerModeIssues(p.powerModes ?? [], maxDbmOf, ['usePositions', i], { addIssue }, (id) => `No transmitter “${id}” under Radios.`));
  }
  if (!parsed.success || Object.keys(fields).length) {
    const draftSavedAt = db.transaction((tx) => {
      repo.touchFiling(tx, filingId);
      return repo.writeDraft(tx, versionId, step, body ?? null);
    });
    return { saved: false, draftSavedAt, fields };
  }

  db.transaction((tx) => {
    // Autosave sends the same data often; only a real change is written and audited.
    const changed = JSON.stringify(STEP_READERS[step](tx, row)) !== JSON.stringify(parsed.data);
    if (changed) {
      const data = parsed.data as never;
      if (step === 'device') repo.updateDevice(tx, row.device.id, data);
      if (step === 'radios') repo.writeRadios(tx, versionId, data);
      if (step === 'use-positions') repo.writeUsePositions(tx, versionId, data, repo.antennaIdsByKey(tx, versionId));
      if (step === 'markets') repo.writeMarkets(tx, versionId, data);
      repo.touchFiling(tx, filingId);
      addVersionEditor(tx, versionId, actor.id);
      recordAudit(tx, {
        organisationId: actor.organisationId,
        actorUserId: actor.id,
        action: 'filing.step-save',
        targetType: 'filing',
        targetId: filingId,
        details: { step, version: row.version.number },
      });
    }
    repo.clearDraft(tx, versionId, step);
  });
  return { saved: true, filing: getFiling(db, actor, filingId) };
}

/** The import's problems, each keyed by its JSON path, for a 422. */
export function deviceFileProblems(error: Parameters<typeof zodFieldErrors>[0]) {
  const fields = zodFieldErrors(error);
  const count = Object.keys(fields).length;
  return unprocessable(`The device file has ${count} problem${count === 1 ? '' : 's'}; nothing was created.`, fields);
}
