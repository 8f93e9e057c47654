/**
 * EU and ICNIRP 2020 screening rules:
 * - near-body positions: the EN 62479:2010 low-power exclusion P_max = SAR_BR × m_avg (Annex A
 *   principle; EN 62479:2010 Annex A, values, from memory) with the basic restrictions of 1999/519/EC Annex II
 *   (general public; 2013/35/EU for workers) or ICNIRP 2020 Table 2 — 2 W/kg head/trunk → 20 mW,
 *   4 W/kg limbs → 40 mW (10 g); compared with the available antenna power (time-averaged
 *   conducted power);
 * - far-field positions: S = EIRP/(4πR²) (FCC OET Bulletin 65 Eq. (3), the common far-field
 *   formula) against the whole-body reference level — 1999/519/EC Annex III (= ICNIRP 1998
 *   Table 7; occupational: ICNIRP 1998 Table 6) or ICNIRP 2020 Table 5.
 */
import { computeExposureLimit, exposureLimitBreakpointsHz, exposureLimitPowerDensityWPerM2, exposureLimitRangeHz } from '../limits/exposure-limits';
import { computeEuLowPowerExclusion, en62479RangeHz, euLowPowerPMaxMw } from '../limits/eu-low-power';
import { computeFarFieldPowerDensity, farFieldPowerDensityWPerM2 } from '../limits/far-field';
import { formatHz, formatM } from './format';
import { sarLimit } from '../limits/sar-limits';
import { SPEED_OF_LIGHT_M_PER_S } from '../em/constants';
import type { Derivation } from '../types';
import type { ScreeningRegime } from './input';
import type { ScreeningRule } from './rule';
import { evaluateMpe, isNearBody, type RuleContext, type RuleSet } from './rule-set';

type EuLikeRegime = Extract<ScreeningRegime, 'eu' | 'icnirp-2020'>;

const BODY_REGION_LIMBS = 'Body region: limbs (extremity position), 4 W/kg general / 20 W/kg occupational over 10 g.';
const BODY_REGION_HEAD_TRUNK = 'Body region: head and trunk, 2 W/kg general / 10 W/kg occupational over 10 g.';
const COMPARED_AVAILABLE_POWER = 'Compared: available antenna power = time-averaged conducted power (the antenna gain does not enter EN 62479’s P_max).';

function lowPowerRuleSet(regime: EuLikeRegime, ctx: RuleContext): RuleSet {
  const { tier, kind, powers } = ctx;
  const region = kind === 'extremity' ? 'limbs' : 'head-trunk';
  const sarMaxHz = sarLimit(regime, tier, region).frequencyRangeHz.max;
  const powerMw = powers.timeAveragedPowerMw;
  // ICNIRP 2020 restricts absorbed power density above 6 GHz; EN 62479's power-density case is only
  // tabulated for 1999/519/EC / ICNIRP 1998 (calc/limits/eu-low-power.ts).
  const maxHz = regime === 'eu' ? en62479RangeHz.max : sarMaxHz;
  const rule: ScreeningRule = {
    method: regime === 'eu' ? 'en62479-low-power' : 'icnirp-2020-low-power',
    rangeHz: { min: en62479RangeHz.min, max: maxHz },
    breakpointsHz: regime === 'eu' ? [sarMaxHz] : [],
    kind: 'power-mw',
    evaluated: powerMw,
    evaluatedLabel: 'available antenna power (time-averaged conducted power)',
    failResult(f) {
      return f <= sarMaxHz ? 'evaluate-sar' : 'evaluate-mpe';
    },
    threshold(f) {
      return euLowPowerPMaxMw(f, regime, tier, region);
    },
    explain(f) {
      return computeEuLowPowerExclusion({ frequencyHz: f, regime, tier, region, powerMw }).derivation;
    },
  };
  const notes = [region === 'limbs' ? BODY_REGION_LIMBS : BODY_REGION_HEAD_TRUNK, COMPARED_AVAILABLE_POWER];
  if (regime === 'icnirp-2020') notes.push('EN 62479 principle applied with the ICNIRP 2020 basic restrictions (Table 2 values from memory, ICNIRP 2020 Table 2, from memory).');
  return {
    rules: [rule],
    notes,
    uncovered: {
      result(f) {
        return f < en62479RangeHz.min ? 'evaluate-sar' : 'evaluate-mpe';
      },
      reason(f) {
        return f < en62479RangeHz.min
          ? `EN 62479 covers 10 MHz–300 GHz (${formatHz(f)} is below)`
          : `above ${formatHz(sarMaxHz)} ICNIRP 2020 restricts absorbed power density; no low-power exclusion is tabulated for it here`;
      },
    },
  };
}

/** λ/2π, m: closer than this the far-field formula is not valid as such (common practice). */
const reactiveNearFieldM = (frequencyHz: number) => SPEED_OF_LIGHT_M_PER_S / frequencyHz / (2 * Math.PI);

function referenceLevelRuleSet(regime: EuLikeRegime, ctx: RuleContext): RuleSet {
  const { tier, separationM, powers } = ctx;
  const limitRegime = regime === 'eu' ? 'icnirp-1998' : 'icnirp-2020';
  const eirpW = powers.eirpMw / 1000;
  const powerDensityWPerM2 = farFieldPowerDensityWPerM2(eirpW, separationM);
  const range = exposureLimitRangeHz(limitRegime, tier);
  const rule: ScreeningRule = {
    method: regime === 'eu' ? 'eu-reference-level' : 'icnirp-2020-reference-level',
    rangeHz: { min: range.minHz, max: range.maxHz },
    breakpointsHz: exposureLimitBreakpointsHz(limitRegime, tier),
    kind: 'power-density',
    evaluated: powerDensityWPerM2,
    evaluatedLabel: `far-field power density S = EIRP/(4πR²) at R = ${formatM(separationM)}`,
    failResult: 'evaluate-mpe',
    threshold(f) {
      const nearM = reactiveNearFieldM(f);
      if (separationM < nearM) {
        return {
          notApplicable: `R = ${formatM(separationM)} is closer than λ/2π = ${formatM(nearM)} at ${formatHz(f)}: the far-field formula is not valid there (common practice)`,
          result: 'evaluate-mpe',
        };
      }
      const s = exposureLimitPowerDensityWPerM2(f, limitRegime, tier);
      if (s === null) return { notApplicable: `no power-density reference level at ${formatHz(f)}: E and H must be assessed`, result: 'evaluate-mpe' };
      return s;
    },
    explain(f): Derivation {
      const field = computeFarFieldPowerDensity({ eirpW, distanceM: separationM }).derivation;
      const limit = computeExposureLimit({ frequencyHz: f, regime: limitRegime, tier, exposure: 'whole-body' }).derivation;
      return {
        formula: `${field.formula}; compared with S_RL: ${limit.formula}`,
        inputs: { ...field.inputs, ...limit.inputs },
        intermediate: { ...field.intermediate, ...field.result, ...limit.intermediate },
        result: { referenceLevelWPerM2: limit.result.powerDensityWPerM2, powerDensityWPerM2: field.result.powerDensityWPerM2 },
        source: `${field.source}; ${limit.source}`,
        notes: [...field.notes, ...limit.notes],
      };
    },
  };
  const notes = [
    regime === 'eu'
      ? '1999/519/EC Annex III reference levels are those of ICNIRP 1998 (general public; occupational: ICNIRP 1998 Table 6, whose power densities 2013/35/EU action levels share above 2 GHz).'
      : 'ICNIRP 2020 Table 5 whole-body reference levels (values from memory).',
    'Margin = 10·log10(S_RL / S).',
  ];
  return {
    rules: [rule],
    notes,
    uncovered: {
      result: evaluateMpe,
      reason(f) {
        return `${formatHz(f)} is outside the reference-level table (${formatHz(range.minHz)}–${formatHz(range.maxHz)})`;
      },
    },
  };
}

export function euLikeRuleSet(regime: EuLikeRegime, ctx: RuleContext): RuleSet {
  return isNearBody(ctx.kind) ? lowPowerRuleSet(regime, ctx) : referenceLevelRuleSet(regime, ctx);
}
