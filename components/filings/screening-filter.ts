/**
 * Filtering the screening table (pure, so it is tested without a screen): by result, market,
 * transmitter and use position; "all" lets everything through. And the table as CSV, one line
 * per combination, figures in the units shown.
 */
import type { ScreeningResult } from '../../calc/screening/rule';
import type { ScreeningRowDto } from '../../hooks/queries/filings';
import { USE_POSITION_LABELS } from '../../constants/schemas/device-file';
import { methodShort, powerModeText, regimeShort, RESULT_LOOK } from './labels';
import { evaluatedText, thresholdText } from './screening-figures';

export const ALL = 'all';

export interface ScreeningFilter {
  result: ScreeningResult | typeof ALL;
  regime: string;
  transmitterId: string;
  usePositionId: string;
}

export const NO_FILTER: ScreeningFilter = { result: ALL, regime: ALL, transmitterId: ALL, usePositionId: ALL };

export function filterRows(rows: readonly ScreeningRowDto[], f: ScreeningFilter): ScreeningRowDto[] {
  return rows.filter(
    (r) =>
      (f.result === ALL || r.result === f.result) &&
      (f.regime === ALL || r.regime === f.regime) &&
      (f.transmitterId === ALL || r.transmitterId === f.transmitterId) &&
      (f.usePositionId === ALL || r.usePositionId === f.usePositionId),
  );
}

export const isFiltered = (f: ScreeningFilter) => f.result !== ALL || f.regime !== ALL || f.transmitterId !== ALL || f.usePositionId !== ALL;

const cell = (v: string | number | null) => {
  const s = v === null ? '' : String(v);
  return /[",\n;]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
};

/** RFC 4180 CSV of the rows as shown (after filtering), with a header line. */
export function screeningCsv(rows: readonly ScreeningRowDto[]): string {
  const head = [
    'Transmitter',
    'Use position',
    'Position kind',
    'Antenna',
    'Separation (mm)',
    'Power mode',
    'Market',
    'Tier',
    'Method',
    'Frequency (MHz)',
    'Evaluated',
    'Threshold',
    'Result',
    'Margin (dB)',
    'Source',
  ];
  const lines = rows.map((r) =>
    [
      r.transmitterId,
      r.usePositionId,
      USE_POSITION_LABELS[r.usePositionKind],
      r.antennaId ?? null,
      Number((r.separationM * 1000).toPrecision(6)),
      powerModeText(r.powerMode),
      regimeShort(r.regime),
      r.tier,
      methodShort(r.method),
      Number((r.frequencyHz / 1e6).toPrecision(9)),
      evaluatedText(r),
      thresholdText(r),
      RESULT_LOOK[r.result].label,
      r.marginDb === null ? null : Number(r.marginDb.toFixed(2)),
      r.derivation.source,
    ]
      .map(cell)
      .join(','),
  );
  return [head.join(','), ...lines].join('\r\n') + '\r\n';
}

/** One transmitter's rows, with the row that decides its standing (see `worstRow`) and counts per result. */
export interface TransmitterGroup {
  transmitterId: string;
  rows: ScreeningRowDto[];
  worst: ScreeningRowDto;
  counts: Record<ScreeningResult, number>;
}

// Needing SAR asks most of the lab (a measurement), MPE less (a calculation), an exemption nothing.
const RESULT_WEIGHT: Record<ScreeningResult, number> = { 'evaluate-sar': 3, 'evaluate-mpe': 2, exempt: 1 };

/**
 * The row that decides a transmitter's standing: the heaviest result, then a provisional
 * exemption before a firm one, then the smallest margin (a row without one ranks after any known margin).
 */
export function worstRow(rows: readonly ScreeningRowDto[]): ScreeningRowDto {
  const score = (r: ScreeningRowDto) => [RESULT_WEIGHT[r.result], r.provisional ? 1 : 0, -(r.marginDb ?? Number.POSITIVE_INFINITY)] as const;
  return rows.reduce((worst, r) => {
    const [a, b] = [score(r), score(worst)];
    for (let i = 0; i < a.length; i += 1) if (a[i] !== b[i]) return a[i]! > b[i]! ? r : worst;
    return worst;
  });
}

/** The rows grouped by transmitter, in the order the transmitters first appear. */
export function groupByTransmitter(rows: readonly ScreeningRowDto[]): TransmitterGroup[] {
  const byId = new Map<string, ScreeningRowDto[]>();
  for (const r of rows) {
    const list = byId.get(r.transmitterId);
    if (list) list.push(r);
    else byId.set(r.transmitterId, [r]);
  }
  return [...byId].map(([transmitterId, list]) => ({
    transmitterId,
    rows: list,
    worst: worstRow(list),
    counts: {
      exempt: list.filter((r) => r.result === 'exempt').length,
      'evaluate-sar': list.filter((r) => r.result === 'evaluate-sar').length,
      'evaluate-mpe': list.filter((r) => r.result === 'evaluate-mpe').length,
    },
  }));
}
