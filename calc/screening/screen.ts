/**
 * Screening of a whole device: for every transmitter × use position × market, the rule that
 * applies, the evaluated power, the threshold at the band's most restrictive frequency, the result
 * (exempt / evaluate SAR / evaluate MPE) and the margin in dB, each with its derivation.
 * A transmitter with several antennas (MIMO or switched) is evaluated at every antenna, each with
 * its own gain and separation, and the row reports the least favourable antenna (worst result,
 * then smallest margin) and names it; MIMO streams on one band add their powers (power.ts).
 * In a use position where a transmitter has a reduced power (a power mode: hotspot back-off,
 * proximity sensor, time-averaged SAR limit), that power is screened and the row names the mode.
 * Combinations that cannot be screened (no separation given for an antenna of the transmitter)
 * are listed as gaps, never guessed.
 */
import type { Derivation, Quantity } from '../types';
import { q } from '../types';
import { formatHz } from './format';
import {
  antennasOf,
  powerModeOf,
  streamsOf,
  type PowerModeTrigger,
  type ScreeningInput,
  type ScreeningMarket,
  type ScreeningRegime,
  type ScreeningTransmitter,
  type ScreeningUsePosition,
  type UsePositionKind,
} from './input';
import { evaluatedPowers, withPowerMode, type EvaluatedPowers } from './power';
import {
  fmt,
  isWorse,
  METHOD_LABELS,
  NEAR_THRESHOLD_DB,
  screenBand,
  UNIT,
  UNROUNDED_COMPARISON,
  type MethodId,
  type Probe,
  type ScreeningResult,
  type ScreeningRule,
  type ThresholdKind,
} from './rule';
import type { RuleContext, RuleSet } from './rule-set';
import { fccRuleSet } from './rules-fcc';
import { isedRuleSet } from './rules-ised';
import { euLikeRuleSet } from './rules-eu';
import { ISED_PROVISIONAL_REASON, ruleSetWarnings, type RuleSetWarning } from '../versions';
import { moduleConditionWarnings, type ModuleConditionWarning } from './module-conditions';

export const SCREENING_CAUTIONS = [
  'Screening results are estimates from the published formulas; where the rules require measurement, only an accredited laboratory’s measurement counts.',
  'The certifying body decides; follow the applicable regulations.',
];

export interface ScreeningCandidate {
  frequencyHz: number;
  method: MethodId;
  threshold: number | null;
  thresholdUnit: string | null;
  marginDb: number | null;
  result: ScreeningResult;
  note: string | null;
}

export interface ScreeningRow {
  transmitterId: string;
  usePositionId: string;
  usePositionKind: UsePositionKind;
  regime: ScreeningRegime;
  tier: ScreeningMarket['tier'];
  method: MethodId;
  methodLabel: string;
  /** The band's most restrictive frequency (the candidate reported), Hz. */
  frequencyHz: number;
  separationM: number;
  /** The antenna this row was evaluated at: for a transmitter with several, the least favourable one. */
  antennaId: string;
  /** How many antennas the transmitter uses (each was evaluated; see the derivation's notes). */
  antennaCount: number;
  /** The power the row screened: 'full' (the maximum tune-up power) or the trigger of this position's reduced power. */
  powerMode: ScreeningPowerModeName;
  /** The power the rule compares (time-averaged power, the greater of it and ERP, ERP, or EIRP), mW. */
  evaluatedPowerMw: number;
  evaluatedQuantity: string;
  powers: { tuneUpPowerMw: number; timeAveragedPowerMw: number; eirpMw: number; erpMw: number };
  thresholdMw: number | null;
  thresholdErpW: number | null;
  thresholdEirpW: number | null;
  thresholdPowerDensityWPerM2: number | null;
  evaluatedPowerDensityWPerM2: number | null;
  result: ScreeningResult;
  /** 10·log10(threshold / evaluated), dB (power density: limit / S); null when no threshold applies. */
  marginDb: number | null;
  /** KDB 447498 §4.3.2 estimated SAR of a test-excluded transmitter (highest over the band), W/kg. */
  estimatedSarWPerKg: number | null;
  /** True when the result stands on a rule set known to be superseded (ISED exempt on RSS-102 Issue 5). */
  provisional: boolean;
  /** Why the result is provisional; null when it is not. */
  provisionalReason: string | null;
  candidates: ScreeningCandidate[];
  derivation: Derivation;
}

/** A row's power mode: the maximum tune-up power, or a reduced one named by its trigger. */
export type ScreeningPowerModeName = 'full' | PowerModeTrigger;

export interface ScreeningGap {
  transmitterId: string;
  usePositionId: string;
  message: string;
}

export interface ScreeningCounts {
  combinations: number;
  exempt: number;
  evaluateSar: number;
  evaluateMpe: number;
  needsEvaluation: number;
}

export interface ScreeningSummary {
  byRegime: Partial<Record<ScreeningRegime, ScreeningCounts>>;
  total: ScreeningCounts;
  gaps: number;
}

export interface ScreeningOutput {
  rows: ScreeningRow[];
  gaps: ScreeningGap[];
  /** Rule-set warnings for the markets screened (e.g. Canada on RSS-102 Issue 5). */
  warnings: RuleSetWarning[];
  /** Use positions closer than a certified module's grant allows (host with a module inside). */
  conditions: ModuleConditionWarning[];
  summary: ScreeningSummary;
  derivation: Derivation;
}

function ruleSetFor(market: ScreeningMarket, ctx: RuleContext): RuleSet {
  switch (market.regime) {
    case 'fcc':
      return fccRuleSet(ctx);
    case 'ised':
      return isedRuleSet(ctx);
    case 'eu':
    case 'icnirp-2020':
      return euLikeRuleSet(market.regime, ctx);
  }
}

const emptyCounts = (): ScreeningCounts => ({ combinations: 0, exempt: 0, evaluateSar: 0, evaluateMpe: 0, needsEvaluation: 0 });

/** Counts per regime and in total. Regimes listed in `regimes` appear even with no rows. */
export function summarizeScreening(rows: readonly Pick<ScreeningRow, 'regime' | 'result'>[], gaps: readonly unknown[] = [], regimes: readonly ScreeningRegime[] = []): ScreeningSummary {
  const byRegime: Partial<Record<ScreeningRegime, ScreeningCounts>> = {};
  for (const r of regimes) byRegime[r] = emptyCounts();
  const total = emptyCounts();
  for (const row of rows) {
    count(total, row.result);
    count((byRegime[row.regime] ??= emptyCounts()), row.result);
  }
  return { byRegime, total, gaps: gaps.length };
}

function count(counts: ScreeningCounts, result: ScreeningResult): void {
  counts.combinations++;
  if (result === 'exempt') counts.exempt++;
  else {
    counts.needsEvaluation++;
    if (result === 'evaluate-sar') counts.evaluateSar++;
    else counts.evaluateMpe++;
  }
}

const THRESHOLD_FIELD: Record<ThresholdKind, 'thresholdMw' | 'thresholdErpW' | 'thresholdEirpW' | 'thresholdPowerDensityWPerM2'> = {
  'power-mw': 'thresholdMw',
  'erp-w': 'thresholdErpW',
  'eirp-w': 'thresholdEirpW',
  'power-density': 'thresholdPowerDensityWPerM2',
};

/** The compared power in mW (ERP/EIRP rules compare W; power-density rules start from the EIRP). */
function evaluatedMw(rule: ScreeningRule, powers: EvaluatedPowers): number {
  if (rule.kind === 'power-mw') return rule.evaluated;
  if (rule.kind === 'erp-w') return powers.erpMw;
  return powers.eirpMw;
}

/**
 * Derivation inputs that many rows of one screening show (a transmitter's band, a market's regime):
 * built once per screening and shared between its rows, as the powers' quantities already are.
 */
interface SharedInputs {
  antennaId: Quantity;
  frequencyMinHz: Quantity;
  frequencyMaxHz: Quantity;
  separationM: Quantity;
  usePositionKind: Quantity;
  regime: Quantity;
  tier: Quantity;
}

interface Combination {
  tx: ScreeningTransmitter;
  position: ScreeningUsePosition;
  market: ScreeningMarket;
  antennaId: string;
  antennaCount: number;
  separationM: number;
  powers: EvaluatedPowers;
  powerMode: ScreeningPowerModeName;
  shared: SharedInputs;
  /** The transmitter's band note by reported frequency (the same text for each of its positions and markets). */
  bandNotes: Map<number, string>;
}

function rowInputs(c: Combination): Record<string, Quantity> {
  const p = c.powers.inputs;
  const s = c.shared;
  const inputs: Record<string, Quantity> = { maxTuneUpPowerDbm: p.maxTuneUpPowerDbm, dutyCycle: p.dutyCycle };
  if (p.reducedTuneUpPowerDbm) {
    inputs.reducedTuneUpPowerDbm = p.reducedTuneUpPowerDbm;
    inputs.powerMode = p.powerMode;
  }
  inputs.antennaGainDbi = p.antennaGainDbi;
  inputs.antennaId = s.antennaId;
  if (p.mimoStreams) inputs.mimoStreams = p.mimoStreams;
  inputs.frequencyMinHz = s.frequencyMinHz;
  inputs.frequencyMaxHz = s.frequencyMaxHz;
  inputs.separationM = s.separationM;
  inputs.usePositionKind = s.usePositionKind;
  inputs.regime = s.regime;
  inputs.tier = s.tier;
  return inputs;
}

type RowVerdict = Pick<ScreeningRow, 'method' | 'methodLabel' | 'frequencyHz' | 'evaluatedPowerMw' | 'evaluatedQuantity' | 'result' | 'marginDb' | 'candidates'>;

/** One literal with every field (a spread-then-extend literal is several times slower in V8, and there are 480 rows per filing). */
function newRow(c: Combination, v: RowVerdict): ScreeningRow {
  const { powers } = c;
  return {
    transmitterId: c.tx.id,
    usePositionId: c.position.id,
    usePositionKind: c.position.kind,
    regime: c.market.regime,
    tier: c.market.tier,
    method: v.method,
    methodLabel: v.methodLabel,
    frequencyHz: v.frequencyHz,
    separationM: c.separationM,
    antennaId: c.antennaId,
    antennaCount: c.antennaCount,
    powerMode: c.powerMode,
    evaluatedPowerMw: v.evaluatedPowerMw,
    evaluatedQuantity: v.evaluatedQuantity,
    powers: { tuneUpPowerMw: powers.tuneUpPowerMw, timeAveragedPowerMw: powers.timeAveragedPowerMw, eirpMw: powers.eirpMw, erpMw: powers.erpMw },
    thresholdMw: null,
    thresholdErpW: null,
    thresholdEirpW: null,
    thresholdPowerDensityWPerM2: null,
    evaluatedPowerDensityWPerM2: null,
    result: v.result,
    marginDb: v.marginDb,
    estimatedSarWPerKg: null,
    provisional: false,
    provisionalReason: null,
    candidates: v.candidates,
    derivation: EMPTY_DERIVATION,
  };
}

const EMPTY_DERIVATION: Derivation = { formula: '', inputs: {}, intermediate: {}, result: {}, source: '', notes: [] };

function blanketRow(c: Combination, set: RuleSet): PendingRow {
  const b = set.blanket!;
  const marginDb = 10 * Math.log10(b.thresholdMw / b.evaluatedPowerMw);
  const d = b.derivation;
  const row = newRow(c, {
    method: 'fcc-1mw',
    methodLabel: METHOD_LABELS['fcc-1mw'],
    frequencyHz: c.tx.frequencyMinHz,
    evaluatedPowerMw: b.evaluatedPowerMw,
    evaluatedQuantity: 'time-averaged power',
    result: 'exempt',
    marginDb,
    candidates: [],
  });
  row.thresholdMw = b.thresholdMw;
  row.derivation = {
    formula: `${c.powers.formula}; ${d.formula}`,
    inputs: rowInputs(c),
    intermediate: Object.assign({}, c.powers.intermediate, d.intermediate),
    result: { result: q('exempt', 'text'), thresholdMw: q(b.thresholdMw, 'mW'), marginDb: q(marginDb, 'dB') },
    source: d.source,
    notes: [...c.powers.notes, '§1.1307(b)(3)(i)(A) does not depend on frequency or separation: the band is not searched (frequencyHz reports its lower edge).', ...d.notes],
  };
  return { row, band: null };
}

/** A row whose derivation is not built yet: only the reported antenna's is (finishRow). */
interface PendingRow {
  row: ScreeningRow;
  /** What bandDerivation needs; null for a row whose derivation is already there (the 1 mW exemption). */
  band: { c: Combination; set: RuleSet; worst: Probe; probes: Probe[] } | null;
}

function bandRow(c: Combination, set: RuleSet): PendingRow {
  const { rules, uncovered } = set;
  const { probes, worst } = screenBand(c.tx.frequencyMinHz, c.tx.frequencyMaxHz, rules, uncovered);
  const rule = worst.ruleIndex >= 0 ? rules[worst.ruleIndex] : null;
  const method: MethodId = rule ? rule.method : 'no-applicable-rule';
  const candidates: ScreeningCandidate[] = probes.map((p) => {
    const r = p.ruleIndex >= 0 ? rules[p.ruleIndex] : null;
    return {
      frequencyHz: p.frequencyHz,
      method: r ? r.method : 'no-applicable-rule',
      threshold: p.threshold,
      thresholdUnit: r && p.threshold !== null ? UNIT[r.kind] : null,
      marginDb: p.marginDb,
      result: p.result,
      note: p.reason,
    };
  });
  const row = newRow(c, {
    method,
    methodLabel: rule?.methodLabel ?? METHOD_LABELS[method],
    frequencyHz: worst.frequencyHz,
    evaluatedPowerMw: rule ? evaluatedMw(rule, c.powers) : c.powers.timeAveragedPowerMw,
    evaluatedQuantity: rule ? rule.evaluatedLabel : 'time-averaged power',
    result: worst.result,
    marginDb: worst.marginDb,
    candidates,
  });
  if (rule) {
    if (worst.threshold !== null) row[THRESHOLD_FIELD[rule.kind]] = worst.threshold;
    if (rule.kind === 'power-density') row.evaluatedPowerDensityWPerM2 = rule.evaluated;
  }
  if (worst.result === 'exempt') {
    // §4.3.2: the highest estimate over the band, for the simultaneous-transmission sum.
    for (const p of probes) {
      const r = p.ruleIndex >= 0 ? rules[p.ruleIndex] : null;
      if (r?.estimatedSarWPerKg) row.estimatedSarWPerKg = Math.max(row.estimatedSarWPerKg ?? 0, r.estimatedSarWPerKg(p.frequencyHz));
    }
  }
  if (c.market.regime === 'ised' && worst.result === 'exempt') {
    row.provisional = true;
    row.provisionalReason = ISED_PROVISIONAL_REASON;
  }
  return { row, band: { c, set, worst, probes } };
}

/** How the band was searched and which frequency is reported. */
function bandNote(c: Combination, frequencyHz: number): string {
  let note = c.bandNotes.get(frequencyHz);
  if (note === undefined) {
    note =
      c.tx.frequencyMinHz === c.tx.frequencyMaxHz
        ? `Single frequency ${formatHz(frequencyHz)}.`
        : `Band ${formatHz(c.tx.frequencyMinHz)}–${formatHz(c.tx.frequencyMaxHz)} evaluated at both edges and every breakpoint of the rule inside it; reported: ${formatHz(frequencyHz)}, the most restrictive (worst result, then smallest margin).`;
    c.bandNotes.set(frequencyHz, note);
  }
  return note;
}

/** How the verdict compares, by kind of rule (the texts do not depend on the row). */
const VERDICT_UNROUNDED = `exempt if evaluated ≤ threshold, ${UNROUNDED_COMPARISON}; margin = 10·log10(threshold / evaluated) dB`;
const VERDICT_UNROUNDED_DENSITY = `exempt if S ≤ S_RL, ${UNROUNDED_COMPARISON}; margin = 10·log10(threshold / evaluated) dB`;
const VERDICT_NO_FORMULA = 'no exemption formula applies: not exempt';

function bandDerivation(c: Combination, set: RuleSet, row: ScreeningRow, worst: Probe, probes: Probe[]): Derivation {
  const rule = worst.ruleIndex >= 0 ? set.rules[worst.ruleIndex] : null;
  // The engine's own derivation of the threshold, merged into the row's.
  const rd = rule && worst.threshold !== null ? rule.explain(worst.frequencyHz) : null;
  const unit = rule ? UNIT[rule.kind] : null;
  const notes = [...c.powers.notes, ...set.notes];
  notes.push(bandNote(c, row.frequencyHz));
  // The other results in the band, each once, in the order first met.
  const others: ScreeningResult[] = [];
  for (const p of probes) if (p.result !== worst.result && !others.includes(p.result)) others.push(p.result);
  if (others.length) notes.push(`Other parts of the band give: ${others.join(', ')} (see candidates).`);
  if (worst.reason) notes.push(`Not exempt: ${worst.reason}.`);
  if (row.provisionalReason) notes.push(row.provisionalReason);
  // Parts of the band under another rule (or none) that did not apply: say why, once per rule.
  const told = [worst.ruleIndex];
  for (const p of probes) {
    if (!p.reason || told.includes(p.ruleIndex)) continue;
    notes.push(`Elsewhere in the band: ${p.reason}.`);
    told.push(p.ruleIndex);
  }
  if (row.estimatedSarWPerKg !== null) notes.push(`Estimated SAR for simultaneous-transmission sums (KDB 447498 §4.3.2, from memory M): ${fmt(row.estimatedSarWPerKg)} W/kg.`);
  if (rd) notes.push(...rd.notes);
  if (rule && worst.threshold !== null) {
    const comparison = rule.comparisonRule ?? UNROUNDED_COMPARISON;
    if (worst.marginDb !== null && Math.abs(worst.marginDb) < NEAR_THRESHOLD_DB) {
      notes.push(
        `At the threshold: evaluated ${rule.evaluated.toPrecision(9)} ${unit} against ${worst.threshold.toPrecision(9)} ${unit}, margin ${worst.marginDb.toPrecision(3)} dB — ${comparison}; result ${worst.result}.`,
      );
    }
  }
  const intermediate = Object.assign({}, c.powers.intermediate);
  intermediate.evaluatedQuantity = q(row.evaluatedQuantity, 'text');
  if (rule) intermediate.evaluatedValue = q(rule.evaluated, unit as string);
  intermediate.mostRestrictiveFrequencyHz = q(row.frequencyHz, 'Hz');
  // Each candidate's threshold, margin and result are in row.candidates.
  let frequencies = `${probes[0].frequencyHz}`;
  for (let i = 1; i < probes.length; i++) frequencies += `, ${probes[i].frequencyHz}`;
  intermediate.candidateFrequenciesHz = q(frequencies, 'Hz');
  if (rd) Object.assign(intermediate, rd.inputs, rd.intermediate);
  const result = rd ? Object.assign({}, rd.result) : {};
  result.result = q(row.result, 'text');
  if (worst.threshold !== null && rule) result.threshold = q(worst.threshold, unit as string);
  result.marginDb = q(row.marginDb, 'dB');
  if (row.estimatedSarWPerKg !== null) result.estimatedSarWPerKg = q(row.estimatedSarWPerKg, 'W/kg');
  const verdict =
    rule && worst.threshold !== null
      ? rule.comparisonRule
        ? `exempt by the ${rule.comparisonRule}; margin at that precision, dB`
        : rule.kind === 'power-density'
          ? VERDICT_UNROUNDED_DENSITY
          : VERDICT_UNROUNDED
      : VERDICT_NO_FORMULA;
  return {
    formula: `${c.powers.formula}; ${rd ? rd.formula : row.methodLabel}; ${verdict}`,
    inputs: rowInputs(c),
    intermediate,
    result,
    source: rd ? rd.source : rule ? METHOD_LABELS[rule.method] : 'no rule applies (see notes)',
    notes,
  };
}

function gapMessage(tx: ScreeningTransmitter, position: ScreeningUsePosition, missing: string[]): string {
  if (missing.length === 1) return `Use position "${position.id}" gives no separation for antenna "${missing[0]}" of transmitter "${tx.id}": add one to screen this combination.`;
  return `Use position "${position.id}" gives no separation for antennas ${missing.map((a) => `"${a}"`).join(', ')} of transmitter "${tx.id}": add them to screen this combination.`;
}

/**
 * The least favourable of a transmitter's antennas: the more demanding result; then one no
 * formula gives a margin for (e.g. closer than a rule covers); then the smaller margin; then the
 * closer antenna. Equal on all counts: the first listed stays.
 */
function antennaWorse(a: ScreeningRow, b: ScreeningRow): boolean {
  if (a.result !== b.result) return isWorse(a, b);
  if ((a.marginDb === null) !== (b.marginDb === null)) return a.marginDb === null;
  if (a.marginDb !== null && b.marginDb !== null && a.marginDb !== b.marginDb) return a.marginDb < b.marginDb;
  return a.separationM < b.separationM;
}

const RESULT_WORDS: Record<ScreeningResult, string> = { exempt: 'exempt', 'evaluate-sar': 'SAR evaluation needed', 'evaluate-mpe': 'MPE evaluation needed' };
const marginWords = (r: ScreeningRow) => `${r.antennaId} at ${fmt(r.separationM * 1000)} mm: ${RESULT_WORDS[r.result]}${r.marginDb === null ? '' : `, margin ${r.marginDb.toFixed(2)} dB`}`;

/** Screens every transmitter × use position × market of a validated input. */
export function screenParsed(input: ScreeningInput): ScreeningOutput {
  const gainById = new Map(input.antennas.map((a) => [a.id, a.gainDbi]));
  const rows: ScreeningRow[] = [];
  const gaps: ScreeningGap[] = [];
  const marketInputs = input.markets.map((m) => ({ regime: q(m.regime, 'text'), tier: q(m.tier, 'text') }));
  const kindInputs = input.usePositions.map((p) => q(p.kind, 'text'));
  for (const tx of input.transmitters) {
    const antennas = antennasOf(tx);
    const streams = streamsOf(tx);
    const fullPowers = antennas.map((a) => evaluatedPowers(tx.maxTuneUpPowerDbm, tx.dutyCycle, gainById.get(a) as number, streams));
    const antennaInputs = antennas.map((a) => q(a, 'text'));
    const frequencyMinHz = q(tx.frequencyMinHz, 'Hz');
    const frequencyMaxHz = q(tx.frequencyMaxHz, 'Hz');
    const bandNotes = new Map<number, string>();
    for (let positionIndex = 0; positionIndex < input.usePositions.length; positionIndex++) {
      const position = input.usePositions[positionIndex];
      const mode = powerModeOf(position, tx.id);
      const powersOf = mode
        ? antennas.map((a) => withPowerMode(evaluatedPowers(mode.reducedTuneUpPowerDbm, tx.dutyCycle, gainById.get(a) as number, streams), tx.maxTuneUpPowerDbm, mode))
        : fullPowers;
      const powerMode: ScreeningPowerModeName = mode ? mode.trigger : 'full';
      const seps = antennas.map((a) => position.separations.find((s) => s.antennaId === a));
      const missing = antennas.filter((_, k) => !seps[k]);
      if (missing.length) {
        gaps.push({ transmitterId: tx.id, usePositionId: position.id, message: gapMessage(tx, position, missing) });
        continue;
      }
      const separationInputs = seps.map((s) => q(s!.separationM, 'm'));
      for (let marketIndex = 0; marketIndex < input.markets.length; marketIndex++) {
        const market = input.markets[marketIndex];
        const { regime, tier } = marketInputs[marketIndex];
        let worst: PendingRow | null = null;
        const each: ScreeningRow[] = [];
        for (let k = 0; k < antennas.length; k++) {
          const separationM = seps[k]!.separationM;
          const powers = powersOf[k];
          const shared: SharedInputs = {
            antennaId: antennaInputs[k],
            frequencyMinHz,
            frequencyMaxHz,
            separationM: separationInputs[k],
            usePositionKind: kindInputs[positionIndex],
            regime,
            tier,
          };
          const c: Combination = { tx, position, market, antennaId: antennas[k], antennaCount: antennas.length, separationM, powers, powerMode, shared, bandNotes };
          const set = ruleSetFor(market, {
            powers,
            separationM,
            kind: position.kind,
            tier: market.tier,
            fccSarScreening: market.fccSarScreening ?? 'exemption',
          });
          const pending = set.blanket ? blanketRow(c, set) : bandRow(c, set);
          each.push(pending.row);
          if (!worst || antennaWorse(pending.row, worst.row)) worst = pending;
        }
        // Only the reported antenna's derivation is built: the others are named in its notes.
        const reported = worst!.row;
        const band = worst!.band;
        if (band) reported.derivation = bandDerivation(band.c, band.set, reported, band.worst, band.probes);
        if (antennas.length > 1) {
          reported.derivation.notes.push(
            `${antennas.length} antennas (${streams > 1 ? `MIMO: ${streams} streams at once, powers added` : 'switched: one at a time'}), each evaluated with its own gain and separation; reported: the least favourable, ${reported.antennaId}. Each antenna — ${each.map(marginWords).join('; ')}.`,
          );
        }
        rows.push(reported);
      }
    }
  }
  const summary = summarizeScreening(
    rows,
    gaps,
    input.markets.map((m) => m.regime),
  );
  const notes = [...SCREENING_CAUTIONS];
  if (!input.markets.length) notes.push('No markets selected: nothing to screen.');
  if (gaps.length) notes.push(`${gaps.length} transmitter × use position combination(s) could not be screened (see gaps).`);
  const warnings = ruleSetWarnings(input.markets.map((m) => m.regime));
  for (const w of warnings) notes.push(w.message);
  const conditions = moduleConditionWarnings(input);
  if (conditions.length) notes.push(`${conditions.length} use position × antenna combination(s) closer than a module grant allows (see conditions).`);
  for (const c of conditions) {
    for (const row of rows) {
      if (row.transmitterId === c.transmitterId && row.usePositionId === c.usePositionId) row.derivation.notes.push(`Module grant condition: ${c.message} Source: ${c.source}.`);
    }
  }
  return {
    rows,
    gaps,
    warnings,
    conditions,
    summary,
    derivation: {
      formula:
        'for each transmitter × use position × market: the applicable exemption rule at the band’s most restrictive frequency (edges and breakpoints); result = exempt | evaluate-sar | evaluate-mpe',
      inputs: {
        transmitters: q(input.transmitters.length, '1'),
        usePositions: q(input.usePositions.length, '1'),
        markets: q(input.markets.map((m) => `${m.regime}/${m.tier}${m.regime === 'fcc' ? `/${m.fccSarScreening ?? 'exemption'}` : ''}`).join(', '), 'text'),
      },
      intermediate: { gaps: q(gaps.length, '1') },
      result: {
        combinations: q(summary.total.combinations, '1'),
        exempt: q(summary.total.exempt, '1'),
        evaluateSar: q(summary.total.evaluateSar, '1'),
        evaluateMpe: q(summary.total.evaluateMpe, '1'),
      },
      source: SCREENING_SOURCES.join('; '),
      notes,
    },
  };
}

export const SCREENING_SOURCES = [
  '47 CFR §1.1307(b)(3)(i)(A)–(C) (FCC 19-126)',
  'FCC KDB 447498 D01 v06 §4.3.1, §4.3.2',
  'RSS-102 Issue 5 §2.5.1 Table 1, §2.5.2',
  'EN 62479:2010 Annex A with 1999/519/EC Annex II, 2013/35/EU, ICNIRP 2020 Table 2',
  '1999/519/EC Annex III (= ICNIRP 1998 Tables 6–7), ICNIRP 2020 Table 5',
  'FCC OET Bulletin 65 (Edition 97-01) Eq. (3)',
];
