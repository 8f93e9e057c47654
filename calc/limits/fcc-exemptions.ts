/**
 * FCC single-source RF exposure exemptions, 47 CFR §1.1307(b)(3)(i) (FCC 19-126, 85 FR 18131,
 * effective May 3 2021)
 * - (A) 1 mW blanket exemption (47 CFR §1.1307(b)(3)(i)(A), wording from memory);
 * - (B) SAR-based threshold P_th, 0.3–6 GHz, 0.5–40 cm (47 CFR §1.1307(b)(3)(i)(B), secondary source);
 * - (C) MPE-based ERP threshold, Table 1 to §1.1307(b)(3)(i)(C), R ≥ λ/2π (Table 1 to 47 CFR §1.1307(b)(3)(i)(C), secondary source).
 */
import { z } from 'zod';
import { CalcRangeError, defineCalculation, q, type Derivation } from '../types';
import { SPEED_OF_LIGHT_M_PER_S } from '../em/constants';
import { formatHz, formatM, inInterval, requireInRange, type Interval } from './range';
import { compareToThreshold, type Verdict } from './verdict';

// ---------------------------------------------------------------------------------------------
// (B) SAR-based exemption threshold
// ---------------------------------------------------------------------------------------------

const SAR_SOURCE = '47 CFR §1.1307(b)(3)(i)(B) (FCC 19-126; KDB 447498 Formulas (B.1) and (B.2))';
/** Frequencies where the (B) formula is defined, Hz (0.3–6 GHz inclusive). */
export const fccSarRangeHz: Interval = { min: 0.3e9, max: 6e9 };
/** Separations where the (B) formula is defined, m (0.5–40 cm). */
export const fccSarSeparationRangeM: Interval = { min: 0.005, max: 0.4 };
/** ERP_20cm changes form at 1.5 GHz (2040·f below, 3060 mW from 1.5 GHz). */
export const fccSarBreakpointsHz: readonly number[] = [1.5e9];

export interface FccSarThreshold {
  thresholdMw: number;
  erp20cmMw: number;
  exponentX: number;
}

function fccSarParts(frequencyHz: number, separationM: number): FccSarThreshold & { fGHz: number; dCm: number } {
  requireInRange('frequencyHz', frequencyHz, fccSarRangeHz, 'frequency', SAR_SOURCE, 'Above 6 GHz use the MPE-based exemption (fcc-mpe-exemption).');
  requireInRange(
    'separationM',
    separationM,
    fccSarSeparationRangeM,
    'distance',
    SAR_SOURCE,
    'Below 0.5 cm only the 1 mW exemption of §1.1307(b)(3)(i)(A) (fcc-1mw-exemption) is available; beyond 40 cm use fcc-mpe-exemption.',
  );
  const fGHz = frequencyHz / 1e9;
  const dCm = separationM * 100;
  // Formula (B.1): ERP_20cm = 2040·f (0.3 ≤ f < 1.5 GHz), 3060 mW (1.5 ≤ f ≤ 6 GHz).
  const erp20cmMw = fGHz < 1.5 ? 2040 * fGHz : 3060;
  // x = −log10(60 / (ERP_20cm · √f)), f in GHz.
  const exponentX = -Math.log10(60 / (erp20cmMw * Math.sqrt(fGHz)));
  // Formula (B.2): P_th = ERP_20cm·(d/20 cm)^x for d ≤ 20 cm; ERP_20cm for 20 < d ≤ 40 cm.
  const thresholdMw = dCm <= 20 ? erp20cmMw * (dCm / 20) ** exponentX : erp20cmMw;
  return { thresholdMw, erp20cmMw, exponentX, fGHz, dCm };
}

/**
 * §1.1307(b)(3)(i)(B) threshold P_th.
 * @param frequencyHz 0.3–6 GHz, Hz
 * @param separationM 0.005–0.4 m
 * @returns P_th in mW (compare the greater of available maximum time-averaged power and ERP)
 */
export function fccSarThresholdMw(frequencyHz: number, separationM: number): number {
  return fccSarParts(frequencyHz, separationM).thresholdMw;
}

export const fccSarExemptionInput = z.object({
  frequencyHz: z.number().positive().describe('Frequency, Hz (0.3–6 GHz)'),
  separationM: z.number().positive().describe('Separation distance, m (0.005–0.4)'),
  powerMw: z.number().nonnegative().optional().describe('Optional: the greater of available maximum time-averaged power and ERP, mW'),
});

export function computeFccSarExemption(input: z.output<typeof fccSarExemptionInput>) {
  const { frequencyHz, separationM, powerMw } = input;
  const p = fccSarParts(frequencyHz, separationM);
  const verdict: Partial<Verdict> = powerMw === undefined ? {} : compareToThreshold(powerMw, p.thresholdMw);
  const derivation: Derivation = {
    formula:
      p.dCm <= 20
        ? 'P_th = ERP_20cm · (d / 20 cm)^x, x = −log10(60 / (ERP_20cm · √f)), ERP_20cm = ' + (p.fGHz < 1.5 ? '2040·f mW' : '3060 mW') + ' (f in GHz, d in cm)'
        : 'P_th = ERP_20cm (20 cm < d ≤ 40 cm), ERP_20cm = ' + (p.fGHz < 1.5 ? '2040·f mW' : '3060 mW'),
    inputs: {
      frequencyHz: q(frequencyHz, 'Hz'),
      separationM: q(separationM, 'm'),
      ...(powerMw !== undefined ? { powerMw: q(powerMw, 'mW') } : {}),
    },
    intermediate: {
      fGHz: q(p.fGHz, 'GHz'),
      dCm: q(p.dCm, 'cm'),
      erp20cmMw: q(p.erp20cmMw, 'mW'),
      exponentX: q(p.exponentX, '1'),
    },
    result: {
      thresholdMw: q(p.thresholdMw, 'mW'),
      ...(verdict.exempt !== undefined ? { exempt: q(verdict.exempt, '1'), marginDb: q(verdict.marginDb ?? null, 'dB') } : {}),
    },
    source: SAR_SOURCE,
    notes: [
      'Compare the greater of the available maximum time-averaged power and the ERP with P_th (47 CFR §1.1307(b)(3)(i)(B), secondary source).',
      'Formula transcribed from secondary sources; checked against the published exhibit value 2.72 mW at 2.48 GHz, 0.5 cm.',
    ],
  };
  return { thresholdMw: p.thresholdMw, erp20cmMw: p.erp20cmMw, exponentX: p.exponentX, ...verdict, derivation };
}

export const fccSarExemptionCalculation = defineCalculation({
  name: 'fcc-sar-exemption',
  title: 'FCC SAR-based exemption threshold',
  description: '47 CFR §1.1307(b)(3)(i)(B): the power threshold P_th below which a single source is exempt from SAR evaluation, 0.3–6 GHz, 0.5–40 cm.',
  input: fccSarExemptionInput,
  compute: computeFccSarExemption,
  sources: [SAR_SOURCE],
});

// ---------------------------------------------------------------------------------------------
// (C) MPE-based ERP threshold
// ---------------------------------------------------------------------------------------------

const MPE_SOURCE = 'Table 1 to 47 CFR §1.1307(b)(3)(i)(C) (FCC 19-126)';

interface MpeRow {
  interval: Interval; // MHz; a < f ≤ b, first row includes a
  label: string;
  formula: string;
  erpW: (rM: number, fMHz: number) => number;
}

// Table 1 to §1.1307(b)(3)(i)(C), R in m, f in MHz (secondary source; coefficients re-derived from
// §1.1310 Table 1(B), worked: 1915.6, 3448, 3.831, 0.01277, 19.16).
const mpeRows: MpeRow[] = [
  { interval: { min: 0.3, max: 1.34 }, label: '0.3–1.34 MHz', formula: '1,920 · R²', erpW: (r) => 1920 * r ** 2 },
  { interval: { min: 1.34, max: 30, minInclusive: false }, label: '1.34–30 MHz', formula: '3,450 · R² / f²', erpW: (r, f) => (3450 * r ** 2) / f ** 2 },
  { interval: { min: 30, max: 300, minInclusive: false }, label: '30–300 MHz', formula: '3.83 · R²', erpW: (r) => 3.83 * r ** 2 },
  { interval: { min: 300, max: 1500, minInclusive: false }, label: '300–1,500 MHz', formula: '0.0128 · R² · f', erpW: (r, f) => 0.0128 * r ** 2 * f },
  { interval: { min: 1500, max: 100_000, minInclusive: false }, label: '1,500–100,000 MHz', formula: '19.2 · R²', erpW: (r) => 19.2 * r ** 2 },
];
/** Frequency range of Table 1 to §1.1307(b)(3)(i)(C), Hz. */
export const fccMpeRangeHz: Interval = { min: 0.3e6, max: 100e9 };
/** Row edges of Table 1 to §1.1307(b)(3)(i)(C), Hz. */
export const fccMpeBreakpointsHz: readonly number[] = [1.34e6, 30e6, 300e6, 1.5e9];

/** λ/2π in m: the minimum distance at which Table 1 to (b)(3)(i)(C) applies. */
export function fccMpeMinimumDistanceM(frequencyHz: number): number {
  return SPEED_OF_LIGHT_M_PER_S / frequencyHz / (2 * Math.PI);
}

function fccMpeParts(frequencyHz: number, distanceM: number) {
  requireInRange('frequencyHz', frequencyHz, fccMpeRangeHz, 'frequency', MPE_SOURCE);
  const fMHz = frequencyHz / 1e6;
  const row = mpeRows.find((r) => inInterval(fMHz, r.interval)) as MpeRow;
  const minimumDistanceM = fccMpeMinimumDistanceM(frequencyHz);
  if (distanceM < minimumDistanceM) {
    const message =
      `distanceM = ${formatM(distanceM)} is below the minimum distance R ≥ λ/2π = ${formatM(minimumDistanceM)} at ${formatHz(frequencyHz)} ` +
      `required by ${MPE_SOURCE}. Closer than λ/2π use the SAR-based exemption (fcc-sar-exemption) or evaluate.`;
    throw new CalcRangeError(message, [{ path: ['distanceM'], message }]);
  }
  return { fMHz, row, minimumDistanceM, thresholdErpW: row.erpW(distanceM, fMHz) };
}

/**
 * Table 1 to §1.1307(b)(3)(i)(C) ERP threshold.
 * @param frequencyHz 0.3 MHz–100 GHz, Hz
 * @param distanceM minimum separation R, m; must be ≥ λ/2π
 * @returns threshold ERP, W
 */
export function fccMpeThresholdErpW(frequencyHz: number, distanceM: number): number {
  return fccMpeParts(frequencyHz, distanceM).thresholdErpW;
}

export const fccMpeExemptionInput = z.object({
  frequencyHz: z.number().positive().describe('Frequency, Hz (0.3 MHz–100 GHz)'),
  distanceM: z.number().positive().describe('Minimum separation distance R, m (≥ λ/2π)'),
  erpW: z.number().nonnegative().optional().describe('Optional: ERP to compare, W'),
});

export function computeFccMpeExemption(input: z.output<typeof fccMpeExemptionInput>) {
  const { frequencyHz, distanceM, erpW } = input;
  const p = fccMpeParts(frequencyHz, distanceM);
  const verdict: Partial<Verdict> = erpW === undefined ? {} : compareToThreshold(erpW, p.thresholdErpW);
  const derivation: Derivation = {
    formula: `ERP_th = ${p.row.formula} W (row ${p.row.label}; R in m, f in MHz), valid for R ≥ λ/2π`,
    inputs: {
      frequencyHz: q(frequencyHz, 'Hz'),
      distanceM: q(distanceM, 'm'),
      ...(erpW !== undefined ? { erpW: q(erpW, 'W') } : {}),
    },
    intermediate: { fMHz: q(p.fMHz, 'MHz'), minimumDistanceM: q(p.minimumDistanceM, 'm') },
    result: {
      thresholdErpW: q(p.thresholdErpW, 'W'),
      ...(verdict.exempt !== undefined ? { exempt: q(verdict.exempt, '1'), marginDb: q(verdict.marginDb ?? null, 'dB') } : {}),
    },
    source: `${MPE_SOURCE}, row ${p.row.label}`,
    notes: [
      'At a shared row edge the lower row applies (the rows agree there to the printed precision).',
      'The available maximum time-averaged power may replace ERP when the radiating structure is ≤ λ/4 or the antenna gain is below a half-wave dipole (from memory, Table 1 to 47 CFR §1.1307(b)(3)(i)(C), from memory).',
      'Coefficients checked by re-derivation from §1.1310 Table 1(B): S·4πR²/(4·1.64) (worked re-derivation).',
    ],
  };
  return { thresholdErpW: p.thresholdErpW, minimumDistanceM: p.minimumDistanceM, ...verdict, derivation };
}

export const fccMpeExemptionCalculation = defineCalculation({
  name: 'fcc-mpe-exemption',
  title: 'FCC MPE-based exemption threshold (ERP)',
  description: 'Table 1 to 47 CFR §1.1307(b)(3)(i)(C): the ERP below which a single source is exempt, at a distance R ≥ λ/2π.',
  input: fccMpeExemptionInput,
  compute: computeFccMpeExemption,
  sources: [MPE_SOURCE],
});

// ---------------------------------------------------------------------------------------------
// (A) 1 mW blanket exemption
// ---------------------------------------------------------------------------------------------

const ONE_MW_SOURCE = '47 CFR §1.1307(b)(3)(i)(A)';
export const FCC_BLANKET_EXEMPTION_MW = 1;
const ONE_MW_CONDITION =
  'available maximum time-averaged power ≤ 1 mW, regardless of separation distance; not combinable with other exemption criteria except the multi-source 1 mW rule of §1.1307(b)(3)(ii)(A)';

export const fcc1mwExemptionInput = z.object({
  powerMw: z.number().nonnegative().describe('Available maximum time-averaged power, mW'),
  separationM: z.number().nonnegative().optional().describe('Separation distance, m (recorded; the rule does not depend on it)'),
  frequencyHz: z.number().positive().optional().describe('Frequency, Hz (recorded; the rule does not depend on it)'),
});

export function computeFcc1mwExemption(input: z.output<typeof fcc1mwExemptionInput>) {
  const { powerMw, separationM, frequencyHz } = input;
  const verdict = compareToThreshold(powerMw, FCC_BLANKET_EXEMPTION_MW);
  const derivation: Derivation = {
    formula: 'exempt if P_avail,max,avg ≤ 1 mW',
    inputs: {
      powerMw: q(powerMw, 'mW'),
      ...(separationM !== undefined ? { separationM: q(separationM, 'm') } : {}),
      ...(frequencyHz !== undefined ? { frequencyHz: q(frequencyHz, 'Hz') } : {}),
    },
    intermediate: {},
    result: { exempt: q(verdict.exempt, '1'), thresholdMw: q(FCC_BLANKET_EXEMPTION_MW, 'mW'), marginDb: q(verdict.marginDb, 'dB') },
    source: ONE_MW_SOURCE,
    notes: ['Wording of (i)(A) from memory (47 CFR §1.1307(b)(3)(i)(A), from memory): applies regardless of separation distance; medical implant devices may use only (i)(A) and (ii)(A).'],
  };
  return { exempt: verdict.exempt, thresholdMw: FCC_BLANKET_EXEMPTION_MW, marginDb: verdict.marginDb, condition: ONE_MW_CONDITION, derivation };
}

export const fcc1mwExemptionCalculation = defineCalculation({
  name: 'fcc-1mw-exemption',
  title: 'FCC 1 mW blanket exemption',
  description: '47 CFR §1.1307(b)(3)(i)(A): a single source of at most 1 mW available maximum time-averaged power is exempt at any distance.',
  input: fcc1mwExemptionInput,
  compute: computeFcc1mwExemption,
  sources: [ONE_MW_SOURCE],
});
