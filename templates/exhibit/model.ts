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
  dutyCycle: number;
  antennaId: string;
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

/** A lab's SAR result, scaled to the tune-up limit (filled in once lab results exist). */
export interface ExhibitSarResult {
  transmitterId: string;
  usePositionId: string;
  exposureCondition: string;
  frequencyHz: number;
  averagingMassKg: number;
  measuredSarWPerKg: number;
  scalingFactor: number;
  reportedSarWPerKg: number;
  limitWPerKg: number;
  powerDriftDb: number | null;
  appendixRef?: string;
}

export interface ExhibitHighestSar {
  exposureCondition: string;
  transmitterId: string;
  usePositionId: string;
  reportedSarWPerKg: number;
  limitWPerKg: number;
}

export interface ExhibitCoTransmission {
  exposureCondition: string;
  transmitterIds: string[];
  sumSarWPerKg: number | null;
  limitWPerKg: number | null;
  outcome: string;
}

export interface ExhibitCheck {
  kind: string;
  label: string;
  date: string;
  measured: string;
  target: string;
  deviationPercent: number | null;
  tolerancePercent: number | null;
  pass: boolean;
}

export interface ExhibitInstrument {
  name: string;
  serial: string;
  calibratedOn: string;
  calibrationDueOn: string;
}

export interface ExhibitUncertainty {
  label: string;
  expandedUncertaintyPercent: number;
  coverageFactor: number;
  components: { name: string; valuePercent: number }[];
}

/** Lab results: present once the lab results of the version are recorded. */
export interface ExhibitLab {
  sarResults: ExhibitSarResult[];
  highestReported: ExhibitHighestSar[];
  coTransmission: ExhibitCoTransmission[];
  checks: ExhibitCheck[];
  instruments: ExhibitInstrument[];
  uncertainty: ExhibitUncertainty[];
}

export interface ExhibitReadinessItem {
  label: string;
  met: boolean;
  detail: string;
}

export interface ExhibitSignature {
  signerName: string;
  signerRole: string;
  signedAt: string;
  /** What the signer attested to, in their words or the product's statement. */
  statement: string;
  /** SHA-256 of the content the signature covers, when the signing records one. */
  contentSha256: string | null;
}

export interface ExhibitEvidence {
  category: string;
  /** Path inside the package zip. */
  path: string;
  fileName: string;
  sizeBytes: number;
  sha256: string;
}

export interface ExhibitDepthProfile {
  transmitterId: string;
  usePositionId: string;
  frequencyHz: number;
  distanceUsedM: number;
  points: { depthM: number; sarWPerKg: number }[];
  layers: { name: string; startDepthM: number }[];
  averagedSarWPerKg: { '1g': number; '10g': number };
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
  usePositions: { id: string; kind: string; kindLabel: string; separations: { antennaId: string; separationM: number }[] }[];
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
  readiness: { asOf: string; items: ExhibitReadinessItem[] } | null;
  signature: ExhibitSignature | null;
  evidence: ExhibitEvidence[];
  appendix: ExhibitAppendixEntry[];
  cautions: string[];
}
