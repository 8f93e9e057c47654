/**
 * Simultaneous transmission: sum of SAR and, when the sum is over the limit, the SAR to peak
 * location separation ratio (SPLSR) of each antenna pair.
 *
 * Source: FCC KDB 447498 D01 v06 §4.3.2 (all rows from memory):
 *   Σ SAR ≤ limit → no simultaneous-transmission measurement;
 *   otherwise SPLSR = (SAR₁ + SAR₂)^1.5 / R_i, SAR in W/kg, R_i the distance between the two
 *   peak-SAR locations in mm (√(Δx² + Δy² + Δz²)), rounded to two decimals, ≤ 0.04 for 1-g
 *   (≤ 0.10 for 10-g — reference marks that value "unsure") for every pair.
 */
import { MAX_CO_TRANSMITTERS, MAX_ID_CHARS } from '../input-limits';
import { z } from 'zod';
import { defineCalculation, type WithDerivation } from '../types';
import { plainFunction } from './plain-function';
import { q } from '../types';

/** KDB 447498 D01 v06 §4.3.2 SPLSR limits [from memory; 10-g unsure]. */
export const SPLSR_LIMIT = { '1g': 0.04, '10g': 0.1 } as const;
const MM_PER_M = 1000;

const transmitter = z.object({
  id: z.string().min(1).max(MAX_ID_CHARS),
  sarWPerKg: z.number().nonnegative().describe('Reported (or estimated) SAR of this transmitter, W/kg'),
  peakLocationM: z.tuple([z.number(), z.number(), z.number()]).optional().describe('Peak-SAR location [x, y, z] in metres, in one coordinate frame for all transmitters'),
});

export const simultaneousTransmissionInput = z.object({
  limitWPerKg: z.number().positive().describe('SAR limit the sum is held against, W/kg (e.g. 1.6 for 1-g)'),
  sarAveraging: z.enum(['1g', '10g']).default('1g').describe('Averaging mass; selects the SPLSR limit 0.04 (1g) or 0.10 (10g)'),
  transmitters: z
    .array(transmitter)
    .min(1)
    .max(MAX_CO_TRANSMITTERS)
    .refine((list) => new Set(list.map((t) => t.id)).size === list.length, { message: 'transmitter ids must be unique' }),
});

export interface SplsrPair {
  a: string;
  b: string;
  pairSumWPerKg: number;
  distanceMm: number | null;
  /** Unrounded SPLSR, (W/kg)^1.5/mm; null when it cannot be computed. */
  splsr: number | null;
  /** SPLSR rounded to two decimals, the value held against the limit. */
  splsrRounded: number | null;
  pass: boolean;
  reason: string;
}

export interface SimultaneousTransmissionResult {
  sumWPerKg: number;
  sumWithinLimit: boolean;
  splsrLimit: number;
  /** True when the sum is within the limit or every pair's SPLSR is within its limit. */
  pass: boolean;
  /** True when a simultaneous-transmission SAR measurement is needed (pass false). */
  measurementRequired: boolean;
  pairs: SplsrPair[];
}

// A top-level builder rather than a per-call closure or object spread: with 20 transmitters (190
// pairs) those were the hot spot under tsx/esbuild (keepNames wraps every closure it creates).
function pairOf(a: string, b: string, pairSumWPerKg: number, distanceMm: number | null, splsr: number | null, splsrRounded: number | null, pass: boolean, reason: string): SplsrPair {
  return { a, b, pairSumWPerKg, distanceMm, splsr, splsrRounded, pass, reason };
}

function pairResult(a: z.output<typeof transmitter>, b: z.output<typeof transmitter>, splsrLimit: number): SplsrPair {
  const pairSumWPerKg = a.sarWPerKg + b.sarWPerKg;
  const pa = a.peakLocationM;
  const pb = b.peakLocationM;
  if (!pa || !pb) {
    const missing = [a, b].filter((t) => !t.peakLocationM).map((t) => t.id);
    return pairOf(a.id, b.id, pairSumWPerKg, null, null, null, false, `peak location missing for ${missing.join(', ')}`);
  }
  const distanceMm = Math.hypot(pa[0] - pb[0], pa[1] - pb[1], pa[2] - pb[2]) * MM_PER_M;
  if (distanceMm === 0) return pairOf(a.id, b.id, pairSumWPerKg, distanceMm, null, null, false, 'peak locations coincide (R = 0): SPLSR unbounded');
  const splsr = pairSumWPerKg ** 1.5 / distanceMm;
  const splsrRounded = Math.round(splsr * 100) / 100;
  const pass = splsrRounded <= splsrLimit;
  return pairOf(a.id, b.id, pairSumWPerKg, distanceMm, splsr, splsrRounded, pass, `SPLSR ${splsrRounded.toFixed(2)} ${pass ? '≤' : '>'} ${splsrLimit}`);
}

export function computeSimultaneousTransmission(input: z.output<typeof simultaneousTransmissionInput>): WithDerivation<SimultaneousTransmissionResult> {
  const { limitWPerKg, sarAveraging, transmitters } = input;
  const splsrLimit = SPLSR_LIMIT[sarAveraging];
  const sumWPerKg = transmitters.reduce((s, t) => s + t.sarWPerKg, 0);
  const sumWithinLimit = sumWPerKg <= limitWPerKg;
  const pairs: SplsrPair[] = [];
  if (!sumWithinLimit) {
    for (let i = 0; i < transmitters.length; i++) {
      for (let j = i + 1; j < transmitters.length; j++) {
        pairs.push(pairResult(transmitters[i], transmitters[j], splsrLimit));
      }
    }
  }
  // A single transmitter over the limit has no pair to clear it.
  const pass = sumWithinLimit || (pairs.length > 0 && pairs.every((p) => p.pass));
  const notes = [
    'Rule from KDB 447498 D01 v06 §4.3.2 as recalled (from memory): verify before a filing.',
    'When the sum is over the limit, every antenna pair is held to the SPLSR limit, as the reference reads the clause.',
    'SPLSR is rounded to two decimals before comparison (KDB 447498 §4.3.2, from memory).',
  ];
  if (sarAveraging === '10g') notes.push('SPLSR limit 0.10 for 10-g SAR is from memory and marked unsure in the reference.');
  if (!sumWithinLimit && transmitters.length === 1) notes.push('A single transmitter over the limit cannot be excluded by SPLSR.');

  return {
    sumWPerKg,
    sumWithinLimit,
    splsrLimit,
    pass,
    measurementRequired: !pass,
    pairs,
    derivation: {
      formula: 'ΣSAR = Σ SAR_i ≤ SAR_limit; else per pair SPLSR = (SAR_a + SAR_b)^1.5 / R_ab[mm], R_ab = |p_a − p_b|, rounded to 0.01, ≤ SPLSR_limit',
      inputs: {
        limitWPerKg: q(limitWPerKg, 'W/kg'),
        sarAveraging: q(sarAveraging, 'mass'),
        ...Object.fromEntries(transmitters.map((t) => [`sar[${t.id}]`, q(t.sarWPerKg, 'W/kg')])),
      },
      intermediate: {
        splsrLimit: q(splsrLimit, '(W/kg)^1.5/mm'),
        pairsEvaluated: q(pairs.filter((p) => p.splsr !== null).length, 'count'),
      },
      result: {
        sumWPerKg: q(sumWPerKg, 'W/kg'),
        sumWithinLimit: q(sumWithinLimit, 'boolean'),
        pass: q(pass, 'boolean'),
      },
      source: 'FCC KDB 447498 D01 v06 §4.3.2 (sum of SAR; SAR to peak location separation ratio)',
      notes,
    },
  };
}

export type SimultaneousTransmissionInput = z.input<typeof simultaneousTransmissionInput>;

/** Plain function for the server: validates (applying defaults) and computes. */
export const simultaneousTransmission = plainFunction(simultaneousTransmissionInput, computeSimultaneousTransmission);

export const simultaneousTransmissionCalculation = defineCalculation({
  name: 'simultaneous-transmission',
  title: 'Simultaneous transmission: sum of SAR and SPLSR',
  description: 'Sums the SAR of simultaneously transmitting antennas against the limit; when over, checks each pair’s SAR to peak location separation ratio.',
  input: simultaneousTransmissionInput,
  compute: computeSimultaneousTransmission,
  sources: ['FCC KDB 447498 D01 v06 §4.3.2'],
});
