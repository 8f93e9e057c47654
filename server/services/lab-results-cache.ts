/**
 * The lab results of a version's stored data, computed with calc/lab `lab-results` and kept in
 * memory per input hash: the readiness checklist, the evidence list and the comparison of two
 * versions all ask for the same results on every read, and a 500-measurement filing takes tens
 * of milliseconds to compute. The key is the SHA-256 of the engine's parsed input with the engine
 * and rule-set versions, so a cached result is exactly what a fresh computation would return.
 */
import { createHash } from 'node:crypto';
import type { Db } from '../../db/client';
import type { LabData } from '../../constants/schemas/lab';
import { CalcRangeError } from '../../calc/types';
import { ENGINE_VERSION, RULE_SET_VERSION } from '../../calc/versions';
import { computeLabResults, labResultsInput, labScreeningRows, type LabResults } from '../../calc/lab/lab-results';
import type { ScreeningOutput } from '../../calc/screening/screen';
import * as labRepo from '../repos/lab-repo';

/** How many distinct inputs are kept (a few filings' versions being read and compared). */
const CACHE_ENTRIES = 24;
const cache = new Map<string, LabResults>();

/** The parts of a version's device data the lab results read. */
export interface LabDeviceData {
  markets: { regime: string; tier?: string }[];
  transmitters: { id: string; frequencyMinHz: number; frequencyMaxHz: number; maxTuneUpPowerDbm: number; dutyCycle?: number; antennaId: string }[];
  usePositions: { id: string; kind: string; separations: { antennaId: string; separationM: number }[] }[];
  simultaneous: string[][];
}

/** A measurement that names a transmitter or use position the device data does not have. */
export interface OrphanMeasurement {
  measurementId: string;
  field: 'transmitter' | 'use position';
  value: string;
}

export interface VersionLabResults {
  /** Null when the engine refused the data (a value out of its range); `error` says why. */
  results: LabResults | null;
  error?: string;
  /** Measurements left out because they name ids the device data does not have. */
  orphans: OrphanMeasurement[];
  /** How many measurements the version stores (orphans included). */
  stored: number;
}

export const hasLabData = (lab: LabData) =>
  lab.measurements.length + lab.liquidChecks.length + lab.systemChecks.length + lab.instruments.length + lab.components.length > 0;

function cached(key: string, compute: () => LabResults): LabResults {
  const hit = cache.get(key);
  if (hit) {
    // Most recently used last, so the oldest is the first key.
    cache.delete(key);
    cache.set(key, hit);
    return hit;
  }
  const value = compute();
  cache.set(key, value);
  if (cache.size > CACHE_ENTRIES) cache.delete(cache.keys().next().value!);
  return value;
}

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
export function versionLabResults(db: Db, versionId: number, device: LabDeviceData, screening: ScreeningOutput | null, lab: LabData = labRepo.readLabData(db, versionId)): VersionLabResults | null {
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
  const parsed = labResultsInput.safeParse({
    markets: device.markets,
    transmitters: device.transmitters,
    usePositions: device.usePositions,
    simultaneous: device.simultaneous.filter((g) => g.every((t) => txIds.has(t))),
    screening: screening ? labScreeningRows(screening.rows) : [],
    measurements,
    liquidChecks: lab.liquidChecks,
    systemChecks: lab.systemChecks,
    instruments: lab.instruments,
    uncertainty: lab.components,
  });
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    return { results: null, error: `${first.path.join('.')}: ${first.message}`, orphans, stored: lab.measurements.length };
  }
  const json = JSON.stringify(parsed.data);
  const key = `${ENGINE_VERSION}|${RULE_SET_VERSION}|${createHash('sha256').update(json).digest('hex')}`;
  try {
    const results = cached(key, () => {
      const { derivation: _d, ...out } = computeLabResults(parsed.data);
      return out;
    });
    return { results, orphans, stored: lab.measurements.length };
  } catch (err) {
    if (!(err instanceof CalcRangeError)) throw err;
    return { results: null, error: err.message, orphans, stored: lab.measurements.length };
  }
}
