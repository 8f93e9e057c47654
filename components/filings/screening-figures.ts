/** A screening row's figures as shown: threshold with its own unit, evaluated power, margin. */
import type { ScreeningRow } from '../../calc/screening/screen';
import { formatDb, formatMhz, formatMm, formatMw, sig } from './format';

export function thresholdText(row: ScreeningRow): string {
  if (row.thresholdMw !== null) return formatMw(row.thresholdMw);
  if (row.thresholdErpW !== null) return `${sig(row.thresholdErpW)} W ERP`;
  if (row.thresholdEirpW !== null) return `${sig(row.thresholdEirpW)} W EIRP`;
  if (row.thresholdPowerDensityWPerM2 !== null) return `${sig(row.thresholdPowerDensityWPerM2)} W/m²`;
  return '—';
}

/** The quantity the rule compares: the power in mW, or the power density for reference-level rules. */
export function evaluatedText(row: ScreeningRow): string {
  if (row.thresholdPowerDensityWPerM2 !== null && row.evaluatedPowerDensityWPerM2 !== null) return `${sig(row.evaluatedPowerDensityWPerM2)} W/m²`;
  return formatMw(row.evaluatedPowerMw);
}

export type FigureKey = 'method' | 'frequency' | 'separation' | 'evaluated' | 'threshold' | 'result' | 'margin';

export const FIGURE_LABELS: Record<FigureKey, string> = {
  method: 'Method',
  frequency: 'Frequency',
  separation: 'Separation',
  evaluated: 'Evaluated',
  threshold: 'Threshold',
  result: 'Result',
  margin: 'Margin',
};

export function figureText(row: ScreeningRow, key: FigureKey): string {
  switch (key) {
    case 'method':
      return row.methodLabel;
    case 'frequency':
      return formatMhz(row.frequencyHz);
    case 'separation':
      return formatMm(row.separationM);
    case 'evaluated':
      return evaluatedText(row);
    case 'threshold':
      return thresholdText(row);
    case 'result':
      return row.result;
    case 'margin':
      return formatDb(row.marginDb);
  }
}
