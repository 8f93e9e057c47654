/**
 * The machine-readable results: screening.csv (every transmitter × use position × market) and
 * lab-sar.csv (every lab SAR result), one header row each, SI units in the column names, RFC 4180
 * quoting, CRLF line ends. Numbers are written as JavaScript prints them (shortest exact form).
 */
import type { ExhibitModel } from './model';

function cell(v: string | number | null | undefined): string {
  if (v === null || v === undefined) return '';
  const s = typeof v === 'number' ? (Number.isFinite(v) ? String(v) : '') : v;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

function csv(header: string[], rows: (string | number | null)[][]): string {
  return [header, ...rows].map((r) => r.map(cell).join(',')).join('\r\n') + '\r\n';
}

export const SCREENING_CSV_HEADER = [
  'transmitter_id',
  'use_position_id',
  'use_position_kind',
  'market',
  'exposure_tier',
  'rule',
  'frequency_Hz',
  'separation_m',
  'power_mode',
  'evaluated_power_W',
  'evaluated_quantity',
  'threshold',
  'threshold_unit',
  'result',
  'margin_dB',
  'estimated_sar_W_per_kg',
  'appendix_ref',
];

export function screeningCsv(m: ExhibitModel): string {
  return csv(
    SCREENING_CSV_HEADER,
    m.screening.rows.map((r) => [
      r.transmitterId,
      r.usePositionId,
      r.usePositionKind,
      r.regime,
      r.tier,
      r.method,
      r.frequencyHz,
      r.separationM,
      r.powerMode,
      r.evaluatedPowerMw / 1000,
      r.evaluatedQuantity,
      r.threshold,
      r.thresholdUnit,
      r.result,
      r.marginDb,
      r.estimatedSarWPerKg,
      r.appendixRef,
    ]),
  );
}

export const LAB_CSV_HEADER = [
  'measurement_id',
  'transmitter_id',
  'use_position_id',
  'exposure_condition',
  'test_position',
  'channel',
  'frequency_Hz',
  'test_separation_m',
  'test_date',
  'measured_power_dBm',
  'tune_up_power_dBm',
  'scaling_factor',
  'measured_sar_1g_W_per_kg',
  'measured_sar_10g_W_per_kg',
  'reported_sar_1g_W_per_kg',
  'reported_sar_10g_W_per_kg',
  'power_drift_dB',
  'appendix_ref',
];

export function labCsv(m: ExhibitModel): string {
  return csv(
    LAB_CSV_HEADER,
    (m.lab?.sarResults ?? []).map((r) => [
      r.measurementId,
      r.transmitterId,
      r.usePositionId,
      r.exposureCondition,
      r.testPosition,
      r.channel,
      r.frequencyHz,
      r.testSeparationM,
      r.testDate,
      r.measuredPowerDbm,
      r.tuneUpPowerDbm,
      r.scalingFactor,
      r.measuredSar1gWPerKg,
      r.measuredSar10gWPerKg,
      r.reportedSar1gWPerKg,
      r.reportedSar10gWPerKg,
      r.powerDriftDb,
      r.appendixRef,
    ]),
  );
}
