/**
 * FCC KDB 447498 D01 General RF Exposure Guidance v06 (Oct 2015): standalone SAR test exclusion
 * (§4.3.1) and the estimated SAR of a test-excluded transmitter for simultaneous-transmission sums
 * (§4.3.2) — S: from a secondary source (filing exhibits quoting the clause), M: from memory:
 * - §4.3.1 a) [(P_mW / d_mm)·√f_GHz] ≤ 3.0 (1-g) / 7.5 (10-g extremity), 100 MHz–6 GHz, d ≤ 50 mm;
 *   d < 5 mm taken as 5 mm (§4.1 f)); power and distance rounded to mW and mm, ratio to 1 decimal (S);
 * - §4.3.1 b) beyond 50 mm: P_th(50 mm) + (d − 50 mm)·(f_MHz/150) (100–1500 MHz) or ·10 (1.5–6 GHz) (S);
 * - §4.3.1 c) below 100 MHz (S);
 * - §4.3.2 estimated SAR (P/d)·√f/7.5 (1-g) or /18.75 (10-g); 0.4 / 1.0 W/kg beyond 50 mm (M).
 * v06 exclusion was replaced by §1.1307(b)(3) for filings after June 30 2022 (FCC KDB 447498 D01 v06; FCC TCB workshop, April 2022, secondary source);
 * it remains for legacy filings and where the user chooses it.
 * One decision, kdbTestExclusion (with the clause's rounding), serves the calculator and the screening.
 */
import { z } from 'zod';
import { CalcRangeError, defineCalculation, type Derivation } from '../types';
import { q } from '../types';
import { formatM, inInterval, requireInRange, type Interval } from './range';

const SOURCE = 'FCC KDB 447498 D01 v06 §4.3.1';
const ESTIMATE_SOURCE = 'FCC KDB 447498 D01 v06 §4.3.2';

/** Frequencies where §4.3.1 is evaluated here, Hz: c) below 100 MHz down to 100 kHz, a)/b) to 6 GHz. */
export const kdbRangeHz: Interval = { min: 100e3, max: 6e9 };
/** Branch edges of §4.3.1: c) below 100 MHz, b)1) to 1500 MHz, b)2) above. */
export const kdbBreakpointsHz: readonly number[] = [100e6, 1.5e9];
/** Separations (after the 5 mm floor) where §4.3.1 is evaluated here, mm. */
export const KDB_MAX_SEPARATION_MM = 200;

export interface KdbThreshold {
  thresholdMw: number;
  branch: 'a' | 'b1' | 'b2' | 'c1' | 'c2';
  /** Distance used: rounded to the nearest mm, at least 5 mm. */
  separationUsedMm: number;
  ratioLimit: number;
}

const ratioLimitFor = (extremity: boolean) => (extremity ? 7.5 : 3.0);

/** Separation as §4.3.1 uses it: rounded to the nearest mm, then at least 5 mm (§4.1 f)). */
export function kdbSeparationMm(separationM: number): number {
  return Math.max(5, Math.round(separationM * 1000));
}

/** §4.3.1 a)/b) branch for 100 MHz ≤ f ≤ 6 GHz. */
const branchAB = (dMm: number, fMHz: number): 'a' | 'b1' | 'b2' => (dMm <= 50 ? 'a' : fMHz <= 1500 ? 'b1' : 'b2');

/** §4.3.1 a)/b) threshold for 100 MHz ≤ f ≤ 6 GHz, mW. */
function thresholdABMw(dMm: number, fMHz: number, ratioLimit: number): number {
  const fGHz = fMHz / 1000;
  const at50 = (ratioLimit * 50) / Math.sqrt(fGHz);
  if (dMm <= 50) return (ratioLimit * dMm) / Math.sqrt(fGHz);
  if (fMHz <= 1500) return at50 + (dMm - 50) * (fMHz / 150);
  return at50 + (dMm - 50) * 10;
}

/** Outside §4.3.1 as evaluated here: beyond 200 mm, or at 200 mm below 100 MHz (§4.3.1 c) reaches below 200 mm only). */
const beyondKdbSeparation = (dMm: number, fMHz: number) => dMm > KDB_MAX_SEPARATION_MM || (fMHz < 100 && dMm >= KDB_MAX_SEPARATION_MM);

/** The §4.3.1 threshold, mW, and its branch, for a frequency and separation already checked. */
function thresholdMwAt(fMHz: number, dMm: number, ratioLimit: number): number {
  if (fMHz >= 100) return thresholdABMw(dMm, fMHz, ratioLimit);
  // §4.3.1 c): the 100 MHz threshold (step b) scaled by [1 + log10(100/f_MHz)]; at d ≤ 50 mm, the
  // c)1) value at 50 mm halved.
  const scale = 1 + Math.log10(100 / fMHz);
  if (dMm > 50) return thresholdABMw(dMm, 100, ratioLimit) * scale;
  return 0.5 * thresholdABMw(50, 100, ratioLimit) * scale;
}

function branchAt(fMHz: number, dMm: number): KdbThreshold['branch'] {
  if (fMHz >= 100) return branchAB(dMm, fMHz);
  return dMm > 50 ? 'c1' : 'c2';
}

/**
 * §4.3.1 test-exclusion power threshold.
 * @param frequencyHz 100 kHz–6 GHz, Hz
 * @param separationM test separation, m (rounded to mm, floored at 5 mm, at most 200 mm)
 * @param extremity 10-g extremity SAR (ratio 7.5) instead of 1-g (3.0)
 */
export function kdbExclusionThreshold(frequencyHz: number, separationM: number, extremity = false): KdbThreshold {
  requireInRange('frequencyHz', frequencyHz, kdbRangeHz, 'frequency', SOURCE, 'Above 6 GHz SAR test exclusion does not apply (power density).');
  const dMm = kdbSeparationMm(separationM);
  const ratioLimit = ratioLimitFor(extremity);
  const fMHz = frequencyHz / 1e6;
  if (beyondKdbSeparation(dMm, fMHz)) {
    const message =
      `separationM = ${formatM(separationM)} is beyond the range of ${SOURCE}: evaluated here up to 200 mm ` +
      `(below 100 MHz: below 200 mm, §4.3.1 c)). Beyond that the device is not portable; use the MPE-based rules.`;
    throw new CalcRangeError(message, [{ path: ['separationM'], message }]);
  }
  return { thresholdMw: thresholdMwAt(fMHz, dMm, ratioLimit), branch: branchAt(fMHz, dMm), separationUsedMm: dMm, ratioLimit };
}

/**
 * Shorthand: the §4.3.1 threshold in mW. Where kdbExclusionThreshold would throw it returns null
 * (the screening's band search asks at every candidate and says why from kdbExclusionThreshold).
 */
export function kdbExclusionThresholdMwOrNull(frequencyHz: number, separationM: number, extremity = false): number | null {
  const dMm = kdbSeparationMm(separationM);
  const fMHz = frequencyHz / 1e6;
  if (!inInterval(frequencyHz, kdbRangeHz) || beyondKdbSeparation(dMm, fMHz)) return null;
  return thresholdMwAt(fMHz, dMm, ratioLimitFor(extremity));
}

/** Shorthand: the §4.3.1 threshold in mW. */
export function kdbExclusionThresholdMw(frequencyHz: number, separationM: number, extremity = false): number {
  return kdbExclusionThreshold(frequencyHz, separationM, extremity).thresholdMw;
}

/**
 * Frequencies to evaluate for a band's most restrictive §4.3.1 threshold: the branch edges and,
 * beyond 50 mm in 100–1500 MHz, the interior minimum of P_th(f) = L·50/√f_G + (d − 50)·f_MHz/150,
 * where dP/df_G = 0 gives f_G = (3.75·L / (d − 50))^(2/3).
 */
export function kdbCriticalFrequenciesHz(separationM: number, extremity = false): number[] {
  const dMm = kdbSeparationMm(separationM);
  if (dMm > 50) {
    const fGHz = ((3.75 * ratioLimitFor(extremity)) / (dMm - 50)) ** (2 / 3);
    // Strictly between the two branch edges (100 MHz, 1.5 GHz): it goes between them.
    if (fGHz > 0.1 && fGHz < 1.5) return [kdbBreakpointsHz[0], fGHz * 1e9, kdbBreakpointsHz[1]];
  }
  return [...kdbBreakpointsHz];
}

/** §4.3.1 a) test ratio with the rounding rule: P and d rounded to mW and mm, result to 1 decimal. */
export function kdbTestRatio(powerMw: number, frequencyHz: number, separationM: number): number {
  const ratio = (Math.round(powerMw) / kdbSeparationMm(separationM)) * Math.sqrt(frequencyHz / 1e9);
  return Math.round(ratio * 10) / 10;
}

/** How §4.3.1 states its comparison; said in every derivation that decides by it. */
export const KDB_COMPARISON_RULE =
  '§4.3.1 comparison: power and distance rounded to the nearest mW and mm before calculation, the a) ratio rounded to one decimal, then ratio ≤ L (a) or rounded P ≤ P_th (b, c)';

export interface KdbDecision {
  threshold: KdbThreshold;
  /** The power as §4.3.1 compares it: rounded to the nearest mW. */
  comparedPowerMw: number;
  /** §4.3.1 a) ratio, rounded to one decimal; null in branches b) and c). */
  testRatio: number | null;
  excluded: boolean;
  /**
   * Headroom at the precision the rule states, dB: 10·log10(L / ratio) in a), 10·log10(P_th / P_rounded)
   * in b) and c); when the power rounds to 0 mW, 10·log10(P_th / P). ≥ 0 exactly when excluded.
   */
  marginDb: number;
}

/**
 * The one §4.3.1 decision (KDB 447498 D01 v06 §4.3.1 a)–c) with its rounding rule): the calculator
 * and the screening both decide through it.
 * @param powerMw maximum time-averaged power incl. tune-up tolerance, mW (unrounded)
 */
export function kdbTestExclusion(powerMw: number, frequencyHz: number, separationM: number, extremity = false): KdbDecision {
  const threshold = kdbExclusionThreshold(frequencyHz, separationM, extremity);
  const comparedPowerMw = Math.round(powerMw);
  if (threshold.branch === 'a') {
    const testRatio = kdbTestRatio(powerMw, frequencyHz, separationM);
    const marginDb = testRatio > 0 ? 10 * Math.log10(threshold.ratioLimit / testRatio) : 10 * Math.log10(threshold.thresholdMw / powerMw);
    return { threshold, comparedPowerMw, testRatio, excluded: testRatio <= threshold.ratioLimit, marginDb };
  }
  const marginDb = 10 * Math.log10(threshold.thresholdMw / (comparedPowerMw > 0 ? comparedPowerMw : powerMw));
  return { threshold, comparedPowerMw, testRatio: null, excluded: comparedPowerMw <= threshold.thresholdMw, marginDb };
}

/**
 * §4.3.2 estimated SAR of a test-excluded transmitter, W/kg (FCC KDB 447498 D01 v06 §4.3.2, from memory):
 * d ≤ 50 mm: (P/d)·√f/7.5 (1-g) or /18.75 (10-g); d > 50 mm: 0.4 (1-g) or 1.0 (10-g) W/kg.
 */
export function kdbEstimatedSarWPerKg(powerMw: number, frequencyHz: number, separationM: number, extremity = false): number {
  const dMm = kdbSeparationMm(separationM);
  if (dMm > 50) return extremity ? 1.0 : 0.4;
  return ((powerMw / dMm) * Math.sqrt(frequencyHz / 1e9)) / (extremity ? 18.75 : 7.5);
}

export const kdbSarTestExclusionInput = z.object({
  frequencyHz: z.number().positive().describe('Frequency, Hz (100 kHz–6 GHz)'),
  separationM: z.number().nonnegative().describe('Test separation distance, m (< 5 mm is taken as 5 mm)'),
  extremity: z.boolean().default(false).describe('10-g extremity SAR (ratio 7.5) instead of 1-g (3.0)'),
  powerMw: z.number().nonnegative().optional().describe('Optional: maximum power of the channel incl. tune-up tolerance (time-averaged), mW'),
});

const FORMULA: Record<KdbThreshold['branch'], string> = {
  a: 'P_th = L · d / √f (from [(P/d)·√f] ≤ L; d in mm, f in GHz)',
  b1: 'P_th = L · 50 / √f + (d − 50 mm) · (f_MHz / 150)',
  b2: 'P_th = L · 50 / √f + (d − 50 mm) · 10',
  c1: 'P_th = P_th,b(d, 100 MHz) · [1 + log10(100 / f_MHz)]',
  c2: 'P_th = ½ · P_th,b(50 mm, 100 MHz) · [1 + log10(100 / f_MHz)]',
};

export function computeKdbSarTestExclusion(input: z.output<typeof kdbSarTestExclusionInput>) {
  const { frequencyHz, separationM, extremity, powerMw } = input;
  const t = kdbExclusionThreshold(frequencyHz, separationM, extremity);
  const notes = [
    'Distance rounded to the nearest mm; separations under 5 mm are taken as 5 mm (§4.1 f)).',
    'Beyond 200 mm the rule is not evaluated here (portable-device range; from memory).',
    'v06 test exclusion applies to legacy filings (superseded by §1.1307(b)(3) after June 30 2022).',
  ];
  if (t.branch === 'c1' || t.branch === 'c2') notes.push('Below 100 MHz the lower frequency bound of 100 kHz is the §1.1310 SAR range; §4.3.1 c) itself states none (interpretation).');
  if (extremity) notes.push('Extremity: the 7.5 ratio (10-g SAR) is used in every branch.');

  const fGHz = frequencyHz / 1e9;
  let testRatio: number | null = null;
  let excluded: boolean | null = null;
  let estimatedSarWPerKg: number | null = null;
  // Largest whole-mW power that is still excluded.
  let maxExcludedPowerMw: number;
  if (t.branch === 'a') {
    maxExcludedPowerMw = Math.floor(t.thresholdMw) + 1;
    while (maxExcludedPowerMw > 0 && kdbTestRatio(maxExcludedPowerMw, frequencyHz, separationM) > t.ratioLimit) maxExcludedPowerMw -= 1;
  } else {
    maxExcludedPowerMw = Math.floor(t.thresholdMw);
  }
  let marginDb: number | null = null;
  if (powerMw !== undefined) {
    const decision = kdbTestExclusion(powerMw, frequencyHz, separationM, extremity);
    testRatio = decision.testRatio;
    excluded = decision.excluded;
    marginDb = decision.marginDb;
    notes.push(`${KDB_COMPARISON_RULE}: here P = ${decision.comparedPowerMw} mW${testRatio !== null ? `, ratio ${testRatio.toFixed(1)}` : ''}.`);
    if (!excluded) notes.push('Not test-excluded: SAR must be measured; no estimated SAR is given.');
    else if (frequencyHz < 100e6) notes.push('The §4.3.2 estimate is applied here only from 100 MHz to 6 GHz.');
    else {
      estimatedSarWPerKg = kdbEstimatedSarWPerKg(powerMw, frequencyHz, separationM, extremity);
      notes.push('Estimated SAR per §4.3.2 is from memory (FCC KDB 447498 D01 v06 §4.3.2): verify before release.');
    }
  }
  const derivation: Derivation = {
    formula: FORMULA[t.branch] + `; L = ${t.ratioLimit} (${extremity ? '10-g extremity' : '1-g'})`,
    inputs: {
      frequencyHz: q(frequencyHz, 'Hz'),
      separationM: q(separationM, 'm'),
      extremity: q(extremity, '1'),
      ...(powerMw !== undefined ? { powerMw: q(powerMw, 'mW') } : {}),
    },
    intermediate: {
      fGHz: q(fGHz, 'GHz'),
      separationUsedMm: q(t.separationUsedMm, 'mm'),
      branch: q(`§4.3.1 ${t.branch[0]})${t.branch.length > 1 ? ` ${t.branch[1]})` : ''}`, '1'),
      ratioLimit: q(t.ratioLimit, '1'),
      ...(testRatio !== null ? { testRatio: q(testRatio, '1') } : {}),
    },
    result: {
      thresholdMw: q(t.thresholdMw, 'mW'),
      maxExcludedPowerMw: q(maxExcludedPowerMw, 'mW'),
      ...(excluded !== null ? { excluded: q(excluded, '1') } : {}),
      ...(marginDb !== null ? { marginDb: q(marginDb, 'dB') } : {}),
      ...(estimatedSarWPerKg !== null ? { estimatedSarWPerKg: q(estimatedSarWPerKg, 'W/kg') } : {}),
    },
    source: estimatedSarWPerKg !== null ? `${SOURCE}; ${ESTIMATE_SOURCE}` : SOURCE,
    notes,
  };
  return {
    thresholdMw: t.thresholdMw,
    separationUsedMm: t.separationUsedMm,
    ratioLimit: t.ratioLimit,
    branch: t.branch,
    maxExcludedPowerMw,
    testRatio,
    excluded,
    marginDb,
    estimatedSarWPerKg,
    derivation,
  };
}

export const kdbSarTestExclusionCalculation = defineCalculation({
  name: 'kdb-sar-test-exclusion',
  title: 'KDB 447498 SAR test exclusion',
  description:
    'FCC KDB 447498 D01 v06 §4.3.1 standalone SAR test exclusion threshold (1-g or 10-g extremity), and the §4.3.2 estimated SAR of an excluded transmitter for simultaneous-transmission sums.',
  input: kdbSarTestExclusionInput,
  compute: computeKdbSarTestExclusion,
  sources: [SOURCE, ESTIMATE_SOURCE],
});
