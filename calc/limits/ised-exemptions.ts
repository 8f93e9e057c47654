/**
 * ISED Canada RSS-102 Issue 5 exemptions, as transcribed in
 * RSS-102 Issue 5 (March 2015):
 * - §2.5.1 Table 1, SAR evaluation exemption limits (mW) against frequency and separation
 *   (RSS-102 Issue 5 §2.5.1 Table 1; 2450 MHz at ≤5 and 10 mm confirmed (secondary source), the rest from memory; linear
 *   interpolation between entries, from memory; ≤5 mm column used below 5 mm, secondary source; limb-worn ×2.5, from memory);
 * - §2.5.2 RF exposure evaluation exemption e.i.r.p. limits, separation > 20 cm (RSS-102 Issue 5 §2.5.2).
 * Issue 6 (Dec 2023) revised these tables; its values were not obtained — do not use this module
 * for Issue 6 filings.
 */
import { z } from 'zod';
import { CalcRangeError, defineCalculation, type Derivation, type Quantity } from '../types';
import { q } from '../types';
import { formatM, inInterval, requireInRange, type Interval } from './range';
import { compareToThreshold, type Verdict } from './verdict';

// ---------------------------------------------------------------------------------------------
// §2.5.1 Table 1 — SAR evaluation exemption
// ---------------------------------------------------------------------------------------------

const SAR_SOURCE = 'RSS-102 Issue 5 §2.5.1 Table 1';

/** Table 1 separation columns, mm (first is "≤ 5 mm", last "≥ 50 mm"). */
export const isedSarTableSeparationsMm: readonly number[] = [5, 10, 15, 20, 25, 30, 35, 40, 45, 50];
/** Table 1 frequency rows, MHz (first is "≤ 300 MHz"). */
export const isedSarTableFrequenciesMHz: readonly number[] = [300, 450, 835, 1900, 2450, 3500, 5800];
/** Table 1 frequency rows, Hz: the breakpoints of the interpolated threshold. */
export const isedSarTableFrequenciesHz: readonly number[] = isedSarTableFrequenciesMHz.map((f) => f * 1e6);
// Exemption limits, mW (RSS-102 Issue 5 §2.5.1 Table 1).
const TABLE_MW: readonly (readonly number[])[] = [
  [71, 101, 132, 162, 193, 223, 254, 284, 315, 345], // ≤ 300 MHz
  [52, 70, 88, 106, 123, 141, 159, 177, 195, 213], // 450
  [17, 30, 42, 55, 67, 80, 92, 105, 117, 130], // 835
  [7, 10, 18, 34, 60, 99, 153, 225, 316, 431], // 1900
  [4, 7, 15, 30, 52, 83, 123, 173, 235, 309], // 2450
  [2, 6, 16, 32, 55, 86, 124, 170, 225, 290], // 3500
  [1, 6, 15, 27, 41, 56, 71, 85, 97, 106], // 5800
];
/** Lower frequency bound used for the "≤ 300 MHz" row: the SAR range of 100 kHz (from memory). */
export const isedSarRangeHz: Interval = { min: 100e3, max: 5800e6 };
export const isedSarSeparationRangeM: Interval = { min: 0, max: 0.2 };
export const ISED_LIMB_WORN_FACTOR = 2.5;

/** Index i with xs[i] ≤ x ≤ xs[i+1] and the fraction between them (x clamped by the caller). */
function bracket(xs: readonly number[], x: number): { i: number; t: number } {
  if (x <= xs[0]) return { i: 0, t: 0 };
  for (let i = 0; i < xs.length - 1; i++) {
    if (x <= xs[i + 1]) return { i, t: (x - xs[i]) / (xs[i + 1] - xs[i]) };
  }
  return { i: xs.length - 2, t: 1 };
}

export interface IsedSarThreshold {
  thresholdMw: number;
  /** Frequency and separation used in the table after its edge rules (≤300 MHz row, ≤5 / ≥50 mm columns). */
  tableFrequencyMHz: number;
  tableSeparationMm: number;
  /** The (up to four) table entries interpolated. */
  corners: { frequencyMHz: number; separationMm: number; limitMw: number }[];
}

/**
 * RSS-102 Issue 5 Table 1 SAR evaluation exemption limit, bilinear in frequency and separation.
 * @param frequencyHz 100 kHz–5.8 GHz, Hz (≤ 300 MHz uses the 300 MHz row)
 * @param separationM 0–0.2 m (≤ 5 mm uses the 5 mm column, 50–200 mm the ≥ 50 mm column)
 * @param limbWorn limb-worn device: Table 1 × 2.5
 */
export function isedSarExemption(frequencyHz: number, separationM: number, limbWorn = false): IsedSarThreshold {
  const { fMHz, dMm } = tableCoordinates(frequencyHz, separationM);
  const fb = bracket(isedSarTableFrequenciesMHz, fMHz);
  const db = bracket(isedSarTableSeparationsMm, dMm);
  const corners: IsedSarThreshold['corners'] = [];
  for (const fi of [fb.i, fb.i + 1]) {
    for (const di of [db.i, db.i + 1]) corners.push({ frequencyMHz: isedSarTableFrequenciesMHz[fi], separationMm: isedSarTableSeparationsMm[di], limitMw: TABLE_MW[fi][di] });
  }
  return {
    thresholdMw: tableLimitMw(fMHz, dMm) * (limbWorn ? ISED_LIMB_WORN_FACTOR : 1),
    tableFrequencyMHz: fMHz,
    tableSeparationMm: dMm,
    corners,
  };
}

/** Frequency (MHz) and separation (mm) as Table 1 is read: range-checked, then its edge rules applied. */
function tableCoordinates(frequencyHz: number, separationM: number): { fMHz: number; dMm: number } {
  requireInRange('frequencyHz', frequencyHz, isedSarRangeHz, 'frequency', SAR_SOURCE, 'Table 1 has no row above 5800 MHz: evaluate SAR.');
  requireInRange('separationM', separationM, isedSarSeparationRangeM, 'distance', SAR_SOURCE, 'Beyond 20 cm use the RF exposure evaluation exemption (ised-rf-exemption).');
  return { fMHz: Math.max(frequencyHz / 1e6, 300), dMm: Math.min(Math.max(separationM * 1000, 5), 50) };
}

/** Table 1 bilinear in frequency (MHz) and separation (mm), both already within the table. */
function tableLimitMw(fMHz: number, dMm: number): number {
  const fb = bracket(isedSarTableFrequenciesMHz, fMHz);
  const db = bracket(isedSarTableSeparationsMm, dMm);
  const lo = TABLE_MW[fb.i];
  const hi = TABLE_MW[fb.i + 1];
  const row0 = lo[db.i] + db.t * (lo[db.i + 1] - lo[db.i]);
  const row1 = hi[db.i] + db.t * (hi[db.i + 1] - hi[db.i]);
  return row0 + fb.t * (row1 - row0);
}

/** Shorthand: the Table 1 exemption limit in mW (no corner list: the screening's band search calls it per candidate). */
export function isedSarExemptionMw(frequencyHz: number, separationM: number, limbWorn = false): number {
  const { fMHz, dMm } = tableCoordinates(frequencyHz, separationM);
  return tableLimitMw(fMHz, dMm) * (limbWorn ? ISED_LIMB_WORN_FACTOR : 1);
}

export const isedSarExemptionInput = z.object({
  frequencyHz: z.number().positive().describe('Frequency, Hz (100 kHz–5.8 GHz)'),
  separationM: z.number().nonnegative().describe('Separation distance, m (≤ 0.2)'),
  limbWorn: z.boolean().default(false).describe('Limb-worn device (10-g limit): Table 1 × 2.5'),
  powerMw: z.number().nonnegative().optional().describe('Optional: source-based time-averaged output power incl. tune-up, the higher of conducted power and e.i.r.p., mW'),
});

/** Derivation names of the table entries, `table_<f>MHz_<d>mm`, by row and column (built once). */
const CORNER_NAMES: readonly (readonly string[])[] = isedSarTableFrequenciesMHz.map((f) => isedSarTableSeparationsMm.map((d) => `table_${f}MHz_${d}mm`));

/** The table point used and the corner entries interpolated, as derivation quantities. */
function cornerQuantities(t: IsedSarThreshold): Record<string, Quantity> {
  const out: Record<string, Quantity> = { tableFrequencyMHz: q(t.tableFrequencyMHz, 'MHz'), tableSeparationMm: q(t.tableSeparationMm, 'mm') };
  for (const c of t.corners) {
    out[CORNER_NAMES[isedSarTableFrequenciesMHz.indexOf(c.frequencyMHz)][isedSarTableSeparationsMm.indexOf(c.separationMm)]] = q(c.limitMw, 'mW');
  }
  return out;
}

export function computeIsedSarExemption(input: z.output<typeof isedSarExemptionInput>) {
  const { frequencyHz, separationM, limbWorn, powerMw } = input;
  const t = isedSarExemption(frequencyHz, separationM, limbWorn);
  const verdict: Partial<Verdict> = powerMw === undefined ? {} : compareToThreshold(powerMw, t.thresholdMw);
  const notes = [
    'Table 1 edges: frequencies at or below 300 MHz use the ≤ 300 MHz row; separations below 5 mm use the ≤ 5 mm column (an FCC/ISED filing exhibit applies the 5 mm value: secondary source); 50–200 mm use the ≥ 50 mm column.',
    'Between tabulated frequencies and separations: linear interpolation in frequency and in separation (RSS-102 Issue 5 §2.5.1 Table 1, from memory).',
    'Table values other than 2450 MHz at ≤ 5 mm (4 mW) and 10 mm (7 mW) are from memory: verify before release.',
    'Compare the source-based time-averaged output power incl. tune-up, the higher of conducted power and e.i.r.p.',
    'Issue 5 values; RSS-102 Issue 6 (Dec 2023) revised the SAR exemption limits (not tabulated here).',
  ];
  if (limbWorn) notes.push('Limb-worn: Table 1 × 2.5 (RSS-102 Issue 5 §2.5.1 Table 1, from memory).');
  const derivation: Derivation = {
    formula: `P_th = bilinear(Table 1; f, d)${limbWorn ? ' × 2.5' : ''} between the corner entries`,
    inputs: {
      frequencyHz: q(frequencyHz, 'Hz'),
      separationM: q(separationM, 'm'),
      limbWorn: q(limbWorn, '1'),
      ...(powerMw !== undefined ? { powerMw: q(powerMw, 'mW') } : {}),
    },
    intermediate: cornerQuantities(t),
    result: {
      thresholdMw: q(t.thresholdMw, 'mW'),
      ...(verdict.exempt !== undefined ? { exempt: q(verdict.exempt, '1'), marginDb: q(verdict.marginDb ?? null, 'dB') } : {}),
    },
    source: SAR_SOURCE,
    notes,
  };
  return { thresholdMw: t.thresholdMw, tableFrequencyMHz: t.tableFrequencyMHz, tableSeparationMm: t.tableSeparationMm, ...verdict, derivation };
}

export const isedSarExemptionCalculation = defineCalculation({
  name: 'ised-sar-exemption',
  title: 'ISED SAR evaluation exemption (RSS-102 Issue 5 Table 1)',
  description: 'RSS-102 Issue 5 §2.5.1 Table 1: output power at or below which SAR evaluation is not required, interpolated in frequency and separation (≤ 20 cm).',
  input: isedSarExemptionInput,
  compute: computeIsedSarExemption,
  sources: [SAR_SOURCE],
});

// ---------------------------------------------------------------------------------------------
// §2.5.2 — RF exposure evaluation exemption (separation > 20 cm)
// ---------------------------------------------------------------------------------------------

const RF_SOURCE = 'RSS-102 Issue 5 §2.5.2';

interface RfRow {
  interval: Interval; // MHz
  label: string;
  formula: string;
  eirpW: (fMHz: number) => number;
}
// §2.5.2 e.i.r.p. exemption limits, f in MHz (RSS-102 Issue 5 §2.5.2). Rows are "a ≤ f < b" as printed.
const rfRows: RfRow[] = [
  { interval: { min: 0.003, max: 20, maxInclusive: false }, label: 'f < 20 MHz', formula: '1 W', eirpW: () => 1 },
  { interval: { min: 20, max: 48, maxInclusive: false }, label: '20 MHz ≤ f < 48 MHz', formula: '4.49 / f^0.5 W', eirpW: (f) => 4.49 / f ** 0.5 },
  { interval: { min: 48, max: 300, maxInclusive: false }, label: '48 MHz ≤ f < 300 MHz', formula: '0.6 W', eirpW: () => 0.6 },
  { interval: { min: 300, max: 6000, maxInclusive: false }, label: '300 MHz ≤ f < 6 GHz', formula: '1.31 × 10⁻² · f^0.6834 W', eirpW: (f) => 1.31e-2 * f ** 0.6834 },
  { interval: { min: 6000, max: 300_000 }, label: 'f ≥ 6 GHz', formula: '5 W', eirpW: () => 5 },
];
/** RSS-102 scope, 3 kHz–300 GHz (from memory); §2.5.2 itself is open-ended at both ends. */
export const isedRfRangeHz: Interval = { min: 3e3, max: 300e9 };
/** Row edges of §2.5.2, Hz. */
export const isedRfBreakpointsHz: readonly number[] = [20e6, 48e6, 300e6, 6e9];

function isedRfRow(frequencyHz: number, separationM: number): RfRow {
  requireInRange('frequencyHz', frequencyHz, isedRfRangeHz, 'frequency', RF_SOURCE);
  if (!(separationM > 0.2)) {
    const message = `separationM = ${formatM(separationM)}: ${RF_SOURCE} applies only at separations above 20 cm. At or below 20 cm use the SAR evaluation exemption (ised-sar-exemption).`;
    throw new CalcRangeError(message, [{ path: ['separationM'], message }]);
  }
  return rfRows.find((r) => inInterval(frequencyHz / 1e6, r.interval)) as RfRow;
}

/**
 * RSS-102 Issue 5 §2.5.2 e.i.r.p. exemption limit.
 * @param frequencyHz 3 kHz–300 GHz, Hz
 * @param separationM must be > 0.2 m
 * @returns e.i.r.p. limit, W (compare the source-based time-averaged maximum e.i.r.p. incl. tune-up)
 */
export function isedRfExemptionEirpW(frequencyHz: number, separationM: number): number {
  return isedRfRow(frequencyHz, separationM).eirpW(frequencyHz / 1e6);
}

export const isedRfExemptionInput = z.object({
  frequencyHz: z.number().positive().describe('Frequency, Hz'),
  separationM: z.number().positive().describe('Separation distance, m (> 0.2)'),
  eirpW: z.number().nonnegative().optional().describe('Optional: source-based time-averaged maximum e.i.r.p. incl. tune-up, W'),
});

export function computeIsedRfExemption(input: z.output<typeof isedRfExemptionInput>) {
  const { frequencyHz, separationM, eirpW } = input;
  const row = isedRfRow(frequencyHz, separationM);
  const thresholdEirpW = row.eirpW(frequencyHz / 1e6);
  const verdict: Partial<Verdict> = eirpW === undefined ? {} : compareToThreshold(eirpW, thresholdEirpW);
  const derivation: Derivation = {
    formula: `e.i.r.p._th = ${row.formula} (${row.label}; f in MHz)`,
    inputs: {
      frequencyHz: q(frequencyHz, 'Hz'),
      separationM: q(separationM, 'm'),
      ...(eirpW !== undefined ? { eirpW: q(eirpW, 'W') } : {}),
    },
    intermediate: { fMHz: q(frequencyHz / 1e6, 'MHz') },
    result: {
      thresholdEirpW: q(thresholdEirpW, 'W'),
      ...(verdict.exempt !== undefined ? { exempt: q(verdict.exempt, '1'), marginDb: q(verdict.marginDb ?? null, 'dB') } : {}),
    },
    source: `${RF_SOURCE}, ${row.label}`,
    notes: [
      'Compare the source-based, time-averaged maximum e.i.r.p. including tune-up tolerance.',
      'Each limit ≈ the Table 4 general-public power density × 4π(0.2 m)² (RSS-102 Issue 5 §2.5.2 check).',
      'The 3 kHz–300 GHz bounds are RSS-102’s scope (from memory); the rows themselves are open-ended.',
    ],
  };
  return { thresholdEirpW, ...verdict, derivation };
}

export const isedRfExemptionCalculation = defineCalculation({
  name: 'ised-rf-exemption',
  title: 'ISED RF exposure evaluation exemption (RSS-102 Issue 5 §2.5.2)',
  description: 'RSS-102 Issue 5 §2.5.2: e.i.r.p. at or below which RF exposure evaluation is not required, for separations above 20 cm.',
  input: isedRfExemptionInput,
  compute: computeIsedRfExemption,
  sources: [RF_SOURCE],
});
