/**
 * ISED screening rules, RSS-102 Issue 5:
 * - §2.5.1 Table 1 SAR evaluation exemption at separations ≤ 20 cm, compared with the
 *   source-based time-averaged output power incl. tune-up, the higher of conducted power and
 *   e.i.r.p. (RSS-102 Issue 5 §2.5.1 Table 1, secondary source); limb-worn ×2.5 for the extremity kind (from memory);
 * - §2.5.2 RF exposure evaluation exemption beyond 20 cm, compared with the time-averaged
 *   e.i.r.p. (RSS-102 Issue 5 §2.5.2).
 * Issue 6 (Dec 2023) revised both tables; its values were not obtained (RSS-102 Issue 6 (Dec 2023)).
 */
import {
  computeIsedRfExemption,
  computeIsedSarExemption,
  isedRfBreakpointsHz,
  isedRfExemptionEirpW,
  isedRfRangeHz,
  isedSarExemptionMw,
  isedSarRangeHz,
  isedSarTableFrequenciesHz,
} from '../limits/ised-exemptions';
import { formatHz, formatM } from './format';
import { ISED_RULE_EDITION, RULE_SET_VERSION } from '../versions';
import { evaluateMpe, sarOrMpe, type RuleContext, type RuleSet } from './rule-set';

const TABLE_1_MAX_SEPARATION_M = 0.2;
// Texts that do not depend on the combination, built once (a filing has hundreds of ISED rows).
const RESTS_ON = `Rests on ${ISED_RULE_EDITION}: Issue 6 (15 Dec 2023) superseded it and revised the exemption limits, which are not in this rule set (${RULE_SET_VERSION}).`;
const COMPARED_EIRP = 'higher of time-averaged conducted power and e.i.r.p. (e.i.r.p.)';
const COMPARED_CONDUCTED = 'higher of time-averaged conducted power and e.i.r.p. (conducted power)';

export function isedRuleSet(ctx: RuleContext): RuleSet {
  const { separationM, powers, kind, tier } = ctx;
  const notes: string[] = [RESTS_ON];
  if (tier === 'occupational') notes.push('The RSS-102 exemption limits are set for the general public; applying them to a controlled environment is conservative.');
  if (separationM <= TABLE_1_MAX_SEPARATION_M) {
    const limbWorn = kind === 'extremity';
    const powerMw = Math.max(powers.timeAveragedPowerMw, powers.eirpMw);
    if (kind === 'far-field') notes.push(`Far-field position at ${formatM(separationM)}: RSS-102 §2.5.1 requires the SAR exemption at separations up to 20 cm; §2.5.2 applies only beyond.`);
    if (limbWorn) notes.push('Extremity: limb-worn device, Table 1 × 2.5 (10-g limit; RSS-102 Issue 5 §2.5.1 Table 1, from memory).');
    return {
      notes,
      rules: [
        {
          method: 'ised-sar-exemption',
          rangeHz: isedSarRangeHz,
          breakpointsHz: isedSarTableFrequenciesHz,
          kind: 'power-mw',
          evaluated: powerMw,
          evaluatedLabel: powers.eirpMw > powers.timeAveragedPowerMw ? COMPARED_EIRP : COMPARED_CONDUCTED,
          failResult: 'evaluate-sar',
          threshold(f) {
            return isedSarExemptionMw(f, separationM, limbWorn);
          },
          explain(f) {
            return computeIsedSarExemption({ frequencyHz: f, separationM, limbWorn, powerMw }).derivation;
          },
        },
      ],
      uncovered: {
        result: sarOrMpe,
        reason(f) {
          return f <= 6e9
            ? `RSS-102 Table 1 has no row above 5800 MHz (${formatHz(f)}): SAR evaluation`
            : `above 6 GHz RSS-102 assesses power density, and §2.5.2 applies only beyond 20 cm (${formatHz(f)})`;
        },
      },
    };
  }
  const eirpW = powers.eirpMw / 1000;
  notes.push(`Separation ${formatM(separationM)} > 20 cm: RSS-102 §2.5.2, time-averaged e.i.r.p. compared.`);
  return {
    notes,
    rules: [
      {
        method: 'ised-rf-exemption',
        rangeHz: isedRfRangeHz,
        breakpointsHz: isedRfBreakpointsHz,
        kind: 'eirp-w',
        evaluated: eirpW,
        evaluatedLabel: 'e.i.r.p. (time-averaged)',
        failResult: 'evaluate-mpe',
        threshold(f) {
          return isedRfExemptionEirpW(f, separationM);
        },
        explain(f) {
          return computeIsedRfExemption({ frequencyHz: f, separationM, eirpW }).derivation;
        },
      },
    ],
    uncovered: {
      result: evaluateMpe,
      reason(f) {
        return `${formatHz(f)} is outside RSS-102 (3 kHz–300 GHz)`;
      },
    },
  };
}
