/**
 * The exhibit's data: everything the RF-exposure exhibit shows, assembled by
 * server/services/exhibit-service.ts from one filing version. The layouts in this folder
 * (pdf.ts, docx.ts, csv.ts) turn it into files and never read the database themselves, so the
 * same model always gives the same pages.
 */
import type { Derivation } from '../../calc/types';

export interface ExhibitTransmitter {
  id: string;
  technology: string;
  band: string;
  frequencyMinHz: number;
  frequencyMaxHz: number;
  maxTuneUpPowerDbm: number;
  /** Target ± tolerance, when the tune-up procedure states them (their sum is the maximum). */
  tuneUpTargetDbm?: number;
  tuneUpToleranceDb?: number;
  dutyCycle: number;
  antennaId: string;
}

/** A transmitter's reduced tune-up power in one use position, and what triggers it. */
export interface ExhibitPowerMode {
  transmitterId: string;
  /** Tolerance included, like the maximum tune-up power; screening uses it in this position. */
  reducedTuneUpPowerDbm: number;
  /** The trigger's key ("proximity-sensor") and its words ("Proximity sensor"). */
  trigger: string;
  triggerLabel: string;
}

export interface ExhibitScreeningRow {
  transmitterId: string;
  usePositionId: string;
  usePositionKind: string;
  regime: string;
  tier: string;
  method: string;
  methodLabel: string;
  frequencyHz: number;
  separationM: number;
  /** 'full' (maximum tune-up power) or the trigger of the reduced power screened in this position. */
  powerMode: string;
  evaluatedPowerMw: number;
  evaluatedQuantity: string;
  /** The threshold in the rule's own unit, with that unit ("mW", "W ERP", "W/m²"). */
  threshold: number | null;
  thresholdUnit: string | null;
  result: 'exempt' | 'evaluate-sar' | 'evaluate-mpe';
  marginDb: number | null;
  estimatedSarWPerKg: number | null;
  /** Key of this row's entry in the how-computed appendix ("S12"). */
  appendixRef: string;
}

/** One SAR measurement with its reported SAR (scaled to the tune-up limit), from the lab-results calculation. */
export interface ExhibitSarResult {
  measurementId: string;
  transmitterId: string;
  usePositionId: string;
  /** The use position's exposure condition ("Body-worn", "Extremity"). */
  exposureCondition: string;
  testPosition: string;
  channel: string;
  frequencyHz: number;
  testSeparationM: number;
  testDate: string;
  measuredPowerDbm: number;
  tuneUpPowerDbm: number;
  scalingFactor: number;
  measuredSar1gWPerKg: number | null;
  measuredSar10gWPerKg: number | null;
  reportedSar1gWPerKg: number | null;
  reportedSar10gWPerKg: number | null;
  powerDriftDb: number | null;
  /** Key of this row's entry in the how-computed appendix ("L3"). */
  appendixRef: string;
}

/** The highest reported SAR of one market and exposure condition, at that market's averaging mass. */
export interface ExhibitHighestSar {
  market: string;
  tier: string;
  exposureCondition: string;
  averagingMassKg: number;
  /** Null when nothing in this condition was measured. */
  reportedSarWPerKg: number | null;
  limitWPerKg: number;
  marginDb: number | null;
  withinLimit: boolean | null;
  transmitterId: string | null;
  usePositionId: string | null;
  measurementId: string | null;
  source: string;
}

export interface ExhibitCoTransmission {
  id: string;
  market: string;
  usePositionId: string;
  exposureCondition: string;
  transmitterIds: string[];
  method: 'sum-of-sar' | 'mpe-sum-of-ratios';
  /** Each transmitter's part in words: value, unit and where it comes from. */
  contributions: string[];
  /** Σ SAR (W/kg) or Σ ratios (1); null when a contribution is missing. */
  sum: number | null;
  limit: number;
  unit: 'W/kg' | '1';
  outcome: string;
  pass: boolean;
  appendixRef: string;
}

/** One measurement-system or measurement check, with the tolerance it was held to and its source. */
export interface ExhibitCheck {
  /** The check's kind as the calculation names it ("drift", "liquid"). */
  kindId: string;
  kind: string;
  /** What was checked: a scan, a liquid or system check, an instrument, the budget, a combination. */
  subjectType: 'measurement' | 'liquid-check' | 'system-check' | 'instrument' | 'uncertainty' | 'coverage' | 'co-transmission';
  subject: string;
  status: 'pass' | 'fail' | 'warning';
  value: string;
  tolerance: string;
  message: string;
  source: string;
}

export interface ExhibitInstrument {
  id: string;
  kind: string;
  model: string;
  serial: string;
  calibratedOn: string;
  calibrationDueOn: string;
  /** In calibration on every test date. */
  inCalibration: boolean;
}

export interface ExhibitUncertainty {
  /** Whether the highest measured SAR makes a budget required. */
  required: boolean;
  highestMeasuredSarWPerKg: number | null;
  highestMeasuredMass: string | null;
  combinedStandardPercent: number | null;
  expandedPercent: number | null;
  coverageFactor: number;
  limitPercent: number;
  components: { name: string; valuePercent: number; distribution: string; divisor: number | null; sensitivity: number; degreesOfFreedom: number | null }[];
  appendixRef: string | null;
}

export interface ExhibitCoverage {
  transmitterId: string;
  usePositionId: string;
  exposureCondition: string;
  markets: string[];
  measurementIds: string[];
  status: 'measured' | 'missing' | 'not-required';
}

/** Lab results: present once lab data of the version are recorded. */
export interface ExhibitLab {
  sarResults: ExhibitSarResult[];
  highestReported: ExhibitHighestSar[];
  coTransmission: ExhibitCoTransmission[];
  checks: ExhibitCheck[];
  instruments: ExhibitInstrument[];
  uncertainty: ExhibitUncertainty | null;
  coverage: ExhibitCoverage[];
  summary: { measurements: number; failing: number; blocking: number; warnings: number };
}

export interface ExhibitReadinessItem {
  id: string;
  title: string;
  severity: 'blocks-signing' | 'warning';
  status: 'pass' | 'fail' | 'not-applicable';
  detail: string;
}

export interface ExhibitReadiness {
  /** at-signing: the checklist stored with the signature; current: a draft's checklist now. */
  basis: 'at-signing' | 'current';
  asOf: string;
  ready: boolean;
  counts: { blocking: number; warnings: number; passed: number; notApplicable: number };
  items: ExhibitReadinessItem[];
}

export interface ExhibitSignature {
  signerName: string;
  signerRole: string;
  signedAt: string;
  /** What the signer attested to. */
  statement: string;
  /** SHA-256 of the version's content the signature covers, and the serialisation it was taken over. */
  contentSha256: string;
  contentFormat: string;
}

export interface ExhibitEvidence {
  categoryId: string;
  category: string;
  title: string;
  /** Path inside the package zip. */
  path: string;
  fileName: string;
  sizeBytes: number;
  /** Taken when the file was uploaded. */
  sha256: string;
  uploadedAt: string;
}

export interface ExhibitDepthProfile {
  transmitterId: string;
  usePositionId: string;
  frequencyHz: number;
  distanceUsedM: number;
  /** Which model, in words (the tissue stack of the position's kind). */
  stackTitle: string;
  /** 'absolute': values in W/kg; 'relative': SAR over the surface SAR (inside the reactive near field). */
  scale: 'absolute' | 'relative';
  scaleReason: string;
  points: { depthM: number; value: number }[];
  layers: { name: string; startDepthM: number }[];
  /** Only beyond the reactive near field. */
  averagedSarWPerKg: { '1g': number; '10g': number } | null;
  appendixRef: string;
}

export interface ExhibitAppendixEntry {
  ref: string;
  title: string;
  derivation: Derivation;
}

export interface ExhibitModel {
  organisation: string;
  filingId: number;
  versionNumber: number;
  /** True unless the version is signed: then every page says DRAFT. */
  draft: boolean;
  /** The document's date: the signing time, or for a draft a time fixed by the version's data. */
  documentDate: string;
  device: {
    name: string;
    model: string;
    applicant: string;
    productType: string;
    hardwareVersion: string;
    firmwareVersion: string;
  };
  antennas: { id: string; gainDbi: number; location: string }[];
  transmitters: ExhibitTransmitter[];
  usePositions: { id: string; kind: string; kindLabel: string; separations: { antennaId: string; separationM: number }[]; powerModes: ExhibitPowerMode[] }[];
  markets: { regime: string; label: string; tier: string; fccSarScreening: string | null }[];
  simultaneousGroups: string[][];
  screening: {
    engineVersion: string;
    ruleSetVersion: string;
    ruleSetDocuments: string[];
    rows: ExhibitScreeningRow[];
    gaps: { transmitterId: string; usePositionId: string; message: string }[];
  };
  depthProfile: ExhibitDepthProfile | null;
  lab: ExhibitLab | null;
  readiness: ExhibitReadiness | null;
  signature: ExhibitSignature | null;
  evidence: ExhibitEvidence[];
  appendix: ExhibitAppendixEntry[];
  cautions: string[];
}
