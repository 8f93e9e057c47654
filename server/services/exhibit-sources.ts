/**
 * What the exhibit takes from the rest of Fieldfile, always for one version (an older version's
 * package shows that version's own data): the lab results (the lab-results calculation over the
 * version's lab data and screening), the readiness checklist (as stored with the signature, or a
 * draft's checklist now), the signature block, and the evidence files with the SHA-256 taken at
 * upload. Evidence bytes come through `ExhibitSources`, so a bench or a test can hand in its own.
 */
import { Readable } from 'node:stream';
import type { Db } from '../../db/client';
import type { ReadinessChecklist } from '../../calc/readiness';
import type { CoTransmissionResult, LabCheck, LabResults } from '../../calc/lab/lab-results';
import type { ScreeningRow } from '../../calc/screening/screen';
import type { Derivation } from '../../calc/types';
import { EVIDENCE_CATEGORIES, EVIDENCE_CATEGORY_IDS } from '../../constants/schemas/evidence';
import { INSTRUMENT_KIND_LABELS, type InstrumentKind } from '../../constants/schemas/lab';
import type { ExhibitAppendixEntry, ExhibitLab, ExhibitReadiness, ExhibitSignature } from '../../templates/exhibit/model';
import { CHECK_KIND_LABELS, CONDITION_LABELS, COTX_OUTCOME_WORDS, REGIME_SHORT } from '../../templates/exhibit/texts';
import type { ByteStorage } from '../storage';
import { listEvidence } from '../repos/evidence-repo';
import * as labRepo from '../repos/lab-repo';
import * as reviewRepo from '../repos/review-repo';
import { labInputOf, storedLabResults, type LabVersionData } from './lab-service';
import { versionReadiness } from './readiness-service';

export interface PackageEvidence {
  /** The category's id: the folder inside the zip. */
  categoryId: string;
  /** The category's name as the exhibit shows it. */
  category: string;
  title: string;
  fileName: string;
  sizeBytes: number;
  /** Taken when the file was uploaded, so the build reads each file's bytes once. */
  sha256: string;
  uploadedAt: string;
  open(): Readable;
}

export interface ExhibitSources {
  /** The version's current evidence files in a fixed order (category, then name). */
  evidence(db: Db, versionId: number): PackageEvidence[];
}

/**
 * The read size for evidence going into a package: a package streams up to gigabytes, and each
 * chunk passes through half a dozen of archiver's streams, so fewer, larger chunks cost less than
 * the stream default (64 KB). Larger than 256 KB gained little time and raised the peak memory
 * (more bytes in flight, and buffers of a megabyte that malloc keeps) (`npm run bench -- "package build"`).
 */
export const EVIDENCE_READ_CHUNK_BYTES = 256 << 10;

/** A stream that asks the storage for the bytes only when the zip reaches this file. */
export function storedEvidenceStream(storage: ByteStorage, sha256: string): Readable {
  return Readable.from(
    (async function* () {
      yield* await storage.get(sha256, { chunkBytes: EVIDENCE_READ_CHUNK_BYTES });
    })(),
    { objectMode: false },
  );
}

const categoryOrder = (id: string) => (EVIDENCE_CATEGORY_IDS as readonly string[]).indexOf(id);
const categoryLabel = (id: string) => EVIDENCE_CATEGORIES.find((c) => c.id === id)?.label ?? id;

/** The evidence as uploaded: current records only (a replaced file stays in history, not in the package). */
export function storedEvidence(uploads: ByteStorage): ExhibitSources {
  return {
    evidence: (db, versionId) =>
      listEvidence(db, versionId)
        .map((r) => r.row)
        .filter((r) => r.replacedById === null)
        .sort((a, b) => categoryOrder(a.category) - categoryOrder(b.category) || a.fileName.localeCompare(b.fileName, 'en') || a.id - b.id)
        .map((r) => ({
          categoryId: r.category,
          category: categoryLabel(r.category),
          title: r.title,
          fileName: r.fileName,
          sizeBytes: r.sizeBytes,
          sha256: r.sha256,
          uploadedAt: r.uploadedAt,
          open: () => storedEvidenceStream(uploads, r.sha256),
        })),
  };
}

// --- lab results -----------------------------------------------------------------------------

const market = (regime: string) => REGIME_SHORT[regime] ?? regime;
const condition = (kind: string) => CONDITION_LABELS[kind] ?? kind;
const num3 = (x: number) => String(Number(x.toPrecision(3)));

function contributionText(c: CoTransmissionResult['contributions'][number]): string {
  if (c.value === null) return `${c.transmitterId}: missing`;
  if (c.basis === 'ratio') return `${c.transmitterId}: ${num3(c.value)} of its limit`;
  const where = c.basis === 'reported' ? `reported, ${c.measurementId}` : 'estimated, exempt from testing';
  return `${c.transmitterId}: ${num3(c.value)} W/kg (${where})`;
}

function checkRow(c: LabCheck): ExhibitLab['checks'][number] {
  return {
    kindId: c.kind,
    kind: CHECK_KIND_LABELS[c.kind] ?? c.kind,
    subjectType: c.subject.type,
    subject: c.subject.id,
    status: c.status,
    value: c.value ?? '—',
    tolerance: c.tolerance ?? '—',
    message: c.message,
    source: c.source,
  };
}

/**
 * The version's lab section and its how-computed entries (L… per measurement, C… per
 * co-transmission evaluation, U1 for the uncertainty budget); null when no lab data is recorded.
 */
export function labSection(db: Db, versionId: number, data: LabVersionData, screeningRows: ScreeningRow[]): { lab: ExhibitLab; appendix: ExhibitAppendixEntry[] } | null {
  const labData = labRepo.readLabData(db, versionId);
  if (!labData.measurements.length && !labData.liquidChecks.length && !labData.systemChecks.length && !labData.instruments.length && !labData.components.length) return null;
  const input = labInputOf(db, versionId, data, screeningRows, labData);
  const r = JSON.parse(storedLabResults(db, versionId, input).output) as Omit<LabResults, 'derivation'>;
  const appendix: ExhibitAppendixEntry[] = [];
  const entry = (ref: string, title: string, derivation: Derivation) => {
    appendix.push({ ref, title, derivation });
    return ref;
  };

  const sarResults = r.rows.map((row, i) => ({
    measurementId: row.measurementId,
    transmitterId: row.transmitterId,
    usePositionId: row.usePositionId,
    exposureCondition: condition(row.usePositionKind),
    testPosition: row.testPosition,
    channel: row.channel,
    frequencyHz: row.frequencyHz,
    testSeparationM: row.testSeparationM,
    testDate: row.testDate,
    measuredPowerDbm: row.measuredPowerDbm,
    tuneUpPowerDbm: row.tuneUpPowerDbm,
    scalingFactor: row.scalingFactor,
    measuredSar1gWPerKg: row.measuredSar1gWPerKg,
    measuredSar10gWPerKg: row.measuredSar10gWPerKg,
    reportedSar1gWPerKg: row.reportedSar1gWPerKg,
    reportedSar10gWPerKg: row.reportedSar10gWPerKg,
    powerDriftDb: labData.measurements.find((m) => m.id === row.measurementId)?.driftDb ?? null,
    appendixRef: entry(`L${i + 1}`, `Reported SAR of ${row.measurementId}: ${row.transmitterId} at ${row.usePositionId}`, row.derivation),
  }));

  const coTransmission = r.coTransmission.map((c, i) => ({
    id: c.id,
    market: market(c.regime),
    usePositionId: c.usePositionId,
    exposureCondition: condition(c.usePositionKind),
    transmitterIds: c.transmitterIds,
    method: c.method,
    contributions: c.contributions.map(contributionText),
    sum: c.sum,
    limit: c.limit,
    unit: c.method === 'sum-of-sar' ? ('W/kg' as const) : ('1' as const),
    outcome: COTX_OUTCOME_WORDS[c.outcome] ?? c.outcome,
    pass: c.outcome === 'sum-within-limit' || c.outcome === 'splsr-within-limit',
    appendixRef: entry(`C${i + 1}`, `Simultaneous transmission ${c.transmitterIds.join(' + ')} at ${c.usePositionId}, ${market(c.regime)}`, c.derivation),
  }));

  const u = r.uncertainty;
  const uncertainty: ExhibitLab['uncertainty'] =
    labData.components.length || u.required
      ? {
          required: u.required,
          highestMeasuredSarWPerKg: u.highestMeasuredSarWPerKg,
          highestMeasuredMass: u.highestMeasuredMass,
          combinedStandardPercent: u.combinedStandardPct,
          expandedPercent: u.expandedPct,
          coverageFactor: u.coverageFactor,
          limitPercent: u.limitPct,
          components: labData.components.map((c) => ({
            name: c.name,
            valuePercent: c.valuePct,
            distribution: c.distribution,
            divisor: c.divisor,
            sensitivity: c.sensitivity,
            degreesOfFreedom: c.degreesOfFreedom,
          })),
          appendixRef: u.derivation ? entry('U1', 'Combined and expanded measurement uncertainty', u.derivation) : null,
        }
      : null;

  const calibrated = (id: string) => !r.checks.some((c) => c.kind === 'calibration' && c.subject.id === id && c.status === 'fail');
  return {
    lab: {
      sarResults,
      highestReported: r.highest.map((h) => ({
        market: market(h.regime),
        tier: h.tier,
        exposureCondition: condition(h.usePositionKind),
        averagingMassKg: h.averagingMassKg,
        reportedSarWPerKg: h.reportedSarWPerKg,
        limitWPerKg: h.limitWPerKg,
        marginDb: h.marginDb,
        withinLimit: h.withinLimit,
        transmitterId: h.transmitterId,
        usePositionId: h.usePositionId,
        measurementId: h.measurementId,
        source: h.source,
      })),
      coTransmission,
      checks: r.checks.map(checkRow),
      instruments: labData.instruments.map((ins) => ({
        id: ins.id,
        kind: INSTRUMENT_KIND_LABELS[ins.kind as InstrumentKind] ?? ins.kind,
        model: ins.model,
        serial: ins.serial,
        calibratedOn: ins.calibrationDate,
        calibrationDueOn: ins.dueDate,
        inCalibration: calibrated(ins.id),
      })),
      uncertainty,
      coverage: r.coverage.map((c) => ({
        transmitterId: c.transmitterId,
        usePositionId: c.usePositionId,
        exposureCondition: condition(c.usePositionKind),
        markets: c.regimes.map(market),
        measurementIds: c.measurementIds,
        status: c.status,
      })),
      summary: r.summary,
    },
    appendix,
  };
}

// --- readiness and signature -----------------------------------------------------------------

function readinessOf(checklist: ReadinessChecklist, basis: ExhibitReadiness['basis'], asOf: string): ExhibitReadiness {
  return {
    basis,
    asOf,
    ready: checklist.ready,
    counts: checklist.counts,
    items: checklist.items.map((i) => ({
      id: i.id,
      title: i.title,
      severity: i.severity,
      status: i.status,
      detail: i.status === 'fail' ? [...i.findings.map((f) => f.text), `Fix: ${i.fix}`].join(' ') : i.status === 'not-applicable' ? 'Does not apply to this filing.' : '',
    })),
  };
}

/**
 * The readiness checklist for the exhibit: a signed version's as it stood at signing (stored in
 * the signing transaction), otherwise the draft's checklist now, dated with the document date.
 */
export function readinessSection(db: Db, version: reviewRepo.VersionRow, fallbackDeviceId: number, signature: reviewRepo.SignatureRow | undefined, documentDate: string): ExhibitReadiness {
  if (signature) return readinessOf(JSON.parse(signature.checklist) as ReadinessChecklist, 'at-signing', signature.signedAt);
  return readinessOf(versionReadiness(db, version, fallbackDeviceId).checklist, 'current', documentDate);
}

const ROLE_WORDS: Record<string, string> = { approver: 'Approver', specialist: 'Compliance specialist', engineer: 'Test engineer', admin: 'Administrator' };

export function signatureSection(s: reviewRepo.SignatureRow): ExhibitSignature {
  return {
    signerName: s.signerName,
    signerRole: ROLE_WORDS[s.signerRole] ?? s.signerRole,
    signedAt: s.signedAt,
    statement: s.statement,
    contentSha256: s.contentSha256,
    contentFormat: s.contentFormat,
  };
}
