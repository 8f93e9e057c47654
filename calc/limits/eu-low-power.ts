/**
 * EN 62479:2010 low-power exclusion: equipment whose available antenna power (or average total
 * radiated power) is at most P_max complies without further assessment, with
 * P_max = SAR_BR × m_avg (Annex A principle,
 * values from memory; 20 mW corroborated by EN 50371, secondary source). Above the SAR range of 1999/519/EC
 * and ICNIRP 1998 (10–300 GHz) the basic restriction is a power density over 20 cm², so
 * P_max = S_BR × 20 cm² (EN 62479:2010 Annex A last row, from memory). EN 62479 covers 10 MHz–300 GHz (EN 62479:2010 scope).
 */
import { z } from 'zod';
import { CalcRangeError, defineCalculation, type Derivation } from '../types';
import { q } from '../types';
import { tiers } from './exposure-limits';
import { sarLimit, sarRegimes, type SarLimit } from './sar-limits';
import { formatHz, requireInRange } from './range';
import { compareToThreshold, type Verdict } from './verdict';

const SOURCE = 'EN 62479:2010 Annex A (P_max = SAR_BR × m_avg)';
export const en62479RangeHz = { min: 10e6, max: 300e9 };

export const euLowPowerExclusionInput = z.object({
  frequencyHz: z.number().positive().describe('Frequency, Hz (EN 62479: 10 MHz–300 GHz)'),
  regime: z.enum(sarRegimes).default('eu').describe('Whose basic restriction sets SAR_BR ("eu" = 1999/519/EC general, 2013/35/EU occupational)'),
  tier: z.enum(tiers).default('general'),
  region: z.enum(['head-trunk', 'limbs']).default('head-trunk').describe('Body region of the local SAR restriction'),
  powerMw: z.number().nonnegative().optional().describe('Optional: available antenna power or average total radiated power, mW'),
});
type Input = z.output<typeof euLowPowerExclusionInput>;

// Power-density basic restriction above 10 GHz for 1999/519/EC and ICNIRP 1998: 10 W/m² (public),
// 50 W/m² (occupational), over 20 cm² (ICNIRP 1998 Table 4; 1999/519/EC Annex II; EN 62479:2010 Annex A).
const PD_BR_W_PER_M2 = { general: 10, occupational: 50 } as const;
const PD_AREA_M2 = 20e-4;
const PD_SOURCE = {
  euOccupational: 'Directive 2013/35/EU ELV 6–300 GHz (50 W/m² over 20 cm²)',
  other: '1999/519/EC Annex II / ICNIRP 1998 basic restriction 10–300 GHz (over 20 cm²)',
};

export interface EuLowPowerExclusion {
  pMaxMw: number;
  basis: 'sar' | 'power-density';
  basicRestriction: { value: number; unit: string; averaging: string };
}

/**
 * EN 62479 low-power exclusion level P_max.
 * @returns P_max in mW (SAR W/kg × mass g = mW; W/m² × m² = W)
 * @throws CalcRangeError outside 10 MHz–300 GHz or where the regime's basic restriction is not a SAR
 *   or a 20 cm² power density covered here
 */
export function euLowPowerExclusion(frequencyHz: number, regime: Input['regime'], tier: Input['tier'], region: Input['region']): EuLowPowerExclusion & { sar?: SarLimit } {
  requireInRange('frequencyHz', frequencyHz, en62479RangeHz, 'frequency', 'EN 62479:2010');
  const sarRangeMax = sarLimit(regime, tier, region).frequencyRangeHz.max;
  if (frequencyHz <= sarRangeMax) {
    const sar = sarLimit(regime, tier, region, frequencyHz);
    return {
      pMaxMw: sar.limitWPerKg * (sar.averagingMassG as number),
      basis: 'sar',
      basicRestriction: { value: sar.limitWPerKg, unit: 'W/kg', averaging: `${sar.averagingMassG} g` },
      sar,
    };
  }
  if (regime === 'eu' || regime === 'icnirp-1998') {
    const s = PD_BR_W_PER_M2[tier];
    return { pMaxMw: s * PD_AREA_M2 * 1000, basis: 'power-density', basicRestriction: { value: s, unit: 'W/m²', averaging: '20 cm²' } };
  }
  const message =
    `frequencyHz = ${formatHz(frequencyHz)} is above the ${regime} SAR range (to ${formatHz(sarRangeMax)}); ` +
    `the EN 62479 power-density case is tabulated here only for 1999/519/EC and ICNIRP 1998 (10 W/m² or 50 W/m² over 20 cm²).`;
  throw new CalcRangeError(message, [{ path: ['frequencyHz'], message }]);
}

/**
 * P_max alone, mW: the same rule as euLowPowerExclusion (which it defers to outside the tabulated
 * cases, for the same error), without the objects that describe it — the screening's band search
 * asks for it at every candidate frequency.
 */
export function euLowPowerPMaxMw(frequencyHz: number, regime: Input['regime'], tier: Input['tier'], region: Input['region']): number {
  requireInRange('frequencyHz', frequencyHz, en62479RangeHz, 'frequency', 'EN 62479:2010');
  const sar = sarLimit(regime, tier, region);
  if (frequencyHz <= sar.frequencyRangeHz.max && frequencyHz >= sar.frequencyRangeHz.min) return sar.limitWPerKg * (sar.averagingMassG as number);
  if (frequencyHz > sar.frequencyRangeHz.max && (regime === 'eu' || regime === 'icnirp-1998')) return PD_BR_W_PER_M2[tier] * PD_AREA_M2 * 1000;
  return euLowPowerExclusion(frequencyHz, regime, tier, region).pMaxMw;
}

export function computeEuLowPowerExclusion(input: Input) {
  const { frequencyHz, regime, tier, region, powerMw } = input;
  const r = euLowPowerExclusion(frequencyHz, regime, tier, region);
  const verdict: Partial<Verdict> = powerMw === undefined ? {} : compareToThreshold(powerMw, r.pMaxMw);
  const notes = [
    'P_max values are from memory (EN 62479:2010 Annex A); 20 mW (2 W/kg × 10 g) is corroborated by EN 50371 (secondary source).',
    'Compare the available antenna power or the average total radiated power.',
  ];
  if (r.sar) notes.push(...r.sar.notes);
  const derivation: Derivation = {
    formula: r.basis === 'sar' ? 'P_max = SAR_BR × m_avg (W/kg × g = mW)' : 'P_max = S_BR × A_avg (20 cm²)',
    inputs: {
      frequencyHz: q(frequencyHz, 'Hz'),
      regime: q(regime, '1'),
      tier: q(tier, '1'),
      region: q(region, '1'),
      ...(powerMw !== undefined ? { powerMw: q(powerMw, 'mW') } : {}),
    },
    intermediate:
      r.basis === 'sar'
        ? { sarBasicRestrictionWPerKg: q(r.basicRestriction.value, 'W/kg'), averagingMassG: q(r.sar?.averagingMassG ?? null, 'g') }
        : { powerDensityBasicRestrictionWPerM2: q(r.basicRestriction.value, 'W/m²'), averagingAreaM2: q(PD_AREA_M2, 'm²') },
    result: {
      pMaxMw: q(r.pMaxMw, 'mW'),
      ...(verdict.exempt !== undefined ? { excluded: q(verdict.exempt, '1'), marginDb: q(verdict.marginDb ?? null, 'dB') } : {}),
    },
    source: r.sar ? `${SOURCE}; SAR_BR from ${r.sar.source}` : `${SOURCE}; S_BR from ${PD_SOURCE[regime === 'eu' && tier === 'occupational' ? 'euOccupational' : 'other']}`,
    notes,
  };
  return {
    pMaxMw: r.pMaxMw,
    basis: r.basis,
    basicRestriction: r.basicRestriction,
    ...(verdict.exempt !== undefined ? { excluded: verdict.exempt, marginDb: verdict.marginDb } : {}),
    derivation,
  };
}

export const euLowPowerExclusionCalculation = defineCalculation({
  name: 'eu-low-power-exclusion',
  title: 'EN 62479 low-power exclusion',
  description: 'EN 62479:2010 low-power exclusion level P_max = SAR_BR × m_avg (or S_BR × 20 cm² above 10 GHz) for a regime, tier and body region.',
  input: euLowPowerExclusionInput,
  compute: computeEuLowPowerExclusion,
  sources: [SOURCE, 'Council Recommendation 1999/519/EC Annex II', 'Directive 2013/35/EU'],
});
