/**
 * What the readiness rules read: a filing version's data, its screening, and — where those parts
 * of the product hold data — its lab results, evidence and report read-back. Plain shapes, no
 * I/O: the server assembles this from the stored version (server/services/readiness-service.ts).
 *
 * A part that is `null` holds no data for this version (nothing recorded yet). Rules that need a
 * part treat `null` as "nothing recorded", which is what it is: a combination that needs SAR and
 * has no lab results has no measurement.
 */
import type { ScreeningRegime, UsePositionKind } from '../screening/input';

/** The wizard step that fixes an item (the client links to /filings/:id/:step). */
export type FixStep = 'device' | 'radios' | 'use-positions' | 'markets' | 'screening' | 'measurements' | 'co-transmission' | 'evidence';

export interface ReadinessDevice {
  name: string;
  model: string;
  applicant: string;
  productType: string;
  hardwareVersion: string;
  firmwareVersion: string;
}

export interface ReadinessTransmitter {
  id: string;
  antennaId: string;
  maxTuneUpPowerDbm: number;
}

export interface ReadinessUsePosition {
  id: string;
  kind: UsePositionKind;
  separations: { antennaId: string; separationM: number }[];
}

/** One screening row, reduced to what the rules compare. */
export interface ReadinessScreeningRow {
  transmitterId: string;
  usePositionId: string;
  regime: ScreeningRegime;
  result: 'exempt' | 'evaluate-sar' | 'evaluate-mpe';
  /** Margin to the threshold, dB (null when no threshold applies). */
  marginDb?: number | null;
}

/** One lab measurement after scaling (the lab-results service's row). */
export interface ReadinessMeasurement {
  measurementId: string;
  transmitterId: string;
  usePositionId: string;
  measuredPowerDbm: number | null;
  tuneUpPowerDbm: number | null;
  /** The test separation, m (null when not given). */
  testSeparationM: number | null;
}

/** The highest reported SAR of one market × exposure condition. */
export interface ReadinessHighestSar {
  regime: ScreeningRegime;
  usePositionKind: UsePositionKind;
  reportedSarWPerKg: number;
  limitWPerKg: number;
  transmitterId: string;
  usePositionId: string;
}

/** One measurement-quality check computed by the lab results (liquid, system check, drift, calibration…). */
export interface ReadinessLabCheck {
  kind: 'liquid' | 'system-check' | 'drift' | 'calibration' | 'repeat' | 'other';
  ok: boolean;
  /** What it checked, in words ("Liquid 2450 MHz, σ +6.1 % (±5 %)"). */
  label: string;
  source?: string;
}

/** One co-transmission evaluation: a transmitter combination in one use position and market. */
export interface ReadinessCoTransmission {
  transmitterIds: string[];
  usePositionId: string;
  regime: ScreeningRegime;
  /** within-limit: sum ≤ limit; ratio-ok: peak-location ratio passes; otherwise it fails. */
  status: 'within-limit' | 'ratio-ok' | 'over-limit' | 'needs-simultaneous-measurement';
}

export interface ReadinessLab {
  measurements: ReadinessMeasurement[];
  highest: ReadinessHighestSar[];
  checks: ReadinessLabCheck[];
  coTransmission: ReadinessCoTransmission[];
  uncertainty: { required: boolean; given: boolean } | null;
}

export interface ReadinessEvidence {
  required: { category: string; label: string; present: boolean }[];
}

/** A number found in an uploaded report that names a tune-up power. */
export interface ReadinessReportTuneUp {
  transmitterId: string;
  reportTuneUpPowerDbm: number;
  where: string;
  /** Marked explained by an engineer, with a reason. */
  explained: boolean;
}

/** A separation distance the user manual states for a use position. */
export interface ReadinessManualSeparation {
  usePositionId: string;
  statedSeparationM: number;
}

/** An edge of the device and how far each antenna is from it. */
export interface ReadinessEdge {
  edge: string;
  antennaId: string;
  distanceM: number;
  /** The hotspot use position that tests this edge, if any. */
  usePositionId: string | null;
}

export interface ReadinessInput {
  device: ReadinessDevice;
  /** Steps whose last input had errors and is kept unsaved. */
  unsavedSteps: string[];
  antennaIds: string[];
  transmitters: ReadinessTransmitter[];
  usePositions: ReadinessUsePosition[];
  regimes: ScreeningRegime[];
  /** Transmitter combinations that can be on together. */
  simultaneous: string[][];
  screening: { rows: ReadinessScreeningRow[]; gaps: { transmitterId: string; usePositionId: string }[] } | null;
  lab: ReadinessLab | null;
  evidence: ReadinessEvidence | null;
  reportTuneUps: ReadinessReportTuneUp[] | null;
  manualSeparations: ReadinessManualSeparation[] | null;
  hotspotEdges: ReadinessEdge[] | null;
}
