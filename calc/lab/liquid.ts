/**
 * Head tissue-simulating liquid (TSL): target εr and σ at a frequency, and a measured liquid
 * checked against them.
 *
 * Source: IEEE Std 1528-2013 Table 3 = IEC/IEEE 62209-1528:2020 head TSL target table, 300 MHz–6 GHz,
 * linear interpolation of εr and σ separately between adjacent entries (table note)
 * (IEC/IEEE 62209-1528:2020 tissue-simulating liquid targets and interpolation, values from memory, verify against the standard).
 * Tolerances (§4.3, M): ±5 % per parameter (IEEE 1528-2003/-2013, FCC KDB 865664 D01);
 * ±10 % (IEC 62209-1:2016, IEC/IEEE 62209-1528:2020, with SAR correction).
 */
import { z } from 'zod';
import { CalcRangeError, defineCalculation, type WithDerivation } from '../types';
import { plainFunction } from './plain-function';
import { q } from '../types';

/** [f MHz, εr, σ S/m] — IEEE 1528-2013 Table 3 / IEC/IEEE 62209-1528 head TSL targets [from memory]. */
export const HEAD_TSL_TARGETS: readonly (readonly [number, number, number])[] = [
  [300, 45.3, 0.87],
  [450, 43.5, 0.87],
  [750, 41.9, 0.89],
  [835, 41.5, 0.9],
  [900, 41.5, 0.97],
  [1450, 40.5, 1.2],
  [1500, 40.4, 1.23],
  [1640, 40.2, 1.31],
  [1750, 40.1, 1.37],
  [1800, 40.0, 1.4],
  [1900, 40.0, 1.4],
  [2000, 40.0, 1.4],
  [2100, 39.8, 1.49],
  [2300, 39.5, 1.67],
  [2450, 39.2, 1.8],
  [2600, 39.0, 1.96],
  [3000, 38.5, 2.4],
  [3500, 37.9, 2.91],
  [4000, 37.4, 3.43],
  [4500, 36.8, 3.94],
  [5000, 36.2, 4.45],
  [5200, 36.0, 4.66],
  [5400, 35.8, 4.86],
  [5600, 35.5, 5.07],
  [5800, 35.3, 5.27],
  [6000, 35.1, 5.48],
];

const HZ_PER_MHZ = 1e6;
const TABLE_MIN_HZ = HEAD_TSL_TARGETS[0][0] * HZ_PER_MHZ;
const TABLE_MAX_HZ = HEAD_TSL_TARGETS[HEAD_TSL_TARGETS.length - 1][0] * HZ_PER_MHZ;
const TABLE_SOURCE = 'IEEE Std 1528-2013 Table 3 / IEC/IEEE 62209-1528:2020 head TSL target values (linear interpolation)';

/** Liquid tolerance per standard, % of target for each of εr and σ [from memory]. */
export const LIQUID_TOLERANCE_PCT = { 'kdb-865664': 5, 'iec-ieee-62209-1528': 10 } as const;

const frequencyHz = z.number().positive().describe('Frequency, Hz (table covers 300 MHz–6 GHz)');

export const liquidTargetInput = z.object({ frequencyHz });

export interface LiquidTargetResult {
  relativePermittivity: number;
  conductivitySPerM: number;
  /** Table entries used: equal when the frequency is tabulated. */
  lowerEntryHz: number;
  upperEntryHz: number;
}

export function computeLiquidTarget(input: z.output<typeof liquidTargetInput>): WithDerivation<LiquidTargetResult> {
  const f = input.frequencyHz;
  if (f < TABLE_MIN_HZ || f > TABLE_MAX_HZ) {
    const message = `frequencyHz ${f} is outside the head TSL target table: valid range ${TABLE_MIN_HZ} Hz (300 MHz) to ${TABLE_MAX_HZ} Hz (6 GHz)`;
    throw new CalcRangeError(message, [{ path: ['frequencyHz'], message }]);
  }
  const fMHz = f / HZ_PER_MHZ;
  // Segment [f1, f2] with f1 < f ≤ f2 (or f = f1 at the table's first entry).
  const i = Math.max(
    1,
    HEAD_TSL_TARGETS.findIndex(([fe]) => fe >= fMHz),
  );
  const [f1, e1, s1] = HEAD_TSL_TARGETS[i - 1];
  const [f2, e2, s2] = HEAD_TSL_TARGETS[i];
  const t = (fMHz - f1) / (f2 - f1);
  // Written as x1·(1 − t) + x2·t so tabulated frequencies return the table value exactly.
  const relativePermittivity = e1 * (1 - t) + e2 * t;
  const conductivitySPerM = s1 * (1 - t) + s2 * t;
  const lowerEntryHz = (t === 1 ? f2 : f1) * HZ_PER_MHZ;
  const upperEntryHz = (t === 0 ? f1 : f2) * HZ_PER_MHZ;

  return {
    relativePermittivity,
    conductivitySPerM,
    lowerEntryHz,
    upperEntryHz,
    derivation: {
      formula: 'x(f) = x1 + (x2 − x1)·(f − f1)/(f2 − f1) for x = εr and σ separately',
      inputs: { frequencyHz: q(f, 'Hz') },
      intermediate: {
        f1: q(f1 * HZ_PER_MHZ, 'Hz'),
        f2: q(f2 * HZ_PER_MHZ, 'Hz'),
        epsilon1: q(e1, '1'),
        epsilon2: q(e2, '1'),
        sigma1: q(s1, 'S/m'),
        sigma2: q(s2, 'S/m'),
        t: q(t, '1'),
      },
      result: { relativePermittivity: q(relativePermittivity, '1'), conductivitySPerM: q(conductivitySPerM, 'S/m') },
      source: TABLE_SOURCE,
      notes: [
        'Target values and the interpolation rule are from memory (IEC/IEEE 62209-1528:2020 tissue-simulating liquid targets and interpolation, from memory); verify against the standard.',
        'IEC/IEEE 62209-1528 extends to 4 MHz–10 GHz; entries outside 300 MHz–6 GHz are not held here.',
      ],
    },
  };
}

export const liquidCheckInput = z.object({
  frequencyHz,
  measuredRelativePermittivity: z.number().positive(),
  measuredConductivitySPerM: z.number().positive(),
  standard: z.enum(['kdb-865664', 'iec-ieee-62209-1528']).default('kdb-865664').describe('Tolerance basis: ±5 % (IEEE 1528 / KDB 865664) or ±10 % (IEC/IEEE 62209-1528)'),
  tolerancePct: z.number().positive().optional().describe('Overrides the standard’s tolerance, % of target'),
});

export interface LiquidCheckResult {
  targetRelativePermittivity: number;
  targetConductivitySPerM: number;
  permittivityDeviationPct: number;
  conductivityDeviationPct: number;
  tolerancePct: number;
  permittivityPass: boolean;
  conductivityPass: boolean;
  pass: boolean;
}

export function computeLiquidCheck(input: z.output<typeof liquidCheckInput>): WithDerivation<LiquidCheckResult> {
  const target = computeLiquidTarget({ frequencyHz: input.frequencyHz });
  const tolerancePct = input.tolerancePct ?? LIQUID_TOLERANCE_PCT[input.standard];
  const dev = (measured: number, t: number) => ((measured - t) / t) * 100;
  const permittivityDeviationPct = dev(input.measuredRelativePermittivity, target.relativePermittivity);
  const conductivityDeviationPct = dev(input.measuredConductivitySPerM, target.conductivitySPerM);
  const permittivityPass = Math.abs(permittivityDeviationPct) <= tolerancePct;
  const conductivityPass = Math.abs(conductivityDeviationPct) <= tolerancePct;
  const pass = permittivityPass && conductivityPass;
  const notes = [...target.derivation.notes, `Tolerance ±${tolerancePct} % ${input.tolerancePct ? '(given)' : `(${input.standard}, from memory)`}.`];
  if (input.standard === 'iec-ieee-62209-1528') {
    notes.push('IEC/IEEE 62209-1528 also requires correcting the measured psSAR for the liquid deviation; that correction is not applied here.');
  }

  return {
    targetRelativePermittivity: target.relativePermittivity,
    targetConductivitySPerM: target.conductivitySPerM,
    permittivityDeviationPct,
    conductivityDeviationPct,
    tolerancePct,
    permittivityPass,
    conductivityPass,
    pass,
    derivation: {
      formula: 'Δ% = (measured − target)/target · 100; pass when |Δεr| ≤ tol and |Δσ| ≤ tol',
      inputs: {
        frequencyHz: q(input.frequencyHz, 'Hz'),
        measuredRelativePermittivity: q(input.measuredRelativePermittivity, '1'),
        measuredConductivitySPerM: q(input.measuredConductivitySPerM, 'S/m'),
        tolerancePct: q(tolerancePct, '%'),
      },
      intermediate: {
        targetRelativePermittivity: q(target.relativePermittivity, '1'),
        targetConductivitySPerM: q(target.conductivitySPerM, 'S/m'),
      },
      result: {
        permittivityDeviationPct: q(permittivityDeviationPct, '%'),
        conductivityDeviationPct: q(conductivityDeviationPct, '%'),
        pass: q(pass, 'boolean'),
      },
      source: `${TABLE_SOURCE}; tolerance: IEEE 1528-2013 / FCC KDB 865664 D01 (±5 %), IEC/IEEE 62209-1528 (±10 %)`,
      notes,
    },
  };
}

export type LiquidTargetInput = z.input<typeof liquidTargetInput>;
export type LiquidCheckInput = z.input<typeof liquidCheckInput>;

export const liquidTarget = plainFunction(liquidTargetInput, computeLiquidTarget);
export const liquidCheck = plainFunction(liquidCheckInput, computeLiquidCheck);

export const liquidTargetCalculation = defineCalculation({
  name: 'liquid-target',
  title: 'Head tissue-simulating liquid target',
  description: 'Target εr and σ of head tissue-simulating liquid at a frequency, 300 MHz–6 GHz, linear interpolation between table entries.',
  input: liquidTargetInput,
  compute: computeLiquidTarget,
  sources: ['IEEE Std 1528-2013 Table 3', 'IEC/IEEE 62209-1528:2020'],
});

export const liquidCheckCalculation = defineCalculation({
  name: 'liquid-check',
  title: 'Tissue-simulating liquid check',
  description: 'Deviation of a measured liquid’s εr and σ from the head TSL target, pass within the standard’s tolerance.',
  input: liquidCheckInput,
  compute: computeLiquidCheck,
  sources: ['IEEE Std 1528-2013', 'IEC/IEEE 62209-1528:2020', 'FCC KDB 865664 D01 v01r04'],
});
