/**
 * The readiness checklist of a filing version: the version's stored data (and, where those parts
 * hold data, its lab results, evidence and report read-back) turned into the pure rules' input
 * (calc/readiness), evaluated on every read.
 */
import type { Db } from '../../db/client';
import type { DataStep, FilingDetail } from '../../constants/schemas/filings';
import { evaluateReadiness, type ReadinessChecklist, type ReadinessInput } from '../../calc/readiness';
import { screeningInput, type ScreeningInput } from '../../calc/screening/input';
import { screenParsed, type ScreeningOutput } from '../../calc/screening/screen';
import * as filingsRepo from '../repos/filings-repo';
import * as reviewRepo from '../repos/review-repo';
import { deviceStepOf } from './filings-service';

export interface VersionData {
  data: FilingDetail['data'];
  simultaneous: string[][];
  unsavedSteps: DataStep[];
}

/** Everything the wizard stores for one version, read the way the wizard shows it. */
export function readVersionData(db: Db, version: reviewRepo.VersionRow, fallbackDeviceId: number): VersionData {
  const device = reviewRepo.findDevice(db, version.deviceId ?? fallbackDeviceId)!;
  return {
    data: {
      device: deviceStepOf(device),
      radios: filingsRepo.readRadios(db, version.id),
      'use-positions': filingsRepo.readUsePositions(db, version.id),
      markets: filingsRepo.readMarkets(db, version.id),
    },
    simultaneous: filingsRepo.readSimultaneous(db, version.id),
    unsavedSteps: filingsRepo.readDrafts(db, version.id).map((d) => d.step),
  };
}

/** The screening calculation's input for a version (the same parts the Screening step passes). */
export function screeningInputOf(v: VersionData): ScreeningInput | null {
  const parsed = screeningInput.safeParse({
    markets: v.data.markets.markets,
    antennas: v.data.radios.antennas.map((a) => ({ id: a.id, gainDbi: a.gainDbi })),
    transmitters: v.data.radios.transmitters,
    usePositions: v.data['use-positions'].usePositions,
  });
  return parsed.success ? parsed.data : null;
}

/** The screening of a version's data (pure; the same engine the Screening step uses). */
export function screenVersion(v: VersionData): ScreeningOutput | null {
  const input = screeningInputOf(v);
  return input ? screenParsed(input) : null;
}

/**
 * Where the lab results, the evidence list and the report read-back plug in: each returns null
 * while the version holds no such data. Their services fill these in as they land.
 */
export const readinessSources: {
  lab: (db: Db, versionId: number) => ReadinessInput['lab'];
  evidence: (db: Db, versionId: number) => ReadinessInput['evidence'];
  reportTuneUps: (db: Db, versionId: number) => ReadinessInput['reportTuneUps'];
  manualSeparations: (db: Db, versionId: number) => ReadinessInput['manualSeparations'];
  hotspotEdges: (db: Db, versionId: number) => ReadinessInput['hotspotEdges'];
} = {
  lab: () => null,
  evidence: () => null,
  reportTuneUps: () => null,
  manualSeparations: () => null,
  hotspotEdges: () => null,
};

export function readinessInput(db: Db, versionId: number, v: VersionData, screening: ScreeningOutput | null): ReadinessInput {
  const { data } = v;
  return {
    device: data.device,
    unsavedSteps: v.unsavedSteps,
    antennaIds: data.radios.antennas.map((a) => a.id),
    transmitters: data.radios.transmitters.map((t) => ({ id: t.id, antennaId: t.antennaId, maxTuneUpPowerDbm: t.maxTuneUpPowerDbm })),
    usePositions: data['use-positions'].usePositions,
    regimes: data.markets.markets.map((m) => m.regime),
    simultaneous: v.simultaneous,
    screening: screening && {
      rows: screening.rows.map((r) => ({ transmitterId: r.transmitterId, usePositionId: r.usePositionId, regime: r.regime, result: r.result, marginDb: r.marginDb })),
      gaps: screening.gaps,
    },
    lab: readinessSources.lab(db, versionId),
    evidence: readinessSources.evidence(db, versionId),
    reportTuneUps: readinessSources.reportTuneUps(db, versionId),
    manualSeparations: readinessSources.manualSeparations(db, versionId),
    hotspotEdges: readinessSources.hotspotEdges(db, versionId),
  };
}

export interface VersionReadiness {
  checklist: ReadinessChecklist;
  screening: ScreeningOutput | null;
  input: ReadinessInput;
}

export function versionReadiness(db: Db, version: reviewRepo.VersionRow, fallbackDeviceId: number): VersionReadiness {
  const v = readVersionData(db, version, fallbackDeviceId);
  const screening = screenVersion(v);
  const input = readinessInput(db, version.id, v, screening);
  return { checklist: evaluateReadiness(input), screening, input };
}
