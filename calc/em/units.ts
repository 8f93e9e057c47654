/**
 * Power and gain unit conversions used throughout a filing.
 *
 *   P(dBm) = 10·log10(P / 1 mW)           (definition of the decibel-milliwatt; common practice)
 *   G = 10^(G(dBi)/10)                    (decibel relative to an isotropic radiator)
 *   EIRP = ERP · 10^(2.15/10) (= ERP + 2.15 dB ≈ 1.64·ERP)
 *        — ERP is referred to a half-wave dipole, whose gain is 2.15 dBi (≈ 1.64)
 *          (Balanis, "Antenna Theory", 4th ed., §4.6 half-wave dipole directivity 1.643 — from memory;
 *          the factor 1.64 is also used in 47 CFR §1.1307(b)(3)(i)(C), IEEE Std 145 half-wave dipole gain)
 *   P_avg = P_peak · duty cycle            (time averaging of a pulsed/burst transmission; common practice)
 */
import { z } from 'zod';
import { defineCalculation, type Derivation } from '../types';
import { q } from '../types';

/** Gain of a half-wave dipole over an isotropic radiator, dB (2.15 dBi; ERP ↔ EIRP). */
export const HALF_WAVE_DIPOLE_GAIN_DBI = 2.15;

/** P (dBm) → P (mW). */
export const dbmToMw = (powerDbm: number): number => Math.pow(10, powerDbm / 10);
/** P (mW, > 0) → P (dBm). */
export const mwToDbm = (powerMw: number): number => 10 * Math.log10(powerMw);
/** P (dBm) → P (W). */
export const dbmToW = (powerDbm: number): number => dbmToMw(powerDbm) / 1000;
/** P (W, > 0) → P (dBm). */
export const wToDbm = (powerW: number): number => mwToDbm(powerW * 1000);
/** G (dBi) → linear power gain. */
export const dbiToLinear = (gainDbi: number): number => Math.pow(10, gainDbi / 10);
/** Linear power gain (> 0) → G (dBi). */
export const linearToDbi = (gainLinear: number): number => 10 * Math.log10(gainLinear);
/** ERP (W) → EIRP (W): + 2.15 dB. */
export const erpToEirpW = (erpW: number): number => erpW * dbiToLinear(HALF_WAVE_DIPOLE_GAIN_DBI);
/** EIRP (W) → ERP (W): − 2.15 dB. */
export const eirpToErpW = (eirpW: number): number => eirpW / dbiToLinear(HALF_WAVE_DIPOLE_GAIN_DBI);
/** ERP (dBm) → EIRP (dBm). */
export const erpDbmToEirpDbm = (erpDbm: number): number => erpDbm + HALF_WAVE_DIPOLE_GAIN_DBI;
/** EIRP (dBm) → ERP (dBm). */
export const eirpDbmToErpDbm = (eirpDbm: number): number => eirpDbm - HALF_WAVE_DIPOLE_GAIN_DBI;
/** Time-averaged power (W) of a source transmitting peakPowerW (W) for the fraction dutyCycle (0–1] of the time. */
export const timeAveragedPowerW = (peakPowerW: number, dutyCycle: number): number => peakPowerW * dutyCycle;

const DB_DEF = 'dBm: 10·log10(P/1 mW), definition (common practice)';
const DBI_DEF = 'dBi: 10·log10(G), gain relative to an isotropic radiator (common practice)';
const DIPOLE =
  'ERP is referred to a half-wave dipole of gain 2.15 dBi (≈ 1.64): EIRP = ERP + 2.15 dB (common practice; dipole gain per Balanis, Antenna Theory, from memory; 1.64 factor as in 47 CFR §1.1307(b)(3)(i)(C))';
const DUTY = 'Time-averaged power = peak (burst) power × duty cycle (common practice, e.g. FCC KDB 447498 source-based time averaging)';

const finite = z.number();
const positive = z.number().positive();

export const unitsInput = z.discriminatedUnion('conversion', [
  z.object({ conversion: z.literal('dbm-to-mw'), powerDbm: finite.describe('Power, dBm') }),
  z.object({ conversion: z.literal('mw-to-dbm'), powerMw: positive.describe('Power, mW (> 0)') }),
  z.object({ conversion: z.literal('dbm-to-w'), powerDbm: finite.describe('Power, dBm') }),
  z.object({ conversion: z.literal('w-to-dbm'), powerW: positive.describe('Power, W (> 0)') }),
  z.object({ conversion: z.literal('dbi-to-linear'), gainDbi: finite.describe('Gain, dBi') }),
  z.object({ conversion: z.literal('linear-to-dbi'), gainLinear: positive.describe('Linear power gain (> 0)') }),
  z.object({ conversion: z.literal('erp-to-eirp'), erpW: z.number().nonnegative().describe('ERP, W') }),
  z.object({ conversion: z.literal('eirp-to-erp'), eirpW: z.number().nonnegative().describe('EIRP, W') }),
  z.object({
    conversion: z.literal('time-averaged'),
    peakPowerW: z.number().nonnegative().describe('Power while transmitting, W'),
    dutyCycle: z.number().gt(0).lte(1).describe('Fraction of time transmitting, (0, 1]'),
  }),
]);

export type UnitsInput = z.output<typeof unitsInput>;

type Row = { output: Record<string, number>; formula: string; units: Record<string, string>; source: string };

function convert(input: UnitsInput): Row {
  switch (input.conversion) {
    case 'dbm-to-mw':
      return { output: { powerMw: dbmToMw(input.powerDbm) }, formula: 'P(mW) = 10^(P(dBm)/10)', units: { powerDbm: 'dBm', powerMw: 'mW' }, source: DB_DEF };
    case 'mw-to-dbm':
      return { output: { powerDbm: mwToDbm(input.powerMw) }, formula: 'P(dBm) = 10·log10(P(mW))', units: { powerMw: 'mW', powerDbm: 'dBm' }, source: DB_DEF };
    case 'dbm-to-w':
      return { output: { powerW: dbmToW(input.powerDbm) }, formula: 'P(W) = 10^(P(dBm)/10) / 1000', units: { powerDbm: 'dBm', powerW: 'W' }, source: DB_DEF };
    case 'w-to-dbm':
      return { output: { powerDbm: wToDbm(input.powerW) }, formula: 'P(dBm) = 10·log10(1000·P(W))', units: { powerW: 'W', powerDbm: 'dBm' }, source: DB_DEF };
    case 'dbi-to-linear':
      return { output: { gainLinear: dbiToLinear(input.gainDbi) }, formula: 'G = 10^(G(dBi)/10)', units: { gainDbi: 'dBi', gainLinear: '1' }, source: DBI_DEF };
    case 'linear-to-dbi':
      return { output: { gainDbi: linearToDbi(input.gainLinear) }, formula: 'G(dBi) = 10·log10(G)', units: { gainLinear: '1', gainDbi: 'dBi' }, source: DBI_DEF };
    case 'erp-to-eirp':
      return { output: { eirpW: erpToEirpW(input.erpW) }, formula: 'EIRP = ERP · 10^(2.15/10)', units: { erpW: 'W', eirpW: 'W' }, source: DIPOLE };
    case 'eirp-to-erp':
      return { output: { erpW: eirpToErpW(input.eirpW) }, formula: 'ERP = EIRP / 10^(2.15/10)', units: { eirpW: 'W', erpW: 'W' }, source: DIPOLE };
    case 'time-averaged':
      return {
        output: { timeAveragedPowerW: timeAveragedPowerW(input.peakPowerW, input.dutyCycle) },
        formula: 'P_avg = P_peak · duty cycle',
        units: { peakPowerW: 'W', dutyCycle: '1', timeAveragedPowerW: 'W' },
        source: DUTY,
      };
  }
}

export const units = defineCalculation({
  name: 'units',
  title: 'Power and gain unit conversions',
  description: 'dBm ↔ mW ↔ W, dBi ↔ linear gain, ERP ↔ EIRP (2.15 dB) and time-averaged power from a duty cycle. Choose with `conversion`.',
  input: unitsInput,
  sources: [DB_DEF, DBI_DEF, DIPOLE, DUTY],
  compute(input) {
    const row = convert(input);
    const { conversion, ...given } = input;
    const derivation: Derivation = {
      formula: row.formula,
      inputs: Object.fromEntries(Object.entries(given).map(([k, v]) => [k, q(v, row.units[k] ?? '1')])),
      intermediate:
        conversion === 'erp-to-eirp' || conversion === 'eirp-to-erp'
          ? { halfWaveDipoleGainDbi: q(HALF_WAVE_DIPOLE_GAIN_DBI, 'dBi'), halfWaveDipoleGainLinear: q(dbiToLinear(HALF_WAVE_DIPOLE_GAIN_DBI), '1') }
          : {},
      result: Object.fromEntries(Object.entries(row.output).map(([k, v]) => [k, q(v, row.units[k] ?? '1')])),
      source: row.source,
      notes: [`conversion: ${conversion}`],
    };
    return { conversion, ...row.output, derivation };
  },
});
