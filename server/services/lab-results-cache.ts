/**
 * The lab results of a version's stored data, computed with calc/lab `lab-results` and kept in
 * memory per input hash: the readiness checklist, the evidence list and the comparison of two
 * versions all ask for the same results on every read, and a 500-measurement filing takes tens
 * of milliseconds to compute. The key is the SHA-256 of the engine's parsed input with the engine
 * and rule-set versions, so a cached result is exactly what a fresh computation would return.
 * What is kept leaves out the derivations (the Lab results step and the exhibit read the stored
 * results, derivations included): none of these readers shows one, and the derivations are most of
 * a result's memory, which otherwise outlives the request in the cache and is copied by every
 * young-generation collection until promoted.
 */
import { createHash } from 'node:crypto';
import type { Db } from '../../db/client';
import type { LabData } from '../../constants/schemas/lab';
import { CalcRangeError } from '../../calc/types';
import { ENGINE_VERSION, RULE_SET_VERSION } from '../../calc/versions';
import {
  computeLabResults,
  labResultsInput,
  labScreeningRows,
  type CoTransmissionResult,
  type LabResults,
  type LabResultsInputRaw,
  type LabRow,
  type UncertaintySummary,
} from '../../calc/lab/lab-results';
import type { VersionScreening } from './version-screening';
import * as labRepo from '../repos/lab-repo';
import { ByteLru } from './result-cache';

/** How many distinct inputs are kept (a few filings' versions being read and compared); each counts as one. */
const CACHE_ENTRIES = 24;
const cache = new ByteLru<VersionLabResultsData | { error: string }>(CACHE_ENTRIES, () => 1);

/** The lab results without their derivations: every figure, check and verdict, none of the working. */
export interface VersionLabResultsData extends Omit<LabResults, 'rows' | 'coTransmission' | 'uncertainty'> {
  rows: Omit<LabRow, 'derivation'>[];
  coTransmission: Omit<CoTransmissionResult, 'derivation'>[];
  uncertainty: Omit<UncertaintySummary, 'derivation'>;
}

function withoutDerivations({ rows, coTransmission, uncertainty: { derivation: _u, ...uncertainty }, ...rest }: LabResults): VersionLabResultsData {
  return {
    ...rest,
    rows: rows.map(({ derivation: _d, ...row }) => row),
    coTransmission: coTransmission.map(({ derivation: _d, ...c }) => c),
    uncertainty,
  };
}

/** The parts of a version's device data the lab results read. */
export interface LabDeviceData {
  markets: { regime: string; tier?: string }[];
  transmitters: { id: string; frequencyMinHz: number; frequencyMaxHz: number; maxTuneUpPowerDbm: number; dutyCycle?: number; antennaId: string }[];
  usePositions: { id: string; kind: string; separations: { antennaId: string; separationM: number }[] }[];
  simultaneous: string[][];
  /** Combinations of one use position only. */
  simultaneousAt?: { usePositionId: string; transmitterIds: string[] }[];
}

/** A measurement that names a transmitter or use position the device data does not have. */
export interface OrphanMeasurement {
  measurementId: string;
  field: 'transmitter' | 'use position';
  value: string;
}

export interface VersionLabResults {
  /** Null when the engine refused the data (a value out of its range); `error` says why. */
  results: VersionLabResultsData | null;
  error?: string;
  /** Measurements left out because they name ids the device data does not have. */
  orphans: OrphanMeasurement[];
  /** How many measurements the version stores (orphans included). */
  stored: number;
}

export const hasLabData = (lab: LabData) => lab.measurements.length + lab.liquidChecks.length + lab.systemChecks.length + lab.instruments.length + lab.components.length > 0;

/** Forgets every cached result (tests and benchmarks time a cold computation with it). */
export function clearLabResultsCache(): void {
  cache.clear();
}

/**
 * The lab results of a version: its stored lab data against its device data and screening.
 * Null when the device data cannot be evaluated (screening could not run) and nothing is recorded
 * either. With no lab data at all it still evaluates co-transmission from screening (a
 * combination of exempt transmitters is summed from their estimated SAR).
 */
export function versionLabResults(
  db: Db,
  versionId: number,
  device: LabDeviceData,
  /** The version's screening and the key of its input (the same input gives the same rows). */
  { screening, screeningKey }: { screening: VersionScreening | null; screeningKey: string },
  lab: LabData = labRepo.readLabData(db, versionId),
): VersionLabResults | null {
  if (!screening && !hasLabData(lab)) return null;
  const txIds = new Set(device.transmitters.map((t) => t.id));
  const posIds = new Set(device.usePositions.map((p) => p.id));
  const orphans: OrphanMeasurement[] = [];
  const measurements = lab.measurements.filter((m) => {
    if (!txIds.has(m.transmitterId)) orphans.push({ measurementId: m.id, field: 'transmitter', value: m.transmitterId });
    else if (!posIds.has(m.usePositionId)) orphans.push({ measurementId: m.id, field: 'use position', value: m.usePositionId });
    else return true;
    return false;
  });
  const raw: LabResultsInputRaw = {
    markets: device.markets as LabResultsInputRaw['markets'],
    transmitters: device.transmitters,
    usePositions: device.usePositions as LabResultsInputRaw['usePositions'],
    simultaneous: device.simultaneous.filter((g) => g.every((t) => txIds.has(t))),
    simultaneousAt: (device.simultaneousAt ?? []).filter((g) => posIds.has(g.usePositionId) && g.transmitterIds.every((t) => txIds.has(t))),
    screening: [],
    measurements,
    liquidChecks: lab.liquidChecks,
    systemChecks: lab.systemChecks,
    instruments: lab.instruments,
    uncertainty: lab.components,
  };
  // The key is taken before validation: the screening rows are a pure function of the screening
  // input (hashed instead of the 480 rows), and validating 500 rows is most of a hit's cost.
  const key = createHash('sha256').update(`${ENGINE_VERSION}\u0000${RULE_SET_VERSION}\u0000${screeningKey}\u0000`).update(JSON.stringify(raw)).digest('hex');
  const results = cache.get(key) ?? cache.set(key, compute());
  function compute(): VersionLabResultsData | { error: string } {
    const parsed = labResultsInput.safeParse({ ...raw, screening: screening ? labScreeningRows(screening.rows) : [] });
    if (!parsed.success) {
      const first = parsed.error.issues[0];
      return { error: `${first.path.join('.')}: ${first.message}` };
    }
    try {
      const { derivation: _d, ...out } = computeLabResults(parsed.data);
      return withoutDerivations(out);
    } catch (err) {
      if (!(err instanceof CalcRangeError)) throw err;
      return { error: err.message };
    }
  }
  if ('error' in results) return { results: null, error: results.error, orphans, stored: lab.measurements.length };
  return { results, orphans, stored: lab.measurements.length };
}
