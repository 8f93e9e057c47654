/**
 * What the readiness rules read: a filing version's data, its screening, and — where those parts
 * of the product hold data — its lab results, evidence and report read-back. Plain shapes, no
 * I/O: the server assembles this from the stored version (server/services/readiness-service.ts).
 *
 * A part that is `null` holds no data for this version (nothing recorded yet). Rules that need a
 * part treat `null` as "nothing recorded", which is what it is: a combination that needs SAR and
 * has no lab results has no measurement; a hotspot device with no antenna drawing on file has no
 * edge distances, and a rule says what to upload.
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

/**
 * One measurement-quality check computed by the lab results (calc/lab `lab-results`): a value
 * against its tolerance (liquid, system check, drift, calibration, repeats, test separation), a
 * reference to the device data (band, ids), or a gap in the records (`gap`: nothing out of
 * tolerance, something not recorded — a warning).
 */
export interface ReadinessLabCheck {
  kind: 'liquid' | 'system-check' | 'drift' | 'calibration' | 'repeat' | 'separation' | 'reference' | 'record' | 'other';
  ok: boolean;
  /** A record that is missing rather than a value out of tolerance. */
  gap?: boolean;
  /** What it checked, in words ("Liquid 2450 MHz, σ +6.1 % (±5 %)"). */
  label: string;
  source?: string;
}

/** One co-transmission evaluation: a transmitter combination in one use position and market. */
export interface ReadinessCoTransmission {
  transmitterIds: string[];
  usePositionId: string;
  regime: ScreeningRegime;
  /**
   * within-limit: sum ≤ limit; ratio-ok: peak-location ratio passes; incomplete: a transmitter in
   * it has neither a measurement nor an exemption to estimate from; otherwise it fails.
   */
  status: 'within-limit' | 'ratio-ok' | 'over-limit' | 'needs-simultaneous-measurement' | 'incomplete';
}

export interface ReadinessLab {
  measurements: ReadinessMeasurement[];
  highest: ReadinessHighestSar[];
  checks: ReadinessLabCheck[];
  coTransmission: ReadinessCoTransmission[];
  /** Expanded uncertainty (k = 2) against its limit, when a budget is given. */
  uncertainty: { required: boolean; given: boolean; expandedPct?: number | null; limitPct?: number } | null;
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

/** A difference the report read-back found other than a tune-up power (those are above). */
export interface ReadinessReportFinding {
  kind: 'reported-sar' | 'separation' | 'model' | 'unreadable';
  /** The read-back's message, naming the document and page. */
  text: string;
  /** Marked explained by an engineer, with a reason. */
  explained: boolean;
}

/** A separation distance the user manual states for a use position. */
export interface ReadinessManualSeparation {
  usePositionId: string;
  statedSeparationM: number;
  /** Where the manual says it ("“User manual”, page 4"). */
  where?: string;
}

/**
 * How far an antenna is from an edge of the device (the antenna location drawing). A hotspot use
 * position tests an edge when its id names it (“hotspot-top”).
 */
export interface ReadinessEdge {
  edge: string;
  antennaId: string;
  distanceM: number;
  where?: string;
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
  /** Combinations that can be on together in one use position only. */
  simultaneousAt?: { usePositionId: string; transmitterIds: string[] }[];
  screening: { rows: ReadinessScreeningRow[]; gaps: { transmitterId: string; usePositionId: string }[] } | null;
  lab: ReadinessLab | null;
  evidence: ReadinessEvidence | null;
  /** Null when no test report's text is on file. */
  reportTuneUps: ReadinessReportTuneUp[] | null;
  /** Null when no test report's text is on file. */
  reportFindings: ReadinessReportFinding[] | null;
  /** Null when no user manual's text is on file; a position the manual states nothing for is absent. */
  manualSeparations: ReadinessManualSeparation[] | null;
  /** Null when no antenna drawing's text is on file. */
  hotspotEdges: ReadinessEdge[] | null;
}
