/**
 * SAR limits (basic restrictions) by regime, tier and body region.
 *
 * Sources
 * - FCC: 47 CFR §1.1310(a)–(c).
 * - ISED: RSS-102 Issue 5 §4 Table 3, from Safety Code 6 (2015) (1.6 W/kg from a secondary source, the rest from memory).
 * - ICNIRP 1998 basic restrictions (ICNIRP 1998 Table 4).
 * - ICNIRP 2020 Table 2 (values from memory, averaging time and mass from a secondary source).
 * - EU: general public 1999/519/EC Annex II; occupational Directive
 *   2013/35/EU exposure limit values (Directive 2013/35/EU Annex III).
 */
import { z } from 'zod';
import { defineCalculation, type Derivation } from '../types';
import { q } from '../types';
import { tiers, type Tier } from './exposure-limits';
import { requireInRange } from './range';

export const sarRegimes = ['fcc', 'ised', 'icnirp-1998', 'icnirp-2020', 'eu'] as const;
export type SarRegime = (typeof sarRegimes)[number];
export const sarRegions = ['head-trunk', 'limbs', 'whole-body'] as const;
export type SarRegion = (typeof sarRegions)[number];

export interface SarLimit {
  limitWPerKg: number;
  /** Averaging mass in g (cube or contiguous tissue); null for the whole-body average. */
  averagingMassG: number | null;
  averagingTimeS: number;
  /** Frequency range over which this SAR restriction applies, Hz. */
  frequencyRangeHz: { min: number; max: number };
  source: string;
  notes: string[];
}

interface Entry {
  limits: Record<Tier, Record<SarRegion, number>>;
  massG: Record<Exclude<SarRegion, 'whole-body'>, number>;
  averagingMin: Record<Tier, Partial<Record<SarRegion, number>> & { default: number }>;
  rangeHz: Partial<Record<SarRegion, { min: number; max: number }>> & { default: { min: number; max: number } };
  source: Record<Tier, string>;
  notes: string[];
}

const SIX_GHZ = { min: 100e3, max: 6e9 };
const TEN_GHZ = { min: 100e3, max: 10e9 };
const ICNIRP_VALUES = {
  general: { 'head-trunk': 2, limbs: 4, 'whole-body': 0.08 },
  occupational: { 'head-trunk': 10, limbs: 20, 'whole-body': 0.4 },
};
const US_CA_VALUES = {
  general: { 'head-trunk': 1.6, limbs: 4, 'whole-body': 0.08 },
  occupational: { 'head-trunk': 8, limbs: 20, 'whole-body': 0.4 },
};

const table: Record<SarRegime, Entry> = {
  fcc: {
    limits: US_CA_VALUES,
    massG: { 'head-trunk': 1, limbs: 10 },
    averagingMin: { general: { default: 30 }, occupational: { default: 6 } },
    rangeHz: { default: SIX_GHZ },
    source: {
      general: '47 CFR §1.1310(a)–(c), general population/uncontrolled',
      occupational: '47 CFR §1.1310(a)–(c), occupational/controlled',
    },
    notes: [
      'Peak spatial-average SAR over a 1 g cube; extremities (hands, wrists, feet, ankles, pinnae) over a 10 g cube (§1.1310, 47 CFR §1.1310(a)–(c)).',
      'Averaging time ≤ 30 min (general) or ≤ 6 min (occupational).',
    ],
  },
  ised: {
    limits: US_CA_VALUES,
    massG: { 'head-trunk': 1, limbs: 10 },
    averagingMin: { general: { default: 6 }, occupational: { default: 6 } },
    rangeHz: { default: SIX_GHZ },
    source: {
      general: 'RSS-102 Issue 5 §4 Table 3, general public (uncontrolled environment), from Safety Code 6 (2015)',
      occupational: 'RSS-102 Issue 5 §4 Table 3, controlled use, from Safety Code 6 (2015)',
    },
    notes: [
      'Head, neck and trunk over 1 g; limbs over 10 g (RSS-102 Issue 5 §4 Table 3).',
      'Only 1.6 W/kg (general, 1 g) is confirmed (secondary source); the other values, the 6 min averaging time and the 100 kHz–6 GHz range are from memory.',
    ],
  },
  'icnirp-1998': {
    limits: ICNIRP_VALUES,
    massG: { 'head-trunk': 10, limbs: 10 },
    averagingMin: { general: { default: 6 }, occupational: { default: 6 } },
    rangeHz: { default: TEN_GHZ },
    source: {
      general: 'ICNIRP 1998 (Health Phys. 74(4):494–522) basic restrictions, general public',
      occupational: 'ICNIRP 1998 (Health Phys. 74(4):494–522) basic restrictions, occupational',
    },
    notes: ['Local SAR over any 10 g of contiguous tissue; SAR averaged over any 6 min; 100 kHz–10 GHz (ICNIRP 1998 Table 4).'],
  },
  'icnirp-2020': {
    limits: ICNIRP_VALUES,
    massG: { 'head-trunk': 10, limbs: 10 },
    averagingMin: { general: { 'whole-body': 30, default: 6 }, occupational: { 'whole-body': 30, default: 6 } },
    rangeHz: { 'whole-body': { min: 100e3, max: 300e9 }, default: SIX_GHZ },
    source: {
      general: 'ICNIRP 2020 (Health Phys. 118(5):483–524) Table 2, general public',
      occupational: 'ICNIRP 2020 (Health Phys. 118(5):483–524) Table 2, occupational',
    },
    notes: [
      'Whole-body SAR averaged over 30 min (100 kHz–300 GHz); local SAR over a 10 g cube and 6 min (100 kHz–6 GHz) (ICNIRP 2020 Table 2; averaging time and mass from a secondary source).',
      'The Table 2 SAR values are from memory (ICNIRP 2020 Table 2): verify before release.',
    ],
  },
  eu: {
    limits: ICNIRP_VALUES,
    massG: { 'head-trunk': 10, limbs: 10 },
    averagingMin: { general: { default: 6 }, occupational: { default: 6 } },
    rangeHz: { default: TEN_GHZ },
    source: {
      general: 'Council Recommendation 1999/519/EC Annex II basic restrictions (general public)',
      occupational: 'Directive 2013/35/EU exposure limit values (workers), 100 kHz–6 GHz',
    },
    notes: ['Local SAR over 10 g of contiguous tissue, averaged over any 6 min (1999/519/EC Annex II; Directive 2013/35/EU Annex III).'],
  },
};

function rangeFor(regime: SarRegime, tier: Tier, region: SarRegion) {
  // 2013/35/EU states its SAR exposure limit values for 100 kHz–6 GHz (Directive 2013/35/EU Annex III).
  if (regime === 'eu' && tier === 'occupational') return SIX_GHZ;
  const e = table[regime];
  return e.rangeHz[region] ?? e.rangeHz.default;
}

/**
 * SAR limit for a regime, tier and region.
 * @param frequencyHz optional; when given it must lie in the range where the SAR restriction applies
 * @throws CalcRangeError when frequencyHz is outside that range
 */
export function sarLimit(regime: SarRegime, tier: Tier, region: SarRegion, frequencyHz?: number): SarLimit {
  const e = table[regime];
  const rangeHz = rangeFor(regime, tier, region);
  if (frequencyHz !== undefined) {
    requireInRange('frequencyHz', frequencyHz, rangeHz, 'frequency', `the ${regime} SAR limits (${e.source[tier]})`, 'Outside it the limit is a power density: use exposure-limit.');
  }
  const averagingMin = e.averagingMin[tier][region] ?? e.averagingMin[tier].default;
  return {
    limitWPerKg: e.limits[tier][region],
    averagingMassG: region === 'whole-body' ? null : e.massG[region],
    averagingTimeS: averagingMin * 60,
    frequencyRangeHz: rangeHz,
    source: e.source[tier],
    notes: e.notes,
  };
}

export const sarLimitInput = z.object({
  regime: z.enum(sarRegimes).describe('"eu" = 1999/519/EC (general) or 2013/35/EU (occupational)'),
  tier: z.enum(tiers),
  region: z.enum(sarRegions),
  frequencyHz: z.number().positive().optional().describe('Optional: checks that the SAR limit applies at this frequency, Hz'),
});

export function computeSarLimit(input: z.output<typeof sarLimitInput>): SarLimit & { derivation: Derivation } {
  const { regime, tier, region, frequencyHz } = input;
  const limit = sarLimit(regime, tier, region, frequencyHz);
  const inputs: Derivation['inputs'] = { regime: q(regime, '1'), tier: q(tier, '1'), region: q(region, '1') };
  if (frequencyHz !== undefined) inputs.frequencyHz = q(frequencyHz, 'Hz');
  return {
    limitWPerKg: limit.limitWPerKg,
    averagingMassG: limit.averagingMassG,
    averagingTimeS: limit.averagingTimeS,
    frequencyRangeHz: limit.frequencyRangeHz,
    source: limit.source,
    notes: limit.notes,
    derivation: {
      formula: region === 'whole-body' ? 'SAR_WB ≤ limit (whole-body average)' : `SAR_${limit.averagingMassG}g ≤ limit (peak spatial average over ${limit.averagingMassG} g)`,
      inputs,
      intermediate: {
        frequencyRangeMinHz: q(limit.frequencyRangeHz.min, 'Hz'),
        frequencyRangeMaxHz: q(limit.frequencyRangeHz.max, 'Hz'),
      },
      result: {
        limitWPerKg: q(limit.limitWPerKg, 'W/kg'),
        averagingMassG: q(limit.averagingMassG, 'g'),
        averagingTimeS: q(limit.averagingTimeS, 's'),
      },
      source: limit.source,
      notes: limit.notes,
    },
  };
}

export const sarLimitCalculation = defineCalculation({
  name: 'sar-limit',
  title: 'SAR limit (basic restriction)',
  description: 'SAR limit and averaging mass for FCC, ISED, ICNIRP 1998, ICNIRP 2020 or the EU, by tier and body region.',
  input: sarLimitInput,
  compute: computeSarLimit,
  sources: Object.values(table).flatMap((e) => Object.values(e.source)),
});
