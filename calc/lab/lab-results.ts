/**
 * Lab results of a filing: every SAR measurement scaled to the tune-up limit (reported SAR), its
 * margin to each market's limit, the highest reported SAR per market × exposure condition, the
 * repeat-measurement and uncertainty requirements, the measurement-system checks (liquid, system
 * check, drift, calibration, test separation), coverage of what screening says needs SAR, and the
 * co-transmission sums. Pure: the server passes the filing's data and the screening rows in.
 *
 * Sources (each figure's derivation names its own):
 * - Reported SAR, scaling to the maximum tune-up power, never scaled down: FCC KDB 447498 D01 v06
 *   and KDB 865664 D01 v01r04 (from memory); duty-cycle scaling max/test: common practice.
 * - Limits: 47 CFR §1.1310 (1.6 W/kg 1 g; 4.0 W/kg 10 g extremities), RSS-102 Issue 5 §4 Table 3,
 *   1999/519/EC Annex II and ICNIRP 2020 Table 2 (2.0 W/kg 10 g head and trunk, 4.0 W/kg limbs).
 * - Repeats: KDB 865664 D01 §2.8.1; uncertainty budget required when the highest measured SAR is
 *   ≥ 1.5 W/kg (1 g) or ≥ 3.75 W/kg (10 g): KDB 865664 D01 §2.8.2 (clause numbers from memory).
 * - Liquid ±5 %, system check ±10 %, drift ±5 %: IEEE Std 1528-2013 / KDB 865664 D01 (from memory).
 * - Calibration interval 12 months for probes and electronics, up to 3 years for dipoles with
 *   extended checks: KDB 865664 D01 (from memory).
 * - Co-transmission: KDB 447498 D01 v06 §4.3.2 (sum of SAR, estimated SAR of a test-excluded
 *   transmitter, SPLSR ≤ 0.04); far-field: Σ S_i/S_L,i ≤ 1 (47 CFR §1.1307(b)(3)(ii)(B); ICNIRP).
 */
import {
  MAX_ANTENNAS,
  MAX_CHECK_RECORDS,
  MAX_COMBINATION_MEMBERS,
  MAX_COMBINATIONS,
  MAX_ID_CHARS,
  MAX_INSTRUMENTS,
  MAX_MEASUREMENTS,
  MAX_SCREENING_ROWS,
  MAX_TEXT_CHARS,
  MAX_TRANSMITTERS,
  MAX_UNCERTAINTY_COMPONENTS,
  MAX_USE_POSITIONS,
} from '../input-limits';
import { z } from 'zod';
import { CalcRangeError, defineCalculation, q, type Derivation, type Quantity, type WithDerivation } from '../types';
import { sarLimit, type SarRegion } from '../limits/sar-limits';
import { kdbEstimatedSarWPerKg } from '../limits/kdb-447498';
import { mpeSumOfRatios } from '../limits/sum-of-ratios';
import { exposureLimit } from '../limits/exposure-limits';
import { farFieldPowerDensityWPerM2 } from '../limits/far-field';
import { computeReportedSar } from './reported-sar';
import { computeRepeatMeasurements } from './repeat-measurements';
import { computeLiquidCheck, LIQUID_TOLERANCE_PCT } from './liquid';
import { computeSystemCheck, SYSTEM_CHECK_TOLERANCE_PCT } from './system-check';
import { computePowerDrift, POWER_DRIFT_TOLERANCE_PCT } from './power-drift';
import { computeUncertaintyBudget, SAR_EXPANDED_UNCERTAINTY_LIMIT_PCT } from './uncertainty-budget';
import { computeSimultaneousTransmission, SPLSR_LIMIT, type SplsrPair } from './simultaneous-transmission';
import { SCREENING_REGIMES, SCREENING_TIERS, USE_POSITION_KINDS, type ScreeningRegime, type UsePositionKind } from '../screening/input';
import type { ScreeningRow } from '../screening/screen';

/** KDB 865664 D01: uncertainty budget required at or above these highest measured SARs, W/kg [from memory]. */
export const UNCERTAINTY_REQUIRED_W_PER_KG = { '1g': 1.5, '10g': 3.75 } as const;
/** Calibration intervals, days: 12 months (probe, DAE, meter), 3 years (dipole with extended checks) [from memory]. */
export const CALIBRATION_INTERVAL_DAYS = { probe: 366, dae: 366, 'power-meter': 366, dipole: 3 * 366 } as const;
/** Liquid temperature window, °C (IEEE 1528 practice) [from memory]. */
export const LIQUID_TEMPERATURE_C = { min: 18, max: 25 } as const;
/** The exposure conditions of the summary table, in the order a reviewer reads them. */
export const SAR_CONDITIONS = ['head', 'body-worn', 'hotspot', 'extremity'] as const satisfies readonly UsePositionKind[];

const SRC = {
  reported: 'FCC KDB 447498 D01 v06 / KDB 865664 D01 v01r04: reported SAR = measured SAR scaled to the maximum tune-up power (from memory)',
  power: 'FCC KDB 447498 D01 v06: SAR is scaled to the maximum tune-up power, never down (from memory)',
  liquid: `IEEE Std 1528-2013 Table 3 targets; FCC KDB 865664 D01 ±${LIQUID_TOLERANCE_PCT['kdb-865664']} % (from memory)`,
  temperature: 'IEEE Std 1528-2013 liquid temperature 18–25 °C (from memory)',
  system: `IEEE Std 1528-2013 / FCC KDB 865664 D01 system check ±${SYSTEM_CHECK_TOLERANCE_PCT} % (from memory)`,
  drift: `IEEE Std 1528-2013 / FCC KDB 865664 D01 power drift ±${POWER_DRIFT_TOLERANCE_PCT} % (from memory)`,
  calibration: 'FCC KDB 865664 D01: probes, DAE and meters calibrated within 12 months, dipoles up to 3 years with extended checks (from memory)',
  separation: 'FCC KDB 447498 D01 v06 §4.1 / KDB 865664 D01: test at the separation the device is used at, never farther (from memory)',
  band: 'Device data: a measurement belongs to a transmitter whose band contains its frequency',
  repeats: 'FCC KDB 865664 D01 v01r04 §2.8.1 repeated measurements (from memory)',
  uncertainty: `FCC KDB 865664 D01 §2.8.2: budget required when highest measured SAR ≥ 1.5 W/kg (1 g) / 3.75 W/kg (10 g); IEEE 1528-2013 expanded uncertainty ≤ ${SAR_EXPANDED_UNCERTAINTY_LIMIT_PCT} % (k = 2) (from memory)`,
  coverage: 'Screening result of this filing: combinations that need SAR evaluation must be measured (KDB 447498 D01 v06 §4.3.1; 47 CFR §1.1307(b)(3))',
  cotx: 'FCC KDB 447498 D01 v06 §4.3.2 simultaneous transmission (from memory)',
  mpe: '47 CFR §1.1307(b)(3)(ii)(B); ICNIRP 1998 / 1999/519/EC Annex IV: Σ S_i/S_L,i ≤ 1',
  limit: '47 CFR §1.1310; RSS-102 Issue 5 §4 Table 3; 1999/519/EC Annex II; ICNIRP 2020 Table 2',
} as const;

// ---------------------------------------------------------------------------------------------
// Input

const id = z.string().min(1).max(MAX_ID_CHARS);
const text = z.string().max(MAX_TEXT_CHARS);
const num = z.number().refine(Number.isFinite, 'must be a finite number');
const date = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'YYYY-MM-DD');

export const labResultsInput = z.object({
  markets: z.array(z.object({ regime: z.enum(SCREENING_REGIMES), tier: z.enum(SCREENING_TIERS).default('general') })).max(SCREENING_REGIMES.length),
  transmitters: z
    .array(z.object({ id, frequencyMinHz: num, frequencyMaxHz: num, maxTuneUpPowerDbm: num, dutyCycle: num.pipe(z.number().gt(0).max(1)).default(1), antennaId: id }))
    .max(MAX_TRANSMITTERS),
  usePositions: z.array(z.object({ id, kind: z.enum(USE_POSITION_KINDS), separations: z.array(z.object({ antennaId: id, separationM: num })).max(MAX_ANTENNAS) })).max(MAX_USE_POSITIONS),
  /** Transmitter combinations that can be on together. */
  simultaneous: z.array(z.array(id).max(MAX_COMBINATION_MEMBERS)).max(MAX_COMBINATIONS).default([]),
  /** Combinations that can be on together in one use position only (evaluated there alone). */
  simultaneousAt: z
    .array(z.object({ usePositionId: id, transmitterIds: z.array(id).max(MAX_COMBINATION_MEMBERS) }))
    .max(MAX_COMBINATIONS)
    .default([]),
  /** The screening rows of the same data (only the fields used here). */
  screening: z
    .array(
      z.object({
        transmitterId: id,
        usePositionId: id,
        regime: z.enum(SCREENING_REGIMES),
        result: z.enum(['exempt', 'evaluate-sar', 'evaluate-mpe']),
        frequencyHz: num,
        separationM: num,
        timeAveragedPowerMw: num,
        eirpMw: num,
        evaluatedPowerMw: num,
        thresholdMw: num.nullable(),
        thresholdErpW: num.nullable(),
        thresholdEirpW: num.nullable(),
        evaluatedPowerDensityWPerM2: num.nullable(),
        thresholdPowerDensityWPerM2: num.nullable(),
      }),
    )
    .max(MAX_SCREENING_ROWS)
    .default([]),
  measurements: z
    .array(
      z.object({
        id,
        transmitterId: id,
        usePositionId: id,
        testPosition: text.default(''),
        channel: text.default(''),
        frequencyHz: num.pipe(z.number().positive()),
        testSeparationM: num.pipe(z.number().min(0)),
        measuredPowerDbm: num,
        tuneUpPowerDbm: num.nullable().default(null),
        testDutyCycle: num.pipe(z.number().gt(0).max(1)).default(1),
        sar1gWPerKg: num.pipe(z.number().positive()).nullable().default(null),
        sar10gWPerKg: num.pipe(z.number().positive()).nullable().default(null),
        repeatSarWPerKg: z.array(num.pipe(z.number().positive())).max(3).default([]),
        driftDb: num.nullable().default(null),
        testDate: date,
        peakXMm: num.nullable().default(null),
        peakYMm: num.nullable().default(null),
        liquidCheckId: id.nullable().default(null),
        systemCheckId: id.nullable().default(null),
      }),
    )
    .max(MAX_MEASUREMENTS),
  liquidChecks: z
    .array(
      z.object({
        id,
        date,
        liquid: z.enum(['head', 'body']).default('head'),
        frequencyHz: num.pipe(z.number().positive()),
        relativePermittivity: num.pipe(z.number().positive()),
        conductivitySPerM: num.pipe(z.number().positive()),
        temperatureC: num.nullable().default(null),
      }),
    )
    .max(MAX_CHECK_RECORDS)
    .default([]),
  systemChecks: z
    .array(
      z.object({
        id,
        date,
        frequencyHz: num.pipe(z.number().positive()),
        dipoleSerial: text.default(''),
        averagingMass: z.enum(['1g', '10g']).default('1g'),
        measuredSarWPerKgPerW: num.pipe(z.number().positive()),
        targetSarWPerKgPerW: num.pipe(z.number().positive()),
      }),
    )
    .max(MAX_CHECK_RECORDS)
    .default([]),
  instruments: z
    .array(z.object({ id, kind: z.enum(['probe', 'dipole', 'dae', 'power-meter']), model: text.default(''), serial: text.default(''), calibrationDate: date, dueDate: date }))
    .max(MAX_INSTRUMENTS)
    .default([]),
  uncertainty: z
    .array(
      z.object({
        name: text.min(1),
        valuePct: num.pipe(z.number().min(0)),
        distribution: z.enum(['normal', 'rectangular', 'u-shaped', 'triangular']),
        divisor: num.pipe(z.number().positive()).nullable().default(null),
        sensitivity: num,
        degreesOfFreedom: num.pipe(z.number().positive()).nullable().default(null),
      }),
    )
    .max(MAX_UNCERTAINTY_COMPONENTS)
    .default([]),
});
export type LabResultsInput = z.output<typeof labResultsInput>;

/** The fields of the screening rows that lab results use, picked from the screening output. */
export function labScreeningRows(
  rows: readonly Pick<
    ScreeningRow,
    | 'transmitterId'
    | 'usePositionId'
    | 'regime'
    | 'result'
    | 'frequencyHz'
    | 'separationM'
    | 'powers'
    | 'evaluatedPowerMw'
    | 'thresholdMw'
    | 'thresholdErpW'
    | 'thresholdEirpW'
    | 'evaluatedPowerDensityWPerM2'
    | 'thresholdPowerDensityWPerM2'
  >[],
): LabResultsInputRaw['screening'] {
  return rows.map((s) => ({
    transmitterId: s.transmitterId,
    usePositionId: s.usePositionId,
    regime: s.regime,
    result: s.result,
    frequencyHz: s.frequencyHz,
    separationM: s.separationM,
    timeAveragedPowerMw: s.powers.timeAveragedPowerMw,
    eirpMw: s.powers.eirpMw,
    evaluatedPowerMw: s.evaluatedPowerMw,
    thresholdMw: s.thresholdMw,
    thresholdErpW: s.thresholdErpW,
    thresholdEirpW: s.thresholdEirpW,
    evaluatedPowerDensityWPerM2: s.evaluatedPowerDensityWPerM2,
    thresholdPowerDensityWPerM2: s.thresholdPowerDensityWPerM2,
  }));
}
export type LabResultsInputRaw = z.input<typeof labResultsInput>;
type In = LabResultsInput;
type MeasurementIn = In['measurements'][number];

// ---------------------------------------------------------------------------------------------
// Output

export type CheckKind =
  'power' | 'limit' | 'separation' | 'band' | 'drift' | 'liquid' | 'liquid-temperature' | 'system-check' | 'calibration' | 'repeats' | 'mass' | 'uncertainty' | 'coverage' | 'co-transmission';
export type SubjectType = 'measurement' | 'liquid-check' | 'system-check' | 'instrument' | 'uncertainty' | 'coverage' | 'co-transmission';

/** One check: what was compared, against which tolerance, from which source, and how to fix a failure. */
export interface LabCheck {
  /** Stable id: `${kind}:${subject id}[:detail]`. */
  id: string;
  kind: CheckKind;
  subject: { type: SubjectType; id: string };
  status: 'pass' | 'fail' | 'warning';
  /** A failing blocking check stops signing; a warning asks for a look. */
  blocking: boolean;
  value: string | null;
  tolerance: string | null;
  message: string;
  /** What to do about it; empty for a pass. */
  howToFix: string;
  source: string;
}

export interface MarketMargin {
  regime: ScreeningRegime;
  tier: 'general' | 'occupational';
  averagingMassKg: number;
  limitWPerKg: number;
  reportedSarWPerKg: number | null;
  marginDb: number | null;
  withinLimit: boolean | null;
}

export interface LabRow {
  measurementId: string;
  transmitterId: string;
  usePositionId: string;
  usePositionKind: UsePositionKind;
  testPosition: string;
  channel: string;
  frequencyHz: number;
  testSeparationM: number;
  testDate: string;
  measuredPowerDbm: number;
  tuneUpPowerDbm: number;
  tuneUpFromTransmitter: boolean;
  powerScalingFactor: number;
  dutyCycleScalingFactor: number;
  scalingFactor: number;
  measuredSar1gWPerKg: number | null;
  measuredSar10gWPerKg: number | null;
  reportedSar1gWPerKg: number | null;
  reportedSar10gWPerKg: number | null;
  margins: MarketMargin[];
  repeats: { repeatsRequired: number; repeatsDone: number; nextRepeatRequired: boolean; decided: boolean; why: string[] } | null;
  flags: LabCheck[];
  derivation: Derivation;
}

export interface HighestReported {
  regime: ScreeningRegime;
  tier: 'general' | 'occupational';
  usePositionKind: (typeof SAR_CONDITIONS)[number];
  averagingMassKg: number;
  reportedSarWPerKg: number | null;
  limitWPerKg: number;
  marginDb: number | null;
  withinLimit: boolean | null;
  transmitterId: string | null;
  usePositionId: string | null;
  measurementId: string | null;
  source: string;
}

export interface CoTxContribution {
  transmitterId: string;
  basis: 'reported' | 'estimated' | 'ratio' | 'missing';
  value: number | null;
  unit: 'W/kg' | '1';
  measurementId: string | null;
  peakMm: [number, number] | null;
}

export interface CoTransmissionResult {
  id: string;
  transmitterIds: string[];
  usePositionId: string;
  usePositionKind: UsePositionKind;
  regime: ScreeningRegime;
  method: 'sum-of-sar' | 'mpe-sum-of-ratios';
  averagingMassKg: number | null;
  contributions: CoTxContribution[];
  /** Σ SAR (W/kg) or Σ ratios (1); null when a contribution is missing. */
  sum: number | null;
  limit: number;
  outcome: 'sum-within-limit' | 'splsr-within-limit' | 'needs-simultaneous-measurement' | 'over-limit' | 'incomplete';
  pairs: SplsrPair[];
  derivation: Derivation;
}

export interface CoverageItem {
  transmitterId: string;
  usePositionId: string;
  usePositionKind: UsePositionKind;
  /** Markets whose screening says this combination needs SAR evaluation. */
  regimes: ScreeningRegime[];
  measurementIds: string[];
  status: 'measured' | 'missing' | 'not-required';
}

export interface UncertaintySummary {
  required: boolean;
  highestMeasuredSarWPerKg: number | null;
  highestMeasuredMass: '1g' | '10g' | null;
  combinedStandardPct: number | null;
  expandedPct: number | null;
  coverageFactor: number;
  limitPct: number;
  derivation: Derivation | null;
}

export interface LabResults {
  rows: LabRow[];
  highest: HighestReported[];
  coTransmission: CoTransmissionResult[];
  checks: LabCheck[];
  coverage: CoverageItem[];
  uncertainty: UncertaintySummary;
  summary: { measurements: number; failing: number; blocking: number; warnings: number };
}

// ---------------------------------------------------------------------------------------------

const G = 1e-3; // kg per g
const fmt = (x: number, digits = 3) => `${+x.toPrecision(digits)}`;
const regionOf = (kind: UsePositionKind): SarRegion => (kind === 'extremity' ? 'limbs' : 'head-trunk');
const MARKET_LABEL: Record<ScreeningRegime, string> = { fcc: 'FCC', ised: 'ISED', eu: 'EU', 'icnirp-2020': 'ICNIRP 2020' };
const sarAt = (m: { sar1gWPerKg: number | null; sar10gWPerKg: number | null }, massG: number) => (massG === 1 ? m.sar1gWPerKg : m.sar10gWPerKg);

function check(c: Omit<LabCheck, 'id'> & { detail?: string }): LabCheck {
  const { detail, ...rest } = c;
  return { id: `${c.kind}:${c.subject.id}${detail ? `:${detail}` : ''}`, ...rest };
}

const daysBetween = (a: string, b: string) => (Date.parse(`${b}T00:00:00Z`) - Date.parse(`${a}T00:00:00Z`)) / 86_400_000;

interface Context {
  input: In;
  txById: Map<string, In['transmitters'][number]>;
  posById: Map<string, In['usePositions'][number]>;
  liquidResults: Map<string, LabCheck>;
  systemResults: Map<string, LabCheck>;
}

function liquidChecks(input: In): LabCheck[] {
  const out: LabCheck[] = [];
  for (const l of input.liquidChecks) {
    const subject = { type: 'liquid-check' as const, id: l.id };
    try {
      const r = computeLiquidCheck({ frequencyHz: l.frequencyHz, measuredRelativePermittivity: l.relativePermittivity, measuredConductivitySPerM: l.conductivitySPerM, standard: 'kdb-865664' });
      const value = `εr ${fmt(l.relativePermittivity)} (target ${fmt(r.targetRelativePermittivity)}, ${r.permittivityDeviationPct >= 0 ? '+' : ''}${r.permittivityDeviationPct.toFixed(1)} %); σ ${fmt(l.conductivitySPerM)} S/m (target ${fmt(r.targetConductivitySPerM)}, ${r.conductivityDeviationPct >= 0 ? '+' : ''}${r.conductivityDeviationPct.toFixed(1)} %)`;
      const bad = [!r.permittivityPass && 'εr', !r.conductivityPass && 'σ'].filter(Boolean).join(' and ');
      out.push(
        check({
          kind: 'liquid',
          subject,
          status: r.pass ? 'pass' : 'fail',
          blocking: !r.pass,
          value,
          tolerance: `±${r.tolerancePct} % of target, each of εr and σ`,
          message: r.pass ? `Liquid ${l.id} (${l.date}) is within tolerance.` : `Liquid ${l.id} (${l.date}): ${bad} outside ±${r.tolerancePct} % of the target.`,
          howToFix: r.pass ? '' : 'Ask the lab to re-measure or re-mix the liquid and repeat the SAR scans that relied on it; then enter the new check and link the measurements to it.',
          source: SRC.liquid + (l.liquid === 'body' ? '; head-liquid targets used for body tests as in IEC/IEEE 62209-1528 (from memory)' : ''),
        }),
      );
    } catch (err) {
      if (!(err instanceof CalcRangeError)) throw err;
      out.push(
        check({
          kind: 'liquid',
          subject,
          status: 'warning',
          blocking: false,
          value: `${fmt(l.frequencyHz / 1e6, 5)} MHz`,
          tolerance: null,
          message: `Liquid ${l.id}: no target held for this frequency (${err.message}).`,
          howToFix: 'Check the frequency; targets are held for 300 MHz–6 GHz.',
          source: SRC.liquid,
        }),
      );
    }
    if (l.temperatureC !== null) {
      const ok = l.temperatureC >= LIQUID_TEMPERATURE_C.min && l.temperatureC <= LIQUID_TEMPERATURE_C.max;
      out.push(
        check({
          kind: 'liquid-temperature',
          subject,
          status: ok ? 'pass' : 'warning',
          blocking: false,
          value: `${fmt(l.temperatureC)} °C`,
          tolerance: `${LIQUID_TEMPERATURE_C.min}–${LIQUID_TEMPERATURE_C.max} °C`,
          message: ok ? `Liquid ${l.id} temperature in range.` : `Liquid ${l.id} temperature ${fmt(l.temperatureC)} °C is outside ${LIQUID_TEMPERATURE_C.min}–${LIQUID_TEMPERATURE_C.max} °C.`,
          howToFix: ok ? '' : 'Confirm the temperature with the lab; a liquid out of its temperature window is usually re-measured.',
          source: SRC.temperature,
        }),
      );
    }
  }
  return out;
}

function systemChecks(input: In): LabCheck[] {
  return input.systemChecks.map((s) => {
    const r = computeSystemCheck({ measuredSarWPerKg: s.measuredSarWPerKgPerW, targetSarWPerKg: s.targetSarWPerKgPerW, tolerancePct: SYSTEM_CHECK_TOLERANCE_PCT });
    return check({
      kind: 'system-check',
      subject: { type: 'system-check', id: s.id },
      status: r.pass ? 'pass' : 'fail',
      blocking: !r.pass,
      value: `${fmt(s.measuredSarWPerKgPerW)} W/kg per W (${s.averagingMass}) against ${fmt(s.targetSarWPerKgPerW)}: ${r.deviationPct >= 0 ? '+' : ''}${r.deviationPct.toFixed(1)} %`,
      tolerance: `±${r.tolerancePct} % of target`,
      message: r.pass ? `System check ${s.id} (${s.date}) within tolerance.` : `System check ${s.id} (${s.date}) is ${r.deviationPct.toFixed(1)} % from its target.`,
      howToFix: r.pass ? '' : 'Check the dipole target (calibration certificate, same averaging mass, normalised to 1 W); otherwise the lab repeats the system check and the scans of that day.',
      source: SRC.system,
    });
  });
}

function instrumentChecks(input: In): LabCheck[] {
  const dates = [...new Set(input.measurements.map((m) => m.testDate))].sort();
  const out: LabCheck[] = [];
  for (const ins of input.instruments) {
    const subject = { type: 'instrument' as const, id: ins.id };
    const outside = dates.filter((d) => d < ins.calibrationDate || d > ins.dueDate);
    out.push(
      check({
        kind: 'calibration',
        subject,
        status: outside.length ? 'fail' : 'pass',
        blocking: outside.length > 0,
        value: `calibrated ${ins.calibrationDate}, due ${ins.dueDate}`,
        tolerance: 'calibration date ≤ test date ≤ due date',
        message: outside.length
          ? `${ins.id} (${ins.kind}${ins.serial ? ` ${ins.serial}` : ''}) was not in calibration on ${outside.join(', ')}.`
          : `${ins.id} in calibration on every test date${dates.length ? ` (${dates[0]} to ${dates[dates.length - 1]})` : ''}.`,
        howToFix: outside.length ? 'Enter the calibration that covered those dates (certificate), or have the lab repeat those scans with a calibrated instrument.' : '',
        source: SRC.calibration,
      }),
    );
    const interval = daysBetween(ins.calibrationDate, ins.dueDate);
    const maxDays = CALIBRATION_INTERVAL_DAYS[ins.kind];
    if (interval > maxDays) {
      out.push(
        check({
          kind: 'calibration',
          subject,
          detail: 'interval',
          status: 'warning',
          blocking: false,
          value: `${Math.round(interval)} days between calibration and due date`,
          tolerance: ins.kind === 'dipole' ? 'up to 3 years with extended checks' : '12 months',
          message: `${ins.id}: the calibration interval is longer than usual for a ${ins.kind}.`,
          howToFix: ins.kind === 'dipole' ? 'Attach the extended-calibration checks (return loss, impedance) as evidence.' : 'Check the due date on the certificate.',
          source: SRC.calibration,
        }),
      );
    }
  }
  if (input.measurements.length && !input.instruments.some((i) => i.kind === 'probe')) {
    out.push(
      check({
        kind: 'calibration',
        subject: { type: 'instrument', id: 'probe' },
        status: 'warning',
        blocking: false,
        value: null,
        tolerance: null,
        message: 'No E-field probe is listed among the instruments.',
        howToFix: 'Add the probe (serial, calibration and due dates) under Instruments.',
        source: SRC.calibration,
      }),
    );
  }
  return out;
}

function rowChecks(ctx: Context, m: MeasurementIn, tuneUpPowerDbm: number, margins: MarketMargin[]): LabCheck[] {
  const { txById, posById, input } = ctx;
  const tx = txById.get(m.transmitterId)!;
  const pos = posById.get(m.usePositionId)!;
  const subject = { type: 'measurement' as const, id: m.id };
  const out: LabCheck[] = [];
  const powerOk = m.measuredPowerDbm <= tuneUpPowerDbm;
  out.push(
    check({
      kind: 'power',
      subject,
      status: powerOk ? 'pass' : 'fail',
      blocking: !powerOk,
      value: `measured ${fmt(m.measuredPowerDbm, 4)} dBm, tune-up ${fmt(tuneUpPowerDbm, 4)} dBm`,
      tolerance: 'measured power ≤ tune-up limit',
      message: powerOk
        ? 'Measured power within the tune-up limit.'
        : `${m.id}: measured power ${fmt(m.measuredPowerDbm, 4)} dBm is above the tune-up limit ${fmt(tuneUpPowerDbm, 4)} dBm; the SAR is not scaled down.`,
      howToFix: powerOk ? '' : 'Correct the tune-up limit (Radios, or this row’s tune-up column) or the measured power; a device above its declared limit needs a new declaration or a re-test.',
      source: SRC.power,
    }),
  );
  for (const mg of margins) {
    if (mg.withinLimit !== false) continue;
    out.push(
      check({
        kind: 'limit',
        subject,
        detail: mg.regime,
        status: 'fail',
        blocking: true,
        value: `${fmt(mg.reportedSarWPerKg!)} W/kg (${mg.averagingMassKg / G} g)`,
        tolerance: `≤ ${mg.limitWPerKg} W/kg`,
        message: `${m.id}: reported SAR over the ${MARKET_LABEL[mg.regime]} limit (margin ${mg.marginDb!.toFixed(2)} dB).`,
        howToFix: 'Reduce the tune-up power for this configuration, or change the design; then re-test.',
        source: SRC.limit,
      }),
    );
  }
  const needed = new Set(margins.map((mg) => mg.averagingMassKg / G));
  for (const massG of needed) {
    if (sarAt(m, massG) !== null) continue;
    const regimes = margins.filter((mg) => mg.averagingMassKg / G === massG).map((mg) => MARKET_LABEL[mg.regime]);
    out.push(
      check({
        kind: 'mass',
        subject,
        detail: `${massG}g`,
        status: 'warning',
        blocking: false,
        value: null,
        tolerance: null,
        message: `${m.id}: no ${massG} g SAR, which the ${regimes.join(' and ')} limit is averaged over.`,
        howToFix: `Enter the ${massG} g SAR from the lab report (most systems report both).`,
        source: SRC.limit,
      }),
    );
  }
  const separation = pos.separations.find((s) => s.antennaId === tx.antennaId);
  if (!separation) {
    out.push(
      check({
        kind: 'separation',
        subject,
        status: 'warning',
        blocking: false,
        value: `${fmt(m.testSeparationM * 1000)} mm`,
        tolerance: null,
        message: `${m.id}: use position ${pos.id} gives no separation for antenna ${tx.antennaId}.`,
        howToFix: 'Add the separation under Use positions.',
        source: SRC.separation,
      }),
    );
  } else {
    const ok = m.testSeparationM <= separation.separationM + 1e-9;
    out.push(
      check({
        kind: 'separation',
        subject,
        status: ok ? 'pass' : 'fail',
        blocking: !ok,
        value: `tested at ${fmt(m.testSeparationM * 1000)} mm; use position ${fmt(separation.separationM * 1000)} mm`,
        tolerance: 'test separation ≤ use-position separation',
        message: ok ? 'Tested no farther than the device is used.' : `${m.id}: tested at ${fmt(m.testSeparationM * 1000)} mm, farther than the ${fmt(separation.separationM * 1000)} mm of ${pos.id}.`,
        howToFix: ok ? '' : 'Re-test at the use position’s separation, or correct the separation stated for users under Use positions.',
        source: SRC.separation,
      }),
    );
  }
  const inBand = m.frequencyHz >= tx.frequencyMinHz && m.frequencyHz <= tx.frequencyMaxHz;
  if (!inBand) {
    out.push(
      check({
        kind: 'band',
        subject,
        status: 'fail',
        blocking: true,
        value: `${fmt(m.frequencyHz / 1e6, 6)} MHz`,
        tolerance: `${fmt(tx.frequencyMinHz / 1e6, 6)}–${fmt(tx.frequencyMaxHz / 1e6, 6)} MHz (${tx.id})`,
        message: `${m.id}: ${fmt(m.frequencyHz / 1e6, 6)} MHz is outside the band of ${tx.id}; this combination does not exist in the device data.`,
        howToFix: 'Check the transmitter id or the frequency (unit) of this row.',
        source: SRC.band,
      }),
    );
  }
  if (m.driftDb === null) {
    out.push(
      check({
        kind: 'drift',
        subject,
        status: 'warning',
        blocking: false,
        value: null,
        tolerance: `±${POWER_DRIFT_TOLERANCE_PCT} %`,
        message: `${m.id}: no power drift recorded.`,
        howToFix: 'Enter the drift from the scan’s record (dB).',
        source: SRC.drift,
      }),
    );
  } else {
    const d = computePowerDrift({ startPowerDb: 0, endPowerDb: m.driftDb, tolerancePct: POWER_DRIFT_TOLERANCE_PCT });
    out.push(
      check({
        kind: 'drift',
        subject,
        status: d.pass ? 'pass' : 'fail',
        blocking: !d.pass,
        value: `${m.driftDb >= 0 ? '+' : ''}${fmt(m.driftDb)} dB (${d.driftPct >= 0 ? '+' : ''}${d.driftPct.toFixed(1)} %)`,
        tolerance: `±${POWER_DRIFT_TOLERANCE_PCT} % (+${d.toleranceDb.upper.toFixed(3)} / ${d.toleranceDb.lower.toFixed(3)} dB)`,
        message: d.pass ? 'Power drift within tolerance.' : `${m.id}: power drift ${fmt(m.driftDb)} dB is outside ±${POWER_DRIFT_TOLERANCE_PCT} %.`,
        howToFix: d.pass ? '' : 'The lab repeats the scan, or the drift is accounted for in the uncertainty budget (say so in the report).',
        source: SRC.drift,
      }),
    );
  }
  for (const [kind, linkId, results, label] of [
    ['liquid', m.liquidCheckId, ctx.liquidResults, 'liquid check'],
    ['system-check', m.systemCheckId, ctx.systemResults, 'system check'],
  ] as const) {
    if (linkId === null) {
      out.push(
        check({
          kind,
          subject,
          detail: 'link',
          status: 'warning',
          blocking: false,
          value: null,
          tolerance: null,
          message: `${m.id}: no ${label} linked.`,
          howToFix: `Link the ${label} this scan relied on.`,
          source: kind === 'liquid' ? SRC.liquid : SRC.system,
        }),
      );
      continue;
    }
    const c = results.get(linkId);
    if (!c) {
      out.push(
        check({
          kind,
          subject,
          detail: 'link',
          status: 'warning',
          blocking: false,
          value: linkId,
          tolerance: null,
          message: `${m.id}: linked ${label} ${linkId} is not listed.`,
          howToFix: `Enter ${label} ${linkId}, or link an existing one.`,
          source: kind === 'liquid' ? SRC.liquid : SRC.system,
        }),
      );
    } else if (c.status === 'fail') {
      out.push({ ...c, id: `${kind}:${m.id}:${linkId}`, subject, message: `${m.id} relied on ${label} ${linkId}, which is out of tolerance.` });
    }
  }
  for (const ins of input.instruments) {
    if (m.testDate >= ins.calibrationDate && m.testDate <= ins.dueDate) continue;
    out.push(
      check({
        kind: 'calibration',
        subject,
        detail: ins.id,
        status: 'fail',
        blocking: true,
        value: `test ${m.testDate}; ${ins.id} calibrated ${ins.calibrationDate}, due ${ins.dueDate}`,
        tolerance: 'calibration date ≤ test date ≤ due date',
        message: `${m.id}: ${ins.id} was not in calibration on the test date ${m.testDate}.`,
        howToFix: 'Enter the calibration that covered this date, or have the lab repeat the scan.',
        source: SRC.calibration,
      }),
    );
  }
  return out;
}

function marginsFor(input: In, kind: UsePositionKind, sar1g: number | null, sar10g: number | null): MarketMargin[] {
  return input.markets.map((mk) => {
    const lim = sarLimit(mk.regime, mk.tier, regionOf(kind));
    const massG = lim.averagingMassG!;
    const reported = massG === 1 ? sar1g : sar10g;
    return {
      regime: mk.regime,
      tier: mk.tier,
      averagingMassKg: massG * G,
      limitWPerKg: lim.limitWPerKg,
      reportedSarWPerKg: reported,
      marginDb: reported === null ? null : 10 * Math.log10(lim.limitWPerKg / reported),
      withinLimit: reported === null ? null : reported <= lim.limitWPerKg,
    };
  });
}

function rowDerivation(
  m: MeasurementIn,
  tuneUp: number,
  fromTx: boolean,
  maxDuty: number,
  scaled: ReturnType<typeof computeReportedSar>,
  r1: number | null,
  r10: number | null,
  margins: MarketMargin[],
): Derivation {
  const d = scaled.derivation;
  const marginEntries: [string, Quantity][] = margins
    .filter((mg) => mg.marginDb !== null)
    .map((mg) => [`margin ${MARKET_LABEL[mg.regime]} (${mg.averagingMassKg / G} g, limit ${mg.limitWPerKg} W/kg)`, q(mg.marginDb, 'dB')]);
  return {
    formula: `s = max(1, 10^((P_tune-up − P_meas)/10)) · max(1, DC_max/DC_test); SAR_reported = s · SAR_meas (1 g and 10 g); margin_dB = 10·log10(SAR_limit/SAR_reported)`,
    inputs: {
      measuredSar1gWPerKg: q(m.sar1gWPerKg, 'W/kg'),
      measuredSar10gWPerKg: q(m.sar10gWPerKg, 'W/kg'),
      measuredPowerDbm: q(m.measuredPowerDbm, 'dBm'),
      tuneUpPowerDbm: q(tuneUp, 'dBm'),
      testDutyCycle: q(m.testDutyCycle, '1'),
      maximumDutyCycle: q(maxDuty, '1'),
    },
    intermediate: d.intermediate,
    result: {
      scalingFactor: q(scaled.scalingFactor, '1'),
      reportedSar1gWPerKg: q(r1, 'W/kg'),
      reportedSar10gWPerKg: q(r10, 'W/kg'),
      ...Object.fromEntries(marginEntries),
    },
    source: `${SRC.reported}; limits: ${SRC.limit}`,
    notes: [
      ...(fromTx ? [`Tune-up limit: the transmitter’s maximum tune-up power ${fmt(tuneUp, 4)} dBm (no value in the row).`] : []),
      ...d.notes.filter((n) => !n.startsWith('"Reported SAR"')),
      'Reported SAR as measured SAR scaled to the maximum tune-up power follows KDB 447498/865664 practice (from memory); duty-cycle scaling is common practice.',
    ],
  };
}

/** Repeats: for each transmitter and averaging mass, the highest measured SAR of the band decides (KDB 865664 D01). */
function repeatsByRow(input: In): Map<string, LabRow['repeats'] & { check: LabCheck }> {
  const best = new Map<string, { m: MeasurementIn; sar: number; mass: '1g' | '10g' }>();
  for (const m of input.measurements) {
    const mass = m.sar1gWPerKg !== null ? '1g' : '10g';
    const sar = (mass === '1g' ? m.sar1gWPerKg : m.sar10gWPerKg)!;
    const key = `${m.transmitterId}\u0000${mass}`;
    const prev = best.get(key);
    if (!prev || sar > prev.sar) best.set(key, { m, sar, mass });
  }
  const out = new Map<string, LabRow['repeats'] & { check: LabCheck }>();
  for (const { m, sar, mass } of best.values()) {
    const r = computeRepeatMeasurements({ sarWPerKg: [sar, ...m.repeatSarWPerKg].slice(0, 4), exposure: mass === '1g' ? 'general-1g' : 'extremity-10g' });
    const ok = !r.nextRepeatRequired && r.decided;
    out.set(m.id, {
      repeatsRequired: r.repeatsRequired,
      repeatsDone: r.repeatsDone,
      nextRepeatRequired: r.nextRepeatRequired,
      decided: r.decided,
      why: r.why,
      check: check({
        kind: 'repeats',
        subject: { type: 'measurement', id: m.id },
        status: ok ? 'pass' : 'fail',
        blocking: !ok,
        value: `${r.repeatsDone} of ${r.repeatsRequired}${r.decided ? '' : '+'} repeats (${mass}, highest measured ${fmt(sar)} W/kg for ${m.transmitterId})`,
        tolerance: `repeat when ≥ ${fmt(r.thresholdsWPerKg.firstRepeat)} W/kg; again when max/min > 1.20 or ≥ ${fmt(r.thresholdsWPerKg.secondRepeat)} W/kg`,
        message: ok ? `${m.id}: repeat measurements as required.` : `${m.id}: ${r.why[r.why.length - 1]}`,
        howToFix: ok ? '' : 'Enter the repeated SAR value(s) the lab measured for this configuration (repeat column), or ask the lab for the repeat.',
        source: SRC.repeats,
      }),
    });
  }
  return out;
}

function uncertaintyOf(input: In): { summary: UncertaintySummary; check: LabCheck | null } {
  let highest: { sar: number; mass: '1g' | '10g'; ratio: number } | null = null;
  for (const m of input.measurements) {
    for (const mass of ['1g', '10g'] as const) {
      const v = mass === '1g' ? m.sar1gWPerKg : m.sar10gWPerKg;
      if (v === null) continue;
      const ratio = v / UNCERTAINTY_REQUIRED_W_PER_KG[mass];
      if (!highest || ratio > highest.ratio) highest = { sar: v, mass, ratio };
    }
  }
  const required = highest !== null && highest.ratio >= 1;
  const budget = input.uncertainty.length
    ? computeUncertaintyBudget({
        components: input.uncertainty.map((c) => ({
          name: c.name,
          valuePct: c.valuePct,
          distribution: c.distribution,
          divisor: c.divisor ?? undefined,
          sensitivity: c.sensitivity,
          degreesOfFreedom: c.degreesOfFreedom,
        })),
        coverageFactor: 2,
        limitPct: SAR_EXPANDED_UNCERTAINTY_LIMIT_PCT,
      })
    : null;
  const summary: UncertaintySummary = {
    required,
    highestMeasuredSarWPerKg: highest?.sar ?? null,
    highestMeasuredMass: highest?.mass ?? null,
    combinedStandardPct: budget?.combinedStandardPct ?? null,
    expandedPct: budget?.expandedPct ?? null,
    coverageFactor: 2,
    limitPct: SAR_EXPANDED_UNCERTAINTY_LIMIT_PCT,
    derivation: budget?.derivation ?? null,
  };
  if (!highest) return { summary, check: null };
  const subject = { type: 'uncertainty' as const, id: 'budget' };
  const reqText = `required when highest measured SAR ≥ ${UNCERTAINTY_REQUIRED_W_PER_KG['1g']} W/kg (1 g) or ≥ ${UNCERTAINTY_REQUIRED_W_PER_KG['10g']} W/kg (10 g)`;
  const highestText = `highest measured ${fmt(highest.sar)} W/kg (${highest.mass})`;
  if (!budget) {
    return {
      summary,
      check: check({
        kind: 'uncertainty',
        subject,
        status: required ? 'fail' : 'pass',
        blocking: required,
        value: highestText,
        tolerance: reqText,
        message: required ? `An uncertainty budget is required (${highestText}) and none is entered.` : `No uncertainty budget required (${highestText}).`,
        howToFix: required ? 'Enter the lab’s uncertainty budget (each contribution with its distribution and sensitivity).' : '',
        source: SRC.uncertainty,
      }),
    };
  }
  const ok = budget.withinLimit;
  return {
    summary,
    check: check({
      kind: 'uncertainty',
      subject,
      status: ok ? 'pass' : 'fail',
      blocking: !ok && required,
      value: `${highestText}; expanded ${budget.expandedPct.toFixed(1)} % (k = 2)`,
      tolerance: `expanded ≤ ${SAR_EXPANDED_UNCERTAINTY_LIMIT_PCT} %; ${reqText}`,
      message: ok
        ? `Expanded uncertainty ${budget.expandedPct.toFixed(1)} % within ${SAR_EXPANDED_UNCERTAINTY_LIMIT_PCT} %.`
        : `Expanded uncertainty ${budget.expandedPct.toFixed(1)} % is above ${SAR_EXPANDED_UNCERTAINTY_LIMIT_PCT} %.`,
      howToFix: ok ? '' : 'Check each contribution’s value, distribution and sensitivity against the lab’s budget; the lab explains an uncertainty above 30 %.',
      source: SRC.uncertainty,
    }),
  };
}

function coverageOf(input: In, posById: Context['posById']): { items: CoverageItem[]; checks: LabCheck[] } {
  const byCombo = new Map<string, CoverageItem>();
  for (const s of input.screening) {
    const key = `${s.transmitterId}\u0000${s.usePositionId}`;
    const item = byCombo.get(key) ?? {
      transmitterId: s.transmitterId,
      usePositionId: s.usePositionId,
      usePositionKind: posById.get(s.usePositionId)?.kind ?? 'head',
      regimes: [],
      measurementIds: [],
      status: 'not-required',
    };
    if (s.result === 'evaluate-sar' && !item.regimes.includes(s.regime)) item.regimes.push(s.regime);
    byCombo.set(key, item);
  }
  for (const m of input.measurements) {
    const key = `${m.transmitterId}\u0000${m.usePositionId}`;
    const item = byCombo.get(key) ?? {
      transmitterId: m.transmitterId,
      usePositionId: m.usePositionId,
      usePositionKind: posById.get(m.usePositionId)?.kind ?? 'head',
      regimes: [],
      measurementIds: [],
      status: 'not-required' as const,
    };
    item.measurementIds.push(m.id);
    byCombo.set(key, item);
  }
  const items = [...byCombo.values()];
  const checks: LabCheck[] = [];
  for (const item of items) {
    item.status = item.regimes.length === 0 ? 'not-required' : item.measurementIds.length ? 'measured' : 'missing';
    const subject = { type: 'coverage' as const, id: `${item.transmitterId}@${item.usePositionId}` };
    const markets = item.regimes.map((r) => MARKET_LABEL[r]).join(', ');
    if (item.regimes.length) {
      const ok = item.status === 'measured';
      checks.push(
        check({
          kind: 'coverage',
          subject,
          status: ok ? 'pass' : 'fail',
          blocking: !ok,
          value: `${item.measurementIds.length} measurement(s)`,
          tolerance: 'at least one measurement',
          message: ok ? `${item.transmitterId} in ${item.usePositionId}: measured.` : `${item.transmitterId} in ${item.usePositionId} needs SAR evaluation (${markets}) and has no measurement.`,
          howToFix: ok ? '' : 'Import or enter the lab’s measurement for this transmitter and use position.',
          source: SRC.coverage,
        }),
      );
    } else if (item.measurementIds.length) {
      checks.push(
        check({
          kind: 'coverage',
          subject,
          status: 'warning',
          blocking: false,
          value: `${item.measurementIds.length} measurement(s)`,
          tolerance: null,
          message: `${item.transmitterId} in ${item.usePositionId} is exempt from SAR testing in every market, yet measured; the measurement is kept and reported.`,
          howToFix: 'Nothing required; check the transmitter and use-position ids of these rows if they were meant for another combination.',
          source: SRC.coverage,
        }),
      );
    }
  }
  return { items, checks };
}

function coTransmission(input: In, rows: LabRow[], posById: Context['posById']): CoTransmissionResult[] {
  const out: CoTransmissionResult[] = [];
  const screeningKey = (t: string, p: string, r: string) => `${t}\u0000${p}\u0000${r}`;
  const screening = new Map(input.screening.map((s) => [screeningKey(s.transmitterId, s.usePositionId, s.regime), s]));
  // Each contribution looks at one transmitter's rows in one position: index them once, in row order.
  const rowsByCombination = new Map<string, LabRow[]>();
  for (const r of rows) {
    const k = `${r.transmitterId}\u0000${r.usePositionId}`;
    const list = rowsByCombination.get(k);
    if (list) list.push(r);
    else rowsByCombination.set(k, [r]);
  }
  const measurementById = new Map<string, MeasurementIn>();
  for (const m of input.measurements) if (!measurementById.has(m.id)) measurementById.set(m.id, m);
  // Groups for every position first, then those of one position, numbered on (G1, G2, …).
  const groups = [
    ...input.simultaneous.map((transmitterIds) => ({ transmitterIds, usePositionId: null as string | null })),
    ...input.simultaneousAt.map((g) => ({ transmitterIds: g.transmitterIds, usePositionId: g.usePositionId as string | null })),
  ];
  groups.forEach(({ transmitterIds: group, usePositionId }, gi) => {
    for (const pos of input.usePositions) {
      if (usePositionId !== null && pos.id !== usePositionId) continue;
      for (const mk of input.markets) {
        const base = { id: `G${gi + 1}@${pos.id}@${mk.regime}`, transmitterIds: group, usePositionId: pos.id, usePositionKind: pos.kind, regime: mk.regime };
        if (pos.kind === 'far-field') {
          const limitRegime = mk.regime === 'eu' ? 'icnirp-1998' : mk.regime;
          const contributions: CoTxContribution[] = group.map((t) => {
            const s = screening.get(screeningKey(t, pos.id, mk.regime));
            let ratio: number | null = null;
            if (s && s.separationM > 0) {
              try {
                const limit = exposureLimit(s.frequencyHz, limitRegime, mk.tier, 'whole-body').powerDensityWPerM2;
                if (limit) ratio = farFieldPowerDensityWPerM2(s.eirpMw / 1000, s.separationM) / limit;
              } catch (err) {
                if (!(err instanceof CalcRangeError)) throw err;
              }
            }
            return { transmitterId: t, basis: ratio === null ? 'missing' : 'ratio', value: ratio, unit: '1', measurementId: null, peakMm: null };
          });
          const complete = contributions.every((c) => c.value !== null);
          const r = complete ? mpeSumOfRatios(contributions.map((c) => ({ id: c.transmitterId, powerDensityWPerM2: c.value!, limitWPerM2: 1 }))) : null;
          out.push({
            ...base,
            method: 'mpe-sum-of-ratios',
            averagingMassKg: null,
            contributions,
            sum: r?.sum ?? null,
            limit: 1,
            outcome: !r ? 'incomplete' : r.pass ? 'sum-within-limit' : 'over-limit',
            pairs: [],
            derivation: {
              formula: 'S_i = EIRP_i/(4π·d²); Σ_i S_i/S_L,i(f_i) ≤ 1 (each source against the MPE / reference level at its own frequency)',
              inputs: Object.fromEntries(contributions.map((c) => [`ratio[${c.transmitterId}]`, q(c.value, '1')])),
              intermediate: {},
              result: { sumOfRatios: q(r?.sum ?? null, '1'), pass: q(r?.pass ?? null, 'boolean') },
              source: SRC.mpe,
              notes: [
                `Far-field power density at the use position’s separation from each transmitter’s EIRP (screening), against ${mk.regime === 'eu' ? '1999/519/EC (ICNIRP 1998)' : MARKET_LABEL[mk.regime]} ${mk.tier} reference levels at the band’s most restrictive frequency.`,
              ],
            },
          });
          continue;
        }
        const lim = sarLimit(mk.regime, mk.tier, regionOf(pos.kind));
        const massG = lim.averagingMassG!;
        const notes: string[] = [];
        const contributions: CoTxContribution[] = group.map((t) => {
          let best: LabRow | null = null;
          for (const r of rowsByCombination.get(`${t}\u0000${pos.id}`) ?? []) {
            const v = massG === 1 ? r.reportedSar1gWPerKg : r.reportedSar10gWPerKg;
            const bv = best && (massG === 1 ? best.reportedSar1gWPerKg : best.reportedSar10gWPerKg);
            if (v !== null && (bv === null || bv === undefined || v > bv)) best = r;
          }
          if (best) {
            const m = measurementById.get(best.measurementId)!;
            const peak: [number, number] | null = m.peakXMm !== null && m.peakYMm !== null ? [m.peakXMm, m.peakYMm] : null;
            return { transmitterId: t, basis: 'reported', value: (massG === 1 ? best.reportedSar1gWPerKg : best.reportedSar10gWPerKg)!, unit: 'W/kg', measurementId: best.measurementId, peakMm: peak };
          }
          const s = screening.get(screeningKey(t, pos.id, mk.regime));
          if (s && s.result === 'exempt') {
            const est = kdbEstimatedSarWPerKg(s.timeAveragedPowerMw, s.frequencyHz, s.separationM, massG === 10);
            notes.push(
              `${t}: exempt from testing; estimated ${massG} g SAR ${fmt(est)} W/kg = (P/d)·√f/${massG === 10 ? '18.75' : '7.5'} (P ${fmt(s.timeAveragedPowerMw)} mW, d ${fmt(s.separationM * 1000)} mm, f ${fmt(s.frequencyHz / 1e9)} GHz; 0.4/1.0 W/kg beyond 50 mm).`,
            );
            return { transmitterId: t, basis: 'estimated', value: est, unit: 'W/kg', measurementId: null, peakMm: null };
          }
          notes.push(s ? `${t}: needs SAR evaluation in ${pos.id} and has no measurement.` : `${t}: not screened in ${pos.id} (no separation for its antenna under Use positions).`);
          return { transmitterId: t, basis: 'missing', value: null, unit: 'W/kg', measurementId: null, peakMm: null };
        });
        if (massG === 10 && pos.kind !== 'extremity')
          notes.push('Estimated 10 g SAR uses the KDB 447498 §4.3.2 10 g divisor (given there for extremities); common practice for 10 g head/trunk limits.');
        const complete = contributions.every((c) => c.value !== null);
        let outcome: CoTransmissionResult['outcome'] = 'incomplete';
        let pairs: SplsrPair[] = [];
        let sum: number | null = null;
        let resultDerivation: Derivation | null = null;
        if (complete) {
          const r = computeSimultaneousTransmission({
            limitWPerKg: lim.limitWPerKg,
            sarAveraging: massG === 1 ? '1g' : '10g',
            transmitters: contributions.map((c) => ({ id: c.transmitterId, sarWPerKg: c.value!, peakLocationM: c.peakMm ? [c.peakMm[0] / 1000, c.peakMm[1] / 1000, 0] : undefined })),
          });
          sum = r.sumWPerKg;
          pairs = r.pairs;
          outcome = r.sumWithinLimit ? 'sum-within-limit' : r.pass ? 'splsr-within-limit' : 'needs-simultaneous-measurement';
          resultDerivation = r.derivation;
        }
        out.push({
          ...base,
          method: 'sum-of-sar',
          averagingMassKg: massG * G,
          contributions,
          sum,
          limit: lim.limitWPerKg,
          outcome,
          pairs,
          derivation: {
            formula: resultDerivation?.formula ?? 'ΣSAR = Σ SAR_i ≤ SAR_limit',
            inputs: Object.fromEntries(contributions.map((c) => [`${c.basis} SAR[${c.transmitterId}]`, q(c.value, 'W/kg')])),
            intermediate: { ...(resultDerivation?.intermediate ?? {}), splsrLimit: q(SPLSR_LIMIT[massG === 1 ? '1g' : '10g'], '(W/kg)^1.5/mm') },
            result: { sumWPerKg: q(sum, 'W/kg'), limitWPerKg: q(lim.limitWPerKg, 'W/kg'), outcome: q(outcome, '1') },
            source: `${SRC.cotx}; limit: ${lim.source}`,
            notes: [...notes, 'Peak locations are the x/y of each measurement’s peak in one frame (z = 0).', ...(resultDerivation?.notes ?? [])],
          },
        });
      }
    }
  });
  return out;
}

function coTxChecks(results: CoTransmissionResult[]): LabCheck[] {
  return results.map((r) => {
    const ok = r.outcome === 'sum-within-limit' || r.outcome === 'splsr-within-limit';
    const what = r.method === 'sum-of-sar' ? `Σ SAR ${r.sum === null ? '—' : fmt(r.sum)} W/kg against ${r.limit} W/kg` : `Σ ratios ${r.sum === null ? '—' : fmt(r.sum)} against 1`;
    const fix: Record<CoTransmissionResult['outcome'], string> = {
      'sum-within-limit': '',
      'splsr-within-limit': '',
      incomplete: 'Enter the missing measurements (or check screening) for the transmitters named.',
      'needs-simultaneous-measurement': 'Enter peak locations for both transmitters if missing; otherwise the lab measures this combination transmitting together (volume scan).',
      'over-limit': 'Reduce power in this combination or increase separation; the sum of ratios must not exceed 1.',
    };
    return check({
      kind: 'co-transmission',
      subject: { type: 'co-transmission', id: r.id },
      status: ok ? 'pass' : 'fail',
      blocking: !ok,
      value: what,
      tolerance: r.method === 'sum-of-sar' ? `Σ ≤ ${r.limit} W/kg, else SPLSR ≤ ${SPLSR_LIMIT[r.averagingMassKg === 0.001 ? '1g' : '10g']} per pair` : 'Σ ≤ 1',
      message: `${r.transmitterIds.join(' + ')} in ${r.usePositionId} (${MARKET_LABEL[r.regime]}): ${r.outcome.replace(/-/g, ' ')}.`,
      howToFix: fix[r.outcome],
      source: r.method === 'sum-of-sar' ? SRC.cotx : SRC.mpe,
    });
  });
}

const isCopiedCheck = (f: LabCheck) => f.subject.type === 'measurement' && (f.kind === 'liquid' || f.kind === 'system-check') && !f.id.endsWith(':link');

export function computeLabResults(input: In): WithDerivation<LabResults> {
  const txById = new Map(input.transmitters.map((t) => [t.id, t]));
  const posById = new Map(input.usePositions.map((p) => [p.id, p]));
  const unknown = input.measurements.flatMap((m, i) => [
    ...(txById.has(m.transmitterId) ? [] : [{ path: ['measurements', i, 'transmitterId'], message: `unknown transmitter id "${m.transmitterId}"` }]),
    ...(posById.has(m.usePositionId) ? [] : [{ path: ['measurements', i, 'usePositionId'], message: `unknown use position id "${m.usePositionId}"` }]),
  ]);
  if (unknown.length) throw new CalcRangeError(`measurements name transmitters or use positions the device data does not have: ${unknown.map((u) => u.message).join('; ')}`, unknown);

  const liquid = liquidChecks(input);
  const system = systemChecks(input);
  const ctx: Context = {
    input,
    txById,
    posById,
    liquidResults: new Map(liquid.filter((c) => c.kind === 'liquid').map((c) => [c.subject.id, c])),
    systemResults: new Map(system.map((c) => [c.subject.id, c])),
  };
  const repeats = repeatsByRow(input);

  const rows: LabRow[] = input.measurements.map((m) => {
    const tx = txById.get(m.transmitterId)!;
    const pos = posById.get(m.usePositionId)!;
    const tuneUp = m.tuneUpPowerDbm ?? tx.maxTuneUpPowerDbm;
    const scaled = computeReportedSar({
      measuredSarWPerKg: (m.sar1gWPerKg ?? m.sar10gWPerKg)!,
      measuredPowerDbm: m.measuredPowerDbm,
      tuneUpPowerDbm: tuneUp,
      dutyCycle: { measured: m.testDutyCycle, maximum: tx.dutyCycle },
      limitWPerKg: 1.6,
    });
    const r1 = m.sar1gWPerKg === null ? null : m.sar1gWPerKg * scaled.scalingFactor;
    const r10 = m.sar10gWPerKg === null ? null : m.sar10gWPerKg * scaled.scalingFactor;
    const margins = marginsFor(input, pos.kind, r1, r10);
    const rep = repeats.get(m.id);
    const flags = rowChecks(ctx, m, tuneUp, margins);
    if (rep) flags.push(rep.check);
    return {
      measurementId: m.id,
      transmitterId: m.transmitterId,
      usePositionId: m.usePositionId,
      usePositionKind: pos.kind,
      testPosition: m.testPosition,
      channel: m.channel,
      frequencyHz: m.frequencyHz,
      testSeparationM: m.testSeparationM,
      testDate: m.testDate,
      measuredPowerDbm: m.measuredPowerDbm,
      tuneUpPowerDbm: tuneUp,
      tuneUpFromTransmitter: m.tuneUpPowerDbm === null,
      powerScalingFactor: scaled.powerScalingFactor,
      dutyCycleScalingFactor: scaled.dutyCycleScalingFactor,
      scalingFactor: scaled.scalingFactor,
      measuredSar1gWPerKg: m.sar1gWPerKg,
      measuredSar10gWPerKg: m.sar10gWPerKg,
      reportedSar1gWPerKg: r1,
      reportedSar10gWPerKg: r10,
      margins,
      repeats: rep ? { repeatsRequired: rep.repeatsRequired, repeatsDone: rep.repeatsDone, nextRepeatRequired: rep.nextRepeatRequired, decided: rep.decided, why: rep.why } : null,
      flags,
      derivation: rowDerivation(m, tuneUp, m.tuneUpPowerDbm === null, tx.dutyCycle, scaled, r1, r10, margins),
    };
  });

  // The table a reviewer reads first: highest reported SAR per market × exposure condition.
  const kindsPresent = new Set(input.usePositions.map((p) => p.kind));
  const highest: HighestReported[] = [];
  for (const mk of input.markets) {
    for (const kind of SAR_CONDITIONS) {
      if (!kindsPresent.has(kind)) continue;
      const lim = sarLimit(mk.regime, mk.tier, regionOf(kind));
      const massG = lim.averagingMassG!;
      let best: LabRow | null = null;
      let bestValue = -Infinity;
      for (const r of rows) {
        if (r.usePositionKind !== kind) continue;
        const v = massG === 1 ? r.reportedSar1gWPerKg : r.reportedSar10gWPerKg;
        if (v !== null && v > bestValue) {
          best = r;
          bestValue = v;
        }
      }
      highest.push({
        regime: mk.regime,
        tier: mk.tier,
        usePositionKind: kind,
        averagingMassKg: massG * G,
        reportedSarWPerKg: best ? bestValue : null,
        limitWPerKg: lim.limitWPerKg,
        marginDb: best ? 10 * Math.log10(lim.limitWPerKg / bestValue) : null,
        withinLimit: best ? bestValue <= lim.limitWPerKg : null,
        transmitterId: best?.transmitterId ?? null,
        usePositionId: best?.usePositionId ?? null,
        measurementId: best?.measurementId ?? null,
        source: lim.source,
      });
    }
  }

  const coverage = coverageOf(input, posById);
  const cotx = coTransmission(input, rows, posById);
  const unc = uncertaintyOf(input);
  const checks: LabCheck[] = [
    ...liquid,
    ...system,
    ...instrumentChecks(input),
    // A row's copy of a failing liquid or system check is listed once, under the check itself.
    ...rows.flatMap((r) => r.flags.filter((f) => !isCopiedCheck(f))),
    ...(unc.check ? [unc.check] : []),
    ...coverage.checks,
    ...coTxChecks(cotx),
  ];
  const failing = checks.filter((c) => c.status === 'fail');
  const summary = { measurements: rows.length, failing: failing.length, blocking: failing.filter((c) => c.blocking).length, warnings: checks.filter((c) => c.status === 'warning').length };

  return {
    rows,
    highest,
    coTransmission: cotx,
    checks,
    coverage: coverage.items,
    uncertainty: unc.summary,
    summary,
    derivation: {
      formula: 'per row: SAR_reported = s · SAR_meas; per market × condition: max SAR_reported at the limit’s averaging mass; checks as listed',
      inputs: { measurements: q(rows.length, 'count'), markets: q(input.markets.map((m) => m.regime).join(', '), '1') },
      intermediate: {},
      result: { failing: q(summary.failing, 'count'), blocking: q(summary.blocking, 'count'), warnings: q(summary.warnings, 'count') },
      source: `${SRC.reported}; ${SRC.repeats}; ${SRC.cotx}; ${SRC.limit}`,
      notes: ['Summaries of lab measurements; the certifying body and accredited labs decide. Tolerances marked “from memory” should be verified against the standards.'],
    },
  };
}

/**
 * The checks alone, for the readiness rules: every check with its status, tolerance, source and
 * how to fix it. `blocking` failures must stop signing.
 */
export function labChecks(input: LabResultsInputRaw): LabCheck[] {
  return computeLabResults(labResultsInput.parse(input)).checks;
}

export const labResultsCalculation = defineCalculation({
  name: 'lab-results',
  title: 'Lab results: reported SAR, highest per condition, checks, co-transmission',
  description:
    'Scales every SAR measurement to the tune-up limit, gives margins per market, the highest reported SAR per market and exposure condition, repeat and uncertainty requirements, measurement-system checks, coverage against screening, and co-transmission sums.',
  input: labResultsInput,
  compute: computeLabResults,
  sources: ['FCC KDB 447498 D01 v06', 'FCC KDB 865664 D01 v01r04', 'IEEE Std 1528-2013', 'IEC/IEEE 62209-1528:2020', '47 CFR §1.1310'],
});
