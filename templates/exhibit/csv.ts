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
  'transmitter_id',
  'use_position_id',
  'exposure_condition',
  'frequency_Hz',
  'averaging_mass_kg',
  'measured_sar_W_per_kg',
  'scaling_factor',
  'reported_sar_W_per_kg',
  'limit_W_per_kg',
  'power_drift_dB',
];

export function labCsv(m: ExhibitModel): string {
  return csv(
    LAB_CSV_HEADER,
    (m.lab?.sarResults ?? []).map((r) => [
      r.transmitterId,
      r.usePositionId,
      r.exposureCondition,
      r.frequencyHz,
      r.averagingMassKg,
      r.measuredSarWPerKg,
      r.scalingFactor,
      r.reportedSarWPerKg,
      r.limitWPerKg,
      r.powerDriftDb,
    ]),
  );
}
