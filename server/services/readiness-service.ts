/**
 * The readiness checklist of a filing version: the version's stored data — the wizard's steps,
 * its screening, its lab results, its evidence and what its documents say — turned into the pure
 * rules' input (calc/readiness), evaluated on every read.
 */
import { createHash } from 'node:crypto';
import type { Db } from '../../db/client';
import type { DataStep, FilingDetail } from '../../constants/schemas/filings';
import {
  evaluateReadiness,
  MANUAL_SEPARATION_KINDS,
  type ReadinessChecklist,
  type ReadinessCoTransmission,
  type ReadinessInput,
  type ReadinessLabCheck,
  type ReadinessManualSeparation,
  type ReadinessReportFinding,
} from '../../calc/readiness';
import type { CoTransmissionResult, LabCheck } from '../../calc/lab/lab-results';
import { CATEGORY_BY_ID } from '../../constants/schemas/evidence';
import { screeningInput, type ScreeningInput } from '../../calc/screening/input';
import { screenParsed } from '../../calc/screening/screen';
import { ENGINE_VERSION, RULE_SET_VERSION } from '../../calc/versions';
import * as filingsRepo from '../repos/filings-repo';
import * as reviewRepo from '../repos/review-repo';
import { listEvidence } from '../repos/evidence-repo';
import { deviceStepOf } from './filings-service';
import { requiredEvidence, type EvidenceFacts } from './evidence-required';
import { currentEvidence, writtenByFieldfile } from './evidence-step';
import { ByteLru } from './result-cache';
import { versionScreeningOf, type VersionScreening } from './version-screening';
import { clearLabResultsCache, versionLabResults, type LabDeviceData, type VersionLabResults } from './lab-results-cache';
import { filingNumbersOf, versionReadBack, type VersionReadBack } from './version-readback';

export interface VersionData {
  data: FilingDetail['data'];
  simultaneous: string[][];
  /** Combinations of one use position only. */
  simultaneousAt: { usePositionId: string; transmitterIds: string[] }[];
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
    simultaneousAt: filingsRepo.readSimultaneousAt(db, version.id),
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

/** Screenings of recent inputs: the same input always screens the same (key: its hash and the engine's versions). */
const screeningCache = new ByteLru<VersionScreening>(24, () => 1);
/** A version's parsed screening input and its key, worked out once per read of the version. */
const screeningInputs = new WeakMap<VersionData, { input: ScreeningInput | null; key: string }>();

function screeningInputAndKey(v: VersionData): { input: ScreeningInput | null; key: string } {
  let entry = screeningInputs.get(v);
  if (!entry) {
    const input = screeningInputOf(v);
    const key = input
      ? createHash('sha256')
          .update(`${ENGINE_VERSION}\u0000${RULE_SET_VERSION}\u0000${JSON.stringify(input)}`)
          .digest('hex')
      : 'none';
    screeningInputs.set(v, (entry = { input, key }));
  }
  return entry;
}

/** The hash of a version's screening input ("none" when it cannot be screened). */
export function screeningKeyOf(v: VersionData): string {
  return screeningInputAndKey(v).key;
}

/** Forgets the cached screenings and lab results (benchmarks time a cold read with it). */
export function clearReadinessCaches(): void {
  screeningCache.clear();
  clearLabResultsCache();
}

/** The screening of a version's data, without the working (the same engine the Screening step uses). */
export function screenVersion(v: VersionData): VersionScreening | null {
  const { input, key } = screeningInputAndKey(v);
  if (!input) return null;
  return screeningCache.get(key) ?? screeningCache.set(key, versionScreeningOf(screenParsed(input)));
}

/**
 * What the readiness rules read beside the wizard's data, for one version. Each part is computed
 * from stored data on every read:
 * - lab: the calc/lab `lab-results` calculation over the version's measurements, checks,
 *   instruments and budget (cached per input hash in lab-results-cache);
 * - evidence: `requiredEvidenceRules(facts)` against the version's current evidence;
 * - report read-back: the test reports' text against the filing's numbers (tune-up powers, the
 *   highest reported SAR, separations, model), with the engineers' explanations;
 * - the user manual's stated separations and the antenna drawing's edge distances, read from
 *   their PDFs' text.
 */
export interface FeedContext {
  db: Db;
  versionId: number;
  data: VersionData;
  screening: VersionScreening | null;
  /** The version's lab results (computed once per context). */
  lab(): VersionLabResults | null;
  /** The version's read-back (computed once per context, after the lab results it compares with). */
  readBack(): VersionReadBack;
  /** The version's evidence list (read once per context: the evidence and read-back feeds both need it). */
  evidence(): ReturnType<typeof listEvidence>;
}

/** Which lab checks feed which rules; the rest (power, limit, coverage, uncertainty, co-transmission) have rules of their own. */
const LAB_CHECK_KINDS: Partial<Record<LabCheck['kind'], ReadinessLabCheck['kind']>> = {
  liquid: 'liquid',
  'liquid-temperature': 'liquid',
  'system-check': 'system-check',
  drift: 'drift',
  calibration: 'calibration',
  repeats: 'repeat',
  separation: 'separation',
  band: 'reference',
  mass: 'record',
};

function readinessLabCheck(c: LabCheck): ReadinessLabCheck | null {
  const kind = LAB_CHECK_KINDS[c.kind];
  // A measurement's own copy of an instrument out of calibration is listed once, under the instrument.
  if (!kind || (c.kind === 'calibration' && c.subject.type === 'measurement')) return null;
  const gap = c.status === 'warning';
  const label = c.status === 'fail' && c.value && !c.message.includes(c.value) ? `${c.message.replace(/\.$/, '')}: ${c.value}.` : c.message;
  return { kind, ok: c.status === 'pass', ...(gap ? { gap } : {}), label, source: c.source };
}

const CO_TX_STATUS: Record<CoTransmissionResult['outcome'], ReadinessCoTransmission['status']> = {
  'sum-within-limit': 'within-limit',
  'splsr-within-limit': 'ratio-ok',
  'over-limit': 'over-limit',
  'needs-simultaneous-measurement': 'needs-simultaneous-measurement',
  incomplete: 'incomplete',
};

export function labFeed(lab: VersionLabResults | null): ReadinessInput['lab'] {
  if (!lab) return null;
  const references: ReadinessLabCheck[] = lab.orphans.map((o) => ({
    kind: 'reference',
    ok: false,
    label: `Measurement ${o.measurementId} names ${o.field} “${o.value}”, which the device data does not have; it is left out of the lab results.`,
  }));
  const r = lab.results;
  if (!r) {
    references.push({ kind: 'reference', ok: false, label: `The lab results could not be computed: ${lab.error}` });
    return { measurements: [], highest: [], checks: references, coTransmission: [], uncertainty: null };
  }
  const checks = references;
  for (const c of r.checks) {
    const mapped = readinessLabCheck(c);
    if (mapped) checks.push(mapped);
  }
  return {
    measurements: r.rows.map((m) => ({
      measurementId: m.measurementId,
      transmitterId: m.transmitterId,
      usePositionId: m.usePositionId,
      measuredPowerDbm: m.measuredPowerDbm,
      tuneUpPowerDbm: m.tuneUpPowerDbm,
      testSeparationM: m.testSeparationM,
    })),
    highest: r.highest
      .filter((h) => h.reportedSarWPerKg !== null)
      .map((h) => ({
        regime: h.regime,
        usePositionKind: h.usePositionKind,
        reportedSarWPerKg: h.reportedSarWPerKg!,
        limitWPerKg: h.limitWPerKg,
        transmitterId: h.transmitterId!,
        usePositionId: h.usePositionId!,
      })),
    checks,
    coTransmission: r.coTransmission.map((c) => ({ transmitterIds: c.transmitterIds, usePositionId: c.usePositionId, regime: c.regime, status: CO_TX_STATUS[c.outcome] })),
    uncertainty:
      r.uncertainty.highestMeasuredSarWPerKg === null
        ? null
        : { required: r.uncertainty.required, given: r.uncertainty.expandedPct !== null, expandedPct: r.uncertainty.expandedPct, limitPct: r.uncertainty.limitPct },
  };
}

function evidenceFeed(ctx: FeedContext): ReadinessInput['evidence'] {
  const { data } = ctx.data;
  const facts: EvidenceFacts = {
    markets: data.markets.markets.map((m) => m.regime),
    usePositionKinds: data['use-positions'].usePositions.map((p) => p.kind),
    screening: ctx.screening && !ctx.data.unsavedSteps.length ? ctx.screening.summary.total : null,
    labResults: { sar: ctx.lab()?.stored ?? 0, mpe: 0 },
  };
  const required = requiredEvidence(facts, currentEvidence(ctx.db, ctx.versionId, ctx.evidence()), writtenByFieldfile);
  return { required: required.map((r) => ({ category: r.category, label: CATEGORY_BY_ID[r.category].label, present: r.present })) };
}

const where = (title: string, page: number | null) => `“${title}”${page ? `, page ${page}` : ''}`;

function reportTuneUpsFeed(ctx: FeedContext): ReadinessInput['reportTuneUps'] {
  const report = ctx.readBack().report;
  if (!report) return null;
  return report
    .filter((f) => f.tuneUp)
    .map((f) => ({ transmitterId: f.tuneUp!.transmitterId, reportTuneUpPowerDbm: f.tuneUp!.reportTuneUpPowerDbm, where: where(f.title, f.page), explained: f.explanation !== null }));
}

function reportFindingsFeed(ctx: FeedContext): ReadinessInput['reportFindings'] {
  const report = ctx.readBack().report;
  if (!report) return null;
  return report
    .filter((f) => f.kind !== 'tune-up-power')
    .map((f) => ({ kind: f.kind as ReadinessReportFinding['kind'], text: f.kind === 'unreadable' ? f.message : `${where(f.title, null)}: ${f.message}`, explained: f.explanation !== null }));
}

function manualSeparationsFeed(ctx: FeedContext): ReadinessInput['manualSeparations'] {
  const statements = ctx.readBack().manual;
  if (!statements) return null;
  const out: ReadinessManualSeparation[] = [];
  for (const p of ctx.data.data['use-positions'].usePositions) {
    if (!(MANUAL_SEPARATION_KINDS as readonly string[]).includes(p.kind)) continue;
    // A sentence naming no condition ("at least 10 mm from your body") speaks for every body-worn and hotspot position.
    const applicable = statements.filter((s) => s.kind === p.kind || s.kind === null);
    if (!applicable.length) continue;
    const smallest = applicable.reduce((a, b) => (b.separationMm < a.separationMm ? b : a));
    out.push({ usePositionId: p.id, statedSeparationM: smallest.separationMm / 1000, where: where(smallest.title, smallest.page) });
  }
  return out;
}

function hotspotEdgesFeed(ctx: FeedContext): ReadinessInput['hotspotEdges'] {
  const edges = ctx.readBack().edges;
  return edges && edges.map((e) => ({ edge: e.edge, antennaId: e.antennaId, distanceM: e.distanceMm / 1000, where: where(e.title, e.page) }));
}

/** The feeds, one per part of the input; a test may replace one to isolate a rule. */
export const readinessSources: {
  lab: (ctx: FeedContext) => ReadinessInput['lab'];
  evidence: (ctx: FeedContext) => ReadinessInput['evidence'];
  reportTuneUps: (ctx: FeedContext) => ReadinessInput['reportTuneUps'];
  reportFindings: (ctx: FeedContext) => ReadinessInput['reportFindings'];
  manualSeparations: (ctx: FeedContext) => ReadinessInput['manualSeparations'];
  hotspotEdges: (ctx: FeedContext) => ReadinessInput['hotspotEdges'];
} = {
  lab: (ctx) => labFeed(ctx.lab()),
  evidence: evidenceFeed,
  reportTuneUps: reportTuneUpsFeed,
  reportFindings: reportFindingsFeed,
  manualSeparations: manualSeparationsFeed,
  hotspotEdges: hotspotEdgesFeed,
};

/** The lab device data of a version (what calc/lab reads of the wizard's steps). */
export function labDeviceDataOf(v: VersionData): LabDeviceData {
  return {
    markets: v.data.markets.markets.map((m) => ({ regime: m.regime, tier: m.tier })),
    transmitters: v.data.radios.transmitters,
    usePositions: v.data['use-positions'].usePositions,
    simultaneous: v.simultaneous,
    simultaneousAt: v.simultaneousAt,
  };
}

export function feedContext(db: Db, versionId: number, v: VersionData, screening: VersionScreening | null): FeedContext {
  let lab: VersionLabResults | null | undefined;
  let readBack: VersionReadBack | undefined;
  let evidence: ReturnType<typeof listEvidence> | undefined;
  const ctx: FeedContext = {
    db,
    versionId,
    data: v,
    screening,
    lab: () => (lab === undefined ? (lab = versionLabResults(db, versionId, labDeviceDataOf(v), { screening, screeningKey: screeningKeyOf(v) })) : lab),
    evidence: () => (evidence ??= listEvidence(db, versionId)),
    readBack: () => {
      if (readBack) return readBack;
      const { data } = v;
      const numbers = filingNumbersOf(data.device.model, data.radios.transmitters, data['use-positions'].usePositions, ctx.lab()?.results?.highest ?? []);
      const documents = ctx.evidence().map((r) => r.row);
      return (readBack = versionReadBack(
        db,
        versionId,
        documents,
        numbers,
        data.radios.antennas.map((a) => a.id),
      ));
    },
  };
  return ctx;
}

export function readinessInput(db: Db, versionId: number, v: VersionData, screening: VersionScreening | null): ReadinessInput {
  const { data } = v;
  const ctx = feedContext(db, versionId, v, screening);
  return {
    device: data.device,
    unsavedSteps: v.unsavedSteps,
    antennaIds: data.radios.antennas.map((a) => a.id),
    transmitters: data.radios.transmitters.map((t) => ({ id: t.id, antennaId: t.antennaId, maxTuneUpPowerDbm: t.maxTuneUpPowerDbm })),
    usePositions: data['use-positions'].usePositions,
    regimes: data.markets.markets.map((m) => m.regime),
    simultaneous: v.simultaneous,
    simultaneousAt: v.simultaneousAt,
    screening: screening && {
      rows: screening.rows.map((r) => ({ transmitterId: r.transmitterId, usePositionId: r.usePositionId, regime: r.regime, result: r.result, marginDb: r.marginDb })),
      gaps: screening.gaps,
    },
    lab: readinessSources.lab(ctx),
    evidence: readinessSources.evidence(ctx),
    reportTuneUps: readinessSources.reportTuneUps(ctx),
    reportFindings: readinessSources.reportFindings(ctx),
    manualSeparations: readinessSources.manualSeparations(ctx),
    hotspotEdges: readinessSources.hotspotEdges(ctx),
  };
}

export interface VersionReadiness {
  checklist: ReadinessChecklist;
  screening: VersionScreening | null;
  input: ReadinessInput;
}

export function versionReadiness(db: Db, version: reviewRepo.VersionRow, fallbackDeviceId: number): VersionReadiness {
  const v = readVersionData(db, version, fallbackDeviceId);
  const screening = screenVersion(v);
  const input = readinessInput(db, version.id, v, screening);
  return { checklist: evaluateReadiness(input), screening, input };
}
