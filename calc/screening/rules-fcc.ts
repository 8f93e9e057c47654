/**
 * FCC screening rules:
 * - 47 CFR §1.1307(b)(3)(i)(A): available maximum time-averaged power ≤ 1 mW → exempt at any
 *   distance (wording from memory);
 * - §1.1307(b)(3)(i)(B): SAR-based threshold P_th for 0.3–6 GHz and 0.5–40 cm, compared with the
 *   greater of the time-averaged power and the ERP;
 * - Table 1 to §1.1307(b)(3)(i)(C): MPE-based ERP threshold, only at R ≥ λ/2π;
 * - KDB 447498 D01 v06 §4.3.1 SAR test exclusion (legacy, when the market chooses it), and the
 *   §4.3.2 estimated SAR of an excluded transmitter; the verdict is kdbTestExclusion's, at the
 *   precision §4.3.1 states (P and d rounded to mW and mm, the ratio to one decimal).
 */
import {
  computeFcc1mwExemption,
  computeFccMpeExemption,
  computeFccSarExemption,
  FCC_BLANKET_EXEMPTION_MW,
  fccMpeBreakpointsHz,
  fccMpeMinimumDistanceM,
  fccMpeRangeHz,
  fccMpeThresholdErpW,
  fccSarBreakpointsHz,
  fccSarRangeHz,
  fccSarSeparationRangeM,
  fccSarThresholdMw,
} from '../limits/fcc-exemptions';
import {
  computeKdbSarTestExclusion,
  KDB_MAX_SEPARATION_MM,
  kdbCriticalFrequenciesHz,
  kdbEstimatedSarWPerKg,
  kdbExclusionThreshold,
  kdbExclusionThresholdMwOrNull,
  kdbRangeHz,
  kdbSeparationMm,
  kdbTestExclusion,
  KDB_COMPARISON_RULE,
} from '../limits/kdb-447498';
import { inInterval } from '../limits/range';
import { formatHz, formatM } from './format';
import { CalcRangeError } from '../types';
import type { ScreeningResult, ScreeningRule, Uncovered } from './rule';
import { evaluateMpe, isNearBody, sarOrMpe, type RuleContext, type RuleSet } from './rule-set';

/** §1.1307(b)(3)(i)(C) ERP rule at R = separation; closer than λ/2π it does not apply. */
function mpeRule(ctx: RuleContext, whenNotApplicable: (f: number) => ScreeningResult): ScreeningRule {
  const { separationM, powers } = ctx;
  const erpW = powers.erpMw / 1000;
  return {
    method: 'fcc-mpe-exemption',
    rangeHz: fccMpeRangeHz,
    breakpointsHz: fccMpeBreakpointsHz,
    kind: 'erp-w',
    evaluated: erpW,
    evaluatedLabel: 'ERP (time-averaged)',
    failResult: 'evaluate-mpe',
    threshold(f) {
      const minimumM = fccMpeMinimumDistanceM(f);
      if (separationM < minimumM) {
        return {
          notApplicable: `R = ${formatM(separationM)} is closer than λ/2π = ${formatM(minimumM)} at ${formatHz(f)}; Table 1 to §1.1307(b)(3)(i)(C) applies only from λ/2π`,
          result: whenNotApplicable(f),
        };
      }
      return fccMpeThresholdErpW(f, separationM);
    },
    explain(f) {
      return computeFccMpeExemption({ frequencyHz: f, distanceM: separationM, erpW }).derivation;
    },
  };
}

const outsideMpeTable: (result: (f: number) => ScreeningResult) => Uncovered = (result) => ({
  result,
  reason(f) {
    return `${formatHz(f)} is outside Table 1 to §1.1307(b)(3)(i)(C) (0.3 MHz–100 GHz) and outside the SAR-based formula (0.3–6 GHz): no §1.1307(b)(3)(i) exemption applies`;
  },
});

const COMPARED_ERP = 'greater of time-averaged power and ERP (ERP)';
const COMPARED_AVERAGE = 'greater of time-averaged power and ERP (time-averaged power)';

/** (B) SAR-based rule for near-body positions within 0.5–40 cm, (C) elsewhere in frequency or distance. */
function exemptionRules(ctx: RuleContext): RuleSet {
  const { separationM, powers } = ctx;
  const notes: string[] = [];
  const rules: ScreeningRule[] = [];
  const evaluatedMw = Math.max(powers.timeAveragedPowerMw, powers.erpMw);
  const tooClose = separationM < fccSarSeparationRangeM.min;
  if (tooClose || inInterval(separationM, fccSarSeparationRangeM)) {
    // Below 0.5 cm (B) still owns 0.3–6 GHz — there (C) could not apply either (λ/2π ≥ 7.95 mm) —
    // but gives no threshold: the row names (B) and says why it is not exempt.
    const tooCloseReason = tooClose ? `separation ${formatM(separationM)} is below the 0.5 cm covered by §1.1307(b)(3)(i)(B)` : '';
    rules.push({
      method: 'fcc-sar-exemption',
      rangeHz: fccSarRangeHz,
      breakpointsHz: fccSarBreakpointsHz,
      kind: 'power-mw',
      evaluated: evaluatedMw,
      evaluatedLabel: powers.erpMw > powers.timeAveragedPowerMw ? COMPARED_ERP : COMPARED_AVERAGE,
      failResult: 'evaluate-sar',
      threshold(f) {
        return tooClose ? { notApplicable: tooCloseReason, result: 'evaluate-sar' } : fccSarThresholdMw(f, separationM);
      },
      explain(f) {
        return computeFccSarExemption({ frequencyHz: f, separationM, powerMw: evaluatedMw }).derivation;
      },
    });
  }
  if (tooClose) {
    notes.push(
      `§1.1307(b)(3)(i)(B) covers separations of 0.5–40 cm; ${formatM(separationM)} is below 0.5 cm, which the formula does not cover, so it gives no exemption here (conservative). ` +
        'Some labs evaluate such positions at 0.5 cm — common practice, not the rule text.',
    );
  } else if (separationM > fccSarSeparationRangeM.max) {
    notes.push(`§1.1307(b)(3)(i)(B) covers separations of 0.5–40 cm; at ${formatM(separationM)} the MPE-based rule (C) is used.`);
  }
  if (ctx.kind === 'extremity') notes.push('§1.1307(b)(3)(i)(B) has no separate extremity threshold: the same P_th applies.');
  // Where (C) does not apply (R < λ/2π), SAR evaluation is needed up to 6 GHz, power density above.
  rules.push(mpeRule(ctx, sarOrMpe));
  return { rules, uncovered: outsideMpeTable(sarOrMpe), notes };
}

/** KDB 447498 D01 v06 §4.3.1 test exclusion for near-body positions. */
function kdbRules(ctx: RuleContext): RuleSet {
  const { separationM, powers, kind } = ctx;
  const extremity = kind === 'extremity';
  const powerMw = powers.timeAveragedPowerMw;
  const dMm = kdbSeparationMm(separationM);
  const notes = [
    'KDB 447498 D01 v06 is the legacy procedure (superseded by §1.1307(b)(3) for filings after June 30 2022; FCC KDB 447498 D01 v06; FCC TCB workshop, April 2022); it is used because this market chose it, and it is not mixed with the §1.1307(b)(3) exemptions (so the 1 mW rule (i)(A) is not applied).',
    `Compared: maximum time-averaged power incl. tune-up, ${powerMw.toPrecision(4)} mW. ${extremity ? 'Extremity: 10-g ratio 7.5.' : '1-g ratio 3.0.'}`,
  ];
  if (separationM < 0.005) notes.push(`Separation ${formatM(separationM)} is under 5 mm: §4.1 f) takes it as 5 mm.`);
  const rules: ScreeningRule[] = [];
  const inRange = dMm <= KDB_MAX_SEPARATION_MM;
  if (inRange) {
    rules.push({
      method: 'kdb-447498-exclusion',
      rangeHz: kdbRangeHz,
      breakpointsHz: kdbCriticalFrequenciesHz(separationM, extremity),
      kind: 'power-mw',
      evaluated: powerMw,
      evaluatedLabel: 'maximum time-averaged power incl. tune-up',
      failResult: 'evaluate-sar',
      threshold(f) {
        const thresholdMw = kdbExclusionThresholdMwOrNull(f, separationM, extremity);
        if (thresholdMw !== null) return thresholdMw;
        // Outside what §4.3.1 covers here: the full function says why (and throws).
        try {
          return kdbExclusionThreshold(f, separationM, extremity).thresholdMw;
        } catch (err) {
          if (err instanceof CalcRangeError) return { notApplicable: err.message, result: 'evaluate-sar' };
          throw err;
        }
      },
      decide(f) {
        const d = kdbTestExclusion(powerMw, f, separationM, extremity);
        return { exempt: d.excluded, marginDb: d.marginDb };
      },
      comparisonRule: KDB_COMPARISON_RULE,
      explain(f) {
        return computeKdbSarTestExclusion({ frequencyHz: f, separationM, extremity, powerMw }).derivation;
      },
      estimatedSarWPerKg(f) {
        return kdbEstimatedSarWPerKg(powerMw, f, separationM, extremity);
      },
    });
  } else {
    notes.push(`Separation ${formatM(separationM)} is beyond the 200 mm evaluated by KDB 447498 §4.3.1: not a portable exposure condition; MPE evaluation is needed.`);
  }
  const uncovered: Uncovered = {
    result(f) {
      return inRange ? sarOrMpe(f) : 'evaluate-mpe';
    },
    reason(f) {
      return !inRange
        ? `KDB 447498 §4.3.1 is evaluated up to 200 mm (here ${dMm} mm)`
        : `${formatHz(f)} is outside KDB 447498 §4.3.1 (100 kHz–6 GHz here)${f > 6e9 ? '; above 6 GHz exposure is assessed as power density' : ''}`;
    },
  };
  return { rules, uncovered, notes };
}

/** Rules for one FCC combination. */
export function fccRuleSet(ctx: RuleContext): RuleSet {
  const nearBody = isNearBody(ctx.kind);
  if (nearBody && ctx.fccSarScreening === 'kdb-test-exclusion') return kdbRules(ctx);
  const set: RuleSet = nearBody
    ? exemptionRules(ctx)
    : {
        rules: [mpeRule(ctx, evaluateMpe)],
        uncovered: outsideMpeTable(evaluateMpe),
        notes: [
          `Far-field position: Table 1 to §1.1307(b)(3)(i)(C) with R = ${formatM(ctx.separationM)}, ERP compared.` +
            (ctx.fccSarScreening === 'kdb-test-exclusion' ? ' (The KDB 447498 choice concerns SAR test exclusion at near-body positions only.)' : ''),
        ],
      };
  if (ctx.tier === 'occupational') {
    set.notes.push('The §1.1307(b)(3) exemption thresholds derive from the general-population limits; applying them to an occupational market is conservative.');
  }
  const p = ctx.powers.timeAveragedPowerMw;
  if (p <= FCC_BLANKET_EXEMPTION_MW) {
    set.blanket = {
      thresholdMw: FCC_BLANKET_EXEMPTION_MW,
      evaluatedPowerMw: p,
      derivation: computeFcc1mwExemption({ powerMw: p, separationM: ctx.separationM }).derivation,
    };
  } else {
    set.notes.push(`§1.1307(b)(3)(i)(A) 1 mW exemption not met: time-averaged power ${p.toPrecision(4)} mW > 1 mW.`);
  }
  return set;
}
