/**
 * Measurement uncertainty budget: standard uncertainties from each contribution's distribution,
 * the combined standard uncertainty, the expanded uncertainty and the Welch–Satterthwaite
 * effective degrees of freedom.
 *
 * Sources: JCGM 100:2008 (GUM) — rectangular a/√3 (§4.3.7), triangular a/√6 (§4.3.9), normal
 * quoted as a standard uncertainty (divisor 1) or as U with coverage factor k (divisor k, §4.3.4);
 * u_c = √Σ(c_i·u_i)² (§5.1.2, eq. 10, uncorrelated inputs); U = k·u_c (§6.2);
 * ν_eff = u_c⁴ / Σ (c_i·u_i)⁴/ν_i (Annex G, eq. G.2b). U-shaped (arcsine) a/√2: JCGM 101:2008 §6.4.6
 * / EA-4/02, as used in IEEE 1528 / IEC/IEEE 62209-1528 SAR budgets. Clause numbers from memory
 * (JCGM 100:2008 (GUM) and IEC/IEEE 62209-1528:2020 uncertainty budget). Expanded-uncertainty ceiling 30 % (k = 2) for psSAR:
 * IEEE 1528-2013 / IEC/IEEE 62209-1528 / KDB 865664 [from memory, §4.4].
 */
import { MAX_TEXT_CHARS, MAX_UNCERTAINTY_COMPONENTS } from '../input-limits';
import { z } from 'zod';
import { defineCalculation, type WithDerivation } from '../types';
import { plainFunction } from './plain-function';
import { q } from '../types';
import { finiteOrNull } from './quantity';

/** Default divisors per distribution (JCGM 100:2008 §4.3.7, §4.3.9; JCGM 101 §6.4.6). */
export const DIVISORS = {
  normal: 1,
  rectangular: Math.sqrt(3),
  'u-shaped': Math.SQRT2,
  triangular: Math.sqrt(6),
} as const;

/** psSAR expanded-uncertainty ceiling, %, k = 2 (IEEE 1528-2013 / IEC/IEEE 62209-1528) [from memory]. */
export const SAR_EXPANDED_UNCERTAINTY_LIMIT_PCT = 30;

const component = z.object({
  name: z.string().min(1).max(MAX_TEXT_CHARS),
  valuePct: z.number().nonnegative().describe('Half-width a (or quoted uncertainty) of the contribution, %'),
  distribution: z.enum(['normal', 'rectangular', 'u-shaped', 'triangular']),
  divisor: z.number().positive().optional().describe('Overrides the distribution’s divisor, e.g. k = 2 for a normal U quoted at k = 2'),
  sensitivity: z.number().describe('Sensitivity coefficient c_i'),
  degreesOfFreedom: z.number().positive().nullable().optional().describe('Degrees of freedom ν_i; omit or null for infinite (Type B)'),
});

export const uncertaintyBudgetInput = z.object({
  components: z
    .array(component)
    .min(1)
    .max(MAX_UNCERTAINTY_COMPONENTS)
    .refine((list) => new Set(list.map((c) => c.name)).size === list.length, { message: 'component names must be unique' }),
  coverageFactor: z.number().positive().default(2),
  limitPct: z.number().positive().default(SAR_EXPANDED_UNCERTAINTY_LIMIT_PCT),
});

export interface BudgetComponentResult {
  name: string;
  valuePct: number;
  distribution: keyof typeof DIVISORS;
  divisor: number;
  sensitivity: number;
  standardUncertaintyPct: number;
  /** |c_i|·u_i, %. */
  contributionPct: number;
  /** null means infinite. */
  degreesOfFreedom: number | null;
}

export interface UncertaintyBudgetResult {
  components: BudgetComponentResult[];
  combinedStandardPct: number;
  coverageFactor: number;
  expandedPct: number;
  /** Welch–Satterthwaite ν_eff; null when infinite (every contribution Type B with ν = ∞) or undefined (u_c = 0). */
  effectiveDegreesOfFreedom: number | null;
  effectiveDegreesOfFreedomInfinite: boolean;
  limitPct: number;
  withinLimit: boolean;
}

export function computeUncertaintyBudget(input: z.output<typeof uncertaintyBudgetInput>): WithDerivation<UncertaintyBudgetResult> {
  const { coverageFactor, limitPct } = input;
  const components: BudgetComponentResult[] = input.components.map((c) => {
    const divisor = c.divisor ?? DIVISORS[c.distribution];
    const standardUncertaintyPct = c.valuePct / divisor; // u_i = a / divisor
    return {
      name: c.name,
      valuePct: c.valuePct,
      distribution: c.distribution,
      divisor,
      sensitivity: c.sensitivity,
      standardUncertaintyPct,
      contributionPct: Math.abs(c.sensitivity) * standardUncertaintyPct,
      degreesOfFreedom: c.degreesOfFreedom ?? null,
    };
  });

  // GUM eq. (10), uncorrelated inputs.
  const variance = components.reduce((s, c) => s + c.contributionPct ** 2, 0);
  const combinedStandardPct = Math.sqrt(variance);
  const expandedPct = coverageFactor * combinedStandardPct;

  // GUM eq. (G.2b); a term with ν_i = ∞ adds nothing to the denominator.
  const denominator = components.reduce((s, c) => (c.degreesOfFreedom === null ? s : s + c.contributionPct ** 4 / c.degreesOfFreedom), 0);
  const notes: string[] = [];
  let nuEff: number;
  if (combinedStandardPct === 0) {
    nuEff = Number.NaN;
    notes.push('Combined uncertainty is zero: effective degrees of freedom undefined (null).');
  } else {
    nuEff = denominator === 0 ? Number.POSITIVE_INFINITY : combinedStandardPct ** 4 / denominator;
    if (denominator === 0) {
      notes.push('Every contribution has infinite degrees of freedom: ν_eff is infinite, given as null (JSON has no Infinity).');
    }
  }
  const effectiveDegreesOfFreedom = finiteOrNull(nuEff);
  const withinLimit = expandedPct <= limitPct;
  notes.push(
    'GUM G.4.1: for a t-based coverage factor, truncate ν_eff to the next lower integer; this result is unrounded.',
    'Divisor values √3, √6, √2 and the GUM clause numbers are from memory (JCGM 100:2008 (GUM) and IEC/IEEE 62209-1528:2020 uncertainty budget).',
  );
  if (limitPct === SAR_EXPANDED_UNCERTAINTY_LIMIT_PCT) {
    notes.push('30 % expanded-uncertainty ceiling (k = 2) per IEEE 1528-2013 / IEC/IEEE 62209-1528 / KDB 865664 is from memory.');
  }

  return {
    components,
    combinedStandardPct,
    coverageFactor,
    expandedPct,
    effectiveDegreesOfFreedom,
    effectiveDegreesOfFreedomInfinite: nuEff === Number.POSITIVE_INFINITY,
    limitPct,
    withinLimit,
    derivation: {
      formula: 'u_i = a_i / divisor_i; u_c = √Σ(c_i·u_i)²; U = k·u_c; ν_eff = u_c⁴ / Σ((c_i·u_i)⁴/ν_i)',
      inputs: {
        ...Object.fromEntries(components.map((c) => [c.name, q(`${c.valuePct} % ${c.distribution}, divisor ${c.divisor}, c = ${c.sensitivity}`, '%')])),
        coverageFactor: q(coverageFactor, '1'),
        limitPct: q(limitPct, '%'),
      },
      intermediate: Object.fromEntries(components.map((c) => [`u(${c.name})·|c|`, q(c.contributionPct, '%')])),
      result: {
        combinedStandardPct: q(combinedStandardPct, '%'),
        expandedPct: q(expandedPct, '%'),
        effectiveDegreesOfFreedom: q(effectiveDegreesOfFreedom, '1'),
        withinLimit: q(withinLimit, 'boolean'),
      },
      source: 'JCGM 100:2008 §4.3.7, §4.3.9, §5.1.2 eq. (10), §6.2, Annex G eq. (G.2b); JCGM 101:2008 §6.4.6; IEC/IEEE 62209-1528',
      notes,
    },
  };
}

export type UncertaintyBudgetInput = z.input<typeof uncertaintyBudgetInput>;

/** Plain function for the server: validates (applying defaults) and computes. */
export const uncertaintyBudget = plainFunction(uncertaintyBudgetInput, computeUncertaintyBudget);

export const uncertaintyBudgetCalculation = defineCalculation({
  name: 'uncertainty-budget',
  title: 'Measurement uncertainty budget',
  description: 'Combined and expanded uncertainty (k = 2 by default) with Welch–Satterthwaite effective degrees of freedom, checked against the 30 % psSAR ceiling.',
  input: uncertaintyBudgetInput,
  compute: computeUncertaintyBudget,
  sources: ['JCGM 100:2008 (GUM)', 'JCGM 101:2008 §6.4.6', 'IEC/IEEE 62209-1528:2020'],
});
