/**
 * System check: SAR measured with a reference dipole on a flat phantom against its target.
 *
 * Source: IEEE Std 1528-2013 / IEC/IEEE 62209-1528:2020 system check and FCC KDB 865664 D01:
 * measured 1-g / 10-g psSAR within ±10 % of the target (numerical or calibration-certificate value)
 * (IEC/IEEE 62209-1528:2020 system check and power drift and FCC KDB 865664 D01 v01r04, from memory).
 */
import { z } from 'zod';
import { defineCalculation, type WithDerivation } from '../types';
import { plainFunction } from './plain-function';
import { q } from '../types';

/** System-check tolerance, % of target [from memory]. */
export const SYSTEM_CHECK_TOLERANCE_PCT = 10;

export const systemCheckInput = z.object({
  measuredSarWPerKg: z.number().positive().describe('Measured psSAR, normalised to the same input power as the target, W/kg'),
  targetSarWPerKg: z.number().positive().describe('Target psSAR at that input power, W/kg'),
  tolerancePct: z.number().positive().default(SYSTEM_CHECK_TOLERANCE_PCT),
});

export interface SystemCheckResult {
  deviationPct: number;
  tolerancePct: number;
  pass: boolean;
}

export function computeSystemCheck(input: z.output<typeof systemCheckInput>): WithDerivation<SystemCheckResult> {
  const { measuredSarWPerKg, targetSarWPerKg, tolerancePct } = input;
  const deviationPct = ((measuredSarWPerKg - targetSarWPerKg) / targetSarWPerKg) * 100;
  const pass = Math.abs(deviationPct) <= tolerancePct;
  return {
    deviationPct,
    tolerancePct,
    pass,
    derivation: {
      formula: 'Δ% = (SAR_meas − SAR_target)/SAR_target · 100; pass when |Δ%| ≤ tol',
      inputs: {
        measuredSarWPerKg: q(measuredSarWPerKg, 'W/kg'),
        targetSarWPerKg: q(targetSarWPerKg, 'W/kg'),
        tolerancePct: q(tolerancePct, '%'),
      },
      intermediate: { ratio: q(measuredSarWPerKg / targetSarWPerKg, '1') },
      result: { deviationPct: q(deviationPct, '%'), pass: q(pass, 'boolean') },
      source: 'IEEE Std 1528-2013 / IEC/IEEE 62209-1528:2020 system check; FCC KDB 865664 D01 (±10 %)',
      notes: [
        'The ±10 % tolerance is from memory (IEC/IEEE 62209-1528:2020 system check and power drift, from memory).',
        'Both values must refer to the same input power (targets are usually normalised to 1 W).',
      ],
    },
  };
}

export type SystemCheckInput = z.input<typeof systemCheckInput>;

/** Plain function for the server: validates (applying defaults) and computes. */
export const systemCheck = plainFunction(systemCheckInput, computeSystemCheck);

export const systemCheckCalculation = defineCalculation({
  name: 'system-check',
  title: 'System check against target SAR',
  description: 'Deviation of a reference-dipole system-check SAR from its target, pass within ±10 % by default.',
  input: systemCheckInput,
  compute: computeSystemCheck,
  sources: ['IEEE Std 1528-2013', 'IEC/IEEE 62209-1528:2020', 'FCC KDB 865664 D01 v01r04'],
});
