/**
 * Power drift during a SAR measurement: SAR (or power) at a reference point before and after.
 *
 * Source: IEEE Std 1528-2013 / IEC/IEEE 62209-1528:2020 and FCC KDB 865664 D01: drift within
 * ±5 % (= +0.212 dB / −0.223 dB), otherwise repeat or account for it in the uncertainty budget
 * (IEC/IEEE 62209-1528:2020 system check and power drift, from memory; FCC KDB 865664 D01 v01r04 "≈ ±0.2 dB", from memory — unsure).
 */
import { z } from 'zod';
import { defineCalculation, type WithDerivation } from '../types';
import { plainFunction } from './plain-function';
import { q } from '../types';
import { powerRatioDb } from './quantity';

/** Drift tolerance, % of the start value [from memory]. */
export const POWER_DRIFT_TOLERANCE_PCT = 5;

export const powerDriftInput = z
  .object({
    startSarWPerKg: z.number().positive().optional().describe('SAR at the reference point before the scan, W/kg'),
    endSarWPerKg: z.number().positive().optional().describe('SAR at the reference point after the scan, W/kg'),
    startPowerDb: z.number().optional().describe('Power or SAR level before the scan, dB (any fixed reference, e.g. dBm)'),
    endPowerDb: z.number().optional().describe('Power or SAR level after the scan, dB (same reference)'),
    tolerancePct: z.number().positive().lt(100).default(POWER_DRIFT_TOLERANCE_PCT),
  })
  .superRefine((v, ctx) => {
    const sar = v.startSarWPerKg !== undefined || v.endSarWPerKg !== undefined;
    const db = v.startPowerDb !== undefined || v.endPowerDb !== undefined;
    if (sar === db) {
      ctx.addIssue({
        code: 'custom',
        path: [],
        message: 'give either startSarWPerKg and endSarWPerKg, or startPowerDb and endPowerDb (one pair, not both)',
      });
      return;
    }
    const pair = sar ? (['startSarWPerKg', 'endSarWPerKg'] as const) : (['startPowerDb', 'endPowerDb'] as const);
    for (const key of pair) {
      if (v[key] === undefined) ctx.addIssue({ code: 'custom', path: [key], message: `${key} is required with ${pair.join(' and ')}` });
    }
  });

export interface PowerDriftResult {
  driftDb: number;
  driftPct: number;
  tolerancePct: number;
  /** The tolerance expressed in dB: upper = 10·log10(1 + tol), lower = 10·log10(1 − tol). */
  toleranceDb: { upper: number; lower: number };
  pass: boolean;
}

export function computePowerDrift(input: z.output<typeof powerDriftInput>): WithDerivation<PowerDriftResult> {
  const { tolerancePct } = input;
  const bySar = input.startSarWPerKg !== undefined;
  // SAR is proportional to power, so a SAR ratio is a power ratio.
  const ratio = bySar ? (input.endSarWPerKg as number) / (input.startSarWPerKg as number) : 10 ** (((input.endPowerDb as number) - (input.startPowerDb as number)) / 10);
  const driftDb = bySar ? powerRatioDb(ratio) : (input.endPowerDb as number) - (input.startPowerDb as number);
  const driftPct = (ratio - 1) * 100;
  const toleranceDb = { upper: powerRatioDb(1 + tolerancePct / 100), lower: powerRatioDb(1 - tolerancePct / 100) };
  const pass = Math.abs(driftPct) <= tolerancePct;

  return {
    driftDb,
    driftPct,
    tolerancePct,
    toleranceDb,
    pass,
    derivation: {
      formula: bySar
        ? 'drift_dB = 10·log10(SAR_end/SAR_start); drift_% = (SAR_end/SAR_start − 1)·100; pass when |drift_%| ≤ tol'
        : 'drift_dB = P_end − P_start; drift_% = (10^(drift_dB/10) − 1)·100; pass when |drift_%| ≤ tol',
      inputs: bySar
        ? { startSarWPerKg: q(input.startSarWPerKg as number, 'W/kg'), endSarWPerKg: q(input.endSarWPerKg as number, 'W/kg'), tolerancePct: q(tolerancePct, '%') }
        : { startPowerDb: q(input.startPowerDb as number, 'dB'), endPowerDb: q(input.endPowerDb as number, 'dB'), tolerancePct: q(tolerancePct, '%') },
      intermediate: {
        ratio: q(ratio, '1'),
        toleranceUpperDb: q(toleranceDb.upper, 'dB'),
        toleranceLowerDb: q(toleranceDb.lower, 'dB'),
      },
      result: { driftDb: q(driftDb, 'dB'), driftPct: q(driftPct, '%'), pass: q(pass, 'boolean') },
      source: 'IEEE Std 1528-2013 / IEC/IEEE 62209-1528:2020 power drift; FCC KDB 865664 D01 (±5 %)',
      notes: [
        'The ±5 % tolerance is from memory (IEC/IEEE 62209-1528:2020 system check and power drift, from memory); ±5 % is +0.212 dB / −0.223 dB, not a symmetric ±0.2 dB.',
        'A drift outside the tolerance means repeating the scan or accounting for it in the uncertainty budget.',
      ],
    },
  };
}

export type PowerDriftInput = z.input<typeof powerDriftInput>;

/** Plain function for the server: validates (applying defaults) and computes. */
export const powerDrift = plainFunction(powerDriftInput, computePowerDrift);

export const powerDriftCalculation = defineCalculation({
  name: 'power-drift',
  title: 'Power drift during a SAR scan',
  description: 'Drift between the reference-point SAR (or power, dB) before and after a scan, pass within ±5 % by default.',
  input: powerDriftInput,
  compute: computePowerDrift,
  sources: ['IEEE Std 1528-2013', 'IEC/IEEE 62209-1528:2020', 'FCC KDB 865664 D01 v01r04'],
});
