/**
 * The Evidence step's status for the step list, and the facts the required-categories rule
 * reads, from a filing's data. Kept apart from evidence-service so filings-service can call it
 * without an import cycle.
 */
import type { Db } from '../../db/client';
import { CATEGORY_BY_ID } from '../../constants/schemas/evidence';
import { DATA_STEPS, type FilingDetail, type StepStatus } from '../../constants/schemas/filings';
import { screeningInput } from '../../calc/screening/input';
import { screenParsed, type ScreeningCounts } from '../../calc/screening/screen';
import { listEvidence } from '../repos/evidence-repo';
import { countMeasurements } from '../repos/lab-repo';
import { requiredEvidence, type EvidenceFacts } from './evidence-required';

type FilingData = Pick<FilingDetail, 'data' | 'steps'>;

/** The entered data is complete (the computed steps, this one included, do not count). */
const dataComplete = (f: FilingData) => f.steps.filter((s) => (DATA_STEPS as readonly string[]).includes(s.step)).every((s) => s.complete);

/** Screening counts of the filing's data; null while a data step is incomplete. */
export function screeningCounts(f: FilingData): ScreeningCounts | null {
  if (!dataComplete(f)) return null;
  const parsed = screeningInput.safeParse({
    markets: f.data.markets.markets,
    antennas: f.data.radios.antennas.map((a) => ({ id: a.id, gainDbi: a.gainDbi })),
    transmitters: f.data.radios.transmitters,
    usePositions: f.data['use-positions'].usePositions,
  });
  return parsed.success ? screenParsed(parsed.data).summary.total : null;
}

/** The facts the required-categories rule reads; `labSar` is how many SAR measurements the lab entered. */
export function evidenceFactsOf(f: FilingData, labSar = 0): EvidenceFacts {
  return {
    markets: f.data.markets.markets.map((m) => m.regime),
    usePositionKinds: f.data['use-positions'].usePositions.map((p) => p.kind),
    screening: screeningCounts(f),
    // The lab data holds SAR measurements only; MPE results are not entered as lab data.
    labResults: { sar: labSar, mpe: 0 },
  };
}

/** The version's current (not replaced) evidence, by category. */
/** The version's current (not replaced) evidence; `rows`: its evidence list when the caller has read it already. */
export function currentEvidence(db: Db, versionId: number, rows: ReturnType<typeof listEvidence> = listEvidence(db, versionId)) {
  return rows.filter((r) => r.row.replacedById === null).map((r) => ({ id: r.row.id, category: r.row.category }));
}

export const writtenByFieldfile = (c: keyof typeof CATEGORY_BY_ID) => !!CATEGORY_BY_ID[c].writtenByFieldfile;

export function requiredForVersion(db: Db, versionId: number, f: FilingData) {
  return requiredEvidence(evidenceFactsOf(f, countMeasurements(db, versionId)), currentEvidence(db, versionId), writtenByFieldfile);
}

/** Complete when every required category is present; until screening can run, it waits. */
export function evidenceStepStatus(db: Db, versionId: number, f: FilingData): StepStatus {
  const missing = requiredForVersion(db, versionId, f).filter((r) => !r.present);
  const problems = missing.map((r) => `Missing: ${CATEGORY_BY_ID[r.category].label.toLowerCase()}.`);
  if (!dataComplete(f)) problems.unshift('The full list of required evidence follows from a complete filing.');
  return { step: 'evidence', complete: problems.length === 0, problems, hasDraft: false, warnings: [] };
}
