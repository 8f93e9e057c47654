/**
 * How a screening rule is applied over a transmitter's band.
 *
 * For one transmitter × use position × market, a regime module lists the rules that may apply, in
 * order of precedence, each with the frequency range where it applies for this combination. The
 * band is cut where a rule's range begins or ends; each piece is owned by the first rule covering
 * it (or by no rule). Every owner is evaluated at its piece's edges and at each of its
 * breakpoints inside the piece — the rules are monotone between breakpoints, so the most
 * restrictive frequency is among these candidates (calc/limits/range.ts). The row reports the
 * worst candidate: the most demanding result first (SAR evaluation, then MPE, then exempt), then
 * the smallest margin; parts of the band where no rule applies are named in the notes.
 */
import type { Derivation } from '../types';
import { inInterval, type Interval } from '../limits/range';

export type ScreeningResult = 'exempt' | 'evaluate-sar' | 'evaluate-mpe';

export const METHOD_LABELS = {
  'fcc-1mw': 'FCC 1 mW blanket exemption, 47 CFR §1.1307(b)(3)(i)(A)',
  'fcc-sar-exemption': 'FCC SAR-based exemption, 47 CFR §1.1307(b)(3)(i)(B)',
  'fcc-mpe-exemption': 'FCC MPE-based exemption, Table 1 to 47 CFR §1.1307(b)(3)(i)(C)',
  'kdb-447498-exclusion': 'FCC KDB 447498 D01 v06 §4.3.1 SAR test exclusion',
  'ised-sar-exemption': 'ISED SAR evaluation exemption, RSS-102 Issue 5 §2.5.1 Table 1',
  'ised-rf-exemption': 'ISED RF exposure evaluation exemption, RSS-102 Issue 5 §2.5.2',
  'en62479-low-power': 'EN 62479:2010 low-power exclusion with the 1999/519/EC (workers: 2013/35/EU) basic restrictions',
  'icnirp-2020-low-power': 'EN 62479 low-power principle with ICNIRP 2020 basic restrictions',
  'eu-reference-level': 'Far-field power density vs 1999/519/EC reference level (= ICNIRP 1998)',
  'icnirp-2020-reference-level': 'Far-field power density vs ICNIRP 2020 Table 5 whole-body reference level',
  'no-applicable-rule': 'No exemption rule covers this case',
} as const;
export type MethodId = keyof typeof METHOD_LABELS;

/** What a rule compares, and in which unit its threshold is. */
export type ThresholdKind = 'power-mw' | 'erp-w' | 'eirp-w' | 'power-density';

/** A rule's answer that it does not apply at this frequency, with the result that follows. */
export interface NotApplicable {
  notApplicable: string;
  result: ScreeningResult;
}

/**
 * One rule for one combination. Regime modules build hundreds per filing, so they write the
 * functions as methods (`threshold(f) { … }`), not arrow properties: under tsx (esbuild keepNames)
 * every named arrow is wrapped in an Object.defineProperty call each time it is created.
 */
export interface ScreeningRule {
  method: Exclude<MethodId, 'no-applicable-rule' | 'fcc-1mw'>;
  /** Overrides the method's standard label (e.g. which basic restriction is used). */
  methodLabel?: string;
  /** Frequencies where this rule is the one to use for this combination, Hz. */
  rangeHz: Interval;
  breakpointsHz: readonly number[];
  kind: ThresholdKind;
  /** The compared value in the threshold's unit (mW, W or W/m²). */
  evaluated: number;
  /** Which power is compared, in words (for the derivation). */
  evaluatedLabel: string;
  /** Result when the value is over the threshold. */
  failResult: ScreeningResult | ((frequencyHz: number) => ScreeningResult);
  threshold(frequencyHz: number): number | NotApplicable;
  /** The engine's own derivation of the threshold at this frequency. */
  explain(frequencyHz: number): Derivation;
  /**
   * How the rule decides at this frequency, when it states its own precision (KDB 447498 §4.3.1
   * rounding). Without it: exempt when evaluated ≤ threshold, unrounded, margin 10·log10(threshold / evaluated).
   */
  decide?(frequencyHz: number): { exempt: boolean; marginDb: number };
  /** The comparison as the rule states it, for the derivation. */
  comparisonRule?: string;
  /** KDB 447498 §4.3.2: the SAR an excluded transmitter is taken to contribute to simultaneous-transmission sums. */
  estimatedSarWPerKg?(frequencyHz: number): number;
}

/** Frequencies no rule covers: what is needed there, and why. */
export interface Uncovered {
  result(frequencyHz: number): ScreeningResult;
  reason(frequencyHz: number): string;
}

export interface Probe {
  frequencyHz: number;
  /** Index into the rule list, or -1 when no rule covers the frequency. */
  ruleIndex: number;
  threshold: number | null;
  result: ScreeningResult;
  marginDb: number | null;
  /** Why the rule (or every rule) does not apply here, when it does not. */
  reason: string | null;
}

const SEVERITY: Record<ScreeningResult, number> = { exempt: 0, 'evaluate-mpe': 1, 'evaluate-sar': 2 };

/**
 * True when probe a is the one to report over b: the more demanding result; for the same result,
 * one with a margin (a rule that applied says by how much) over one without; then the smaller margin.
 */
export function isWorse(a: Pick<Probe, 'result' | 'marginDb'>, b: Pick<Probe, 'result' | 'marginDb'>): boolean {
  if (SEVERITY[a.result] !== SEVERITY[b.result]) return SEVERITY[a.result] > SEVERITY[b.result];
  if ((a.marginDb === null) !== (b.marginDb === null)) return a.marginDb !== null;
  return a.marginDb !== null && b.marginDb !== null && a.marginDb < b.marginDb;
}

/** 10·log10(threshold / value), dB: positive = headroom. */
export const marginDb = (threshold: number, value: number): number => 10 * Math.log10(threshold / value);

export function probe(rules: readonly ScreeningRule[], ruleIndex: number, frequencyHz: number, uncovered: Uncovered): Probe {
  if (ruleIndex < 0) {
    return { frequencyHz, ruleIndex, threshold: null, result: uncovered.result(frequencyHz), marginDb: null, reason: uncovered.reason(frequencyHz) };
  }
  const rule = rules[ruleIndex];
  const t = rule.threshold(frequencyHz);
  if (typeof t !== 'number') return { frequencyHz, ruleIndex, threshold: null, result: t.result, marginDb: null, reason: t.notApplicable };
  const fail = typeof rule.failResult === 'function' ? rule.failResult(frequencyHz) : rule.failResult;
  if (rule.decide) {
    const d = rule.decide(frequencyHz);
    return { frequencyHz, ruleIndex, threshold: t, result: d.exempt ? 'exempt' : fail, marginDb: d.marginDb, reason: null };
  }
  const exempt = rule.evaluated <= t;
  return { frequencyHz, ruleIndex, threshold: t, result: exempt ? 'exempt' : fail, marginDb: marginDb(t, rule.evaluated), reason: null };
}

/** The first rule whose range holds the frequency, or -1. */
function owner(rules: readonly ScreeningRule[], frequencyHz: number): number {
  for (let i = 0; i < rules.length; i++) if (inInterval(frequencyHz, rules[i].rangeHz)) return i;
  return -1;
}

const byValue = (a: number, b: number) => a - b;
const byFrequencyThenRule = (p: Probe, r: Probe) => p.frequencyHz - r.frequencyHz || p.ruleIndex - r.ruleIndex;

/**
 * Stable insertion sort, in place, for the handful of cuts and probes of a band: the same order as
 * Array#sort (also stable), without the merge state V8 allocates for every sort call.
 */
function sortSmall<T>(xs: T[], compare: (a: T, b: T) => number): void {
  for (let i = 1; i < xs.length; i++) {
    const x = xs[i];
    let j = i - 1;
    while (j >= 0 && compare(xs[j], x) > 0) {
      xs[j + 1] = xs[j];
      j--;
    }
    xs[j + 1] = x;
  }
}

/** Adds the probe of a rule at a frequency unless it is there already. */
function addProbe(probes: Probe[], rules: readonly ScreeningRule[], ruleIndex: number, f: number, uncovered: Uncovered): void {
  // A handful of candidates per band: a linear scan beats hashing string keys.
  for (const p of probes) if (p.ruleIndex === ruleIndex && p.frequencyHz === f) return;
  probes.push(probe(rules, ruleIndex, f, uncovered));
}

/**
 * Evaluates a band [minHz, maxHz] under the rules: every candidate probe, ascending in frequency,
 * and the worst of them.
 */
export function screenBand(minHz: number, maxHz: number, rules: readonly ScreeningRule[], uncovered: Uncovered): { probes: Probe[]; worst: Probe } {
  const cuts = [minHz, maxHz];
  for (const r of rules) {
    if (r.rangeHz.min > minHz && r.rangeHz.min < maxHz) cuts.push(r.rangeHz.min);
    if (r.rangeHz.max > minHz && r.rangeHz.max < maxHz) cuts.push(r.rangeHz.max);
  }
  sortSmall(cuts, byValue);
  const probes: Probe[] = [];
  if (minHz === maxHz) {
    addProbe(probes, rules, owner(rules, minHz), minHz, uncovered);
  } else {
    for (let i = 0; i < cuts.length - 1; i++) {
      const a = cuts[i];
      const b = cuts[i + 1];
      if (a === b) continue;
      // The piece (a, b) has one owner; its closed edges are evaluated with that owner's formula.
      const ruleIndex = owner(rules, (a + b) / 2);
      addProbe(probes, rules, ruleIndex, a, uncovered);
      if (ruleIndex >= 0) {
        // Indexed: breakpoint lists come in several array kinds (literal, computed, frozen), and for…of over them allocates iterators.
        const breakpoints = rules[ruleIndex].breakpointsHz;
        for (let k = 0; k < breakpoints.length; k++) if (breakpoints[k] > a && breakpoints[k] < b) addProbe(probes, rules, ruleIndex, breakpoints[k], uncovered);
      }
      addProbe(probes, rules, ruleIndex, b, uncovered);
    }
  }
  sortSmall(probes, byFrequencyThenRule);
  let worst = probes[0];
  for (const p of probes) if (isWorse(p, worst)) worst = p;
  return { probes, worst };
}

export const UNIT: Record<ThresholdKind, string> = { 'power-mw': 'mW', 'erp-w': 'W', 'eirp-w': 'W', 'power-density': 'W/m²' };

/** Four significant figures for text. */
export const fmt = (x: number): string => `${+x.toPrecision(4)}`;

/** Default comparison of a rule that states no rounding. */
export const UNROUNDED_COMPARISON = 'compared unrounded: the rule states no rounding, so a value above the threshold by any amount is not exempt';

/** Under this |margin| a one-decimal display reads ±0.0 dB: the derivation then gives the figures in full. */
export const NEAR_THRESHOLD_DB = 0.05;
