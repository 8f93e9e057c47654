/**
 * The readiness checklist of a filing version: every rule of ./rules.ts evaluated on the
 * version's data, with a count per severity. Pure and fast (no I/O), so the server computes it
 * on every read and nothing is ever ticked by hand.
 */
import type { ReadinessInput } from './input';
import { READINESS_RULES, type ReadinessFinding, type ReadinessRule } from './rules';

export * from './input';
export { READINESS_RULES, HOTSPOT_EDGE_DISTANCE_M, MANUAL_SEPARATION_KINDS, THIN_MARGIN_DB, TUNE_UP_SAME_WITHIN_DB, testsEdge } from './rules';
export type { ReadinessFinding, ReadinessRule, ReadinessSeverity } from './rules';

export type ReadinessStatus = 'pass' | 'fail' | 'not-applicable';

/** A rule's outcome on one filing: the rule's own fields, its status and its failing findings. */
export interface ReadinessItem extends Omit<ReadinessRule, 'check'> {
  status: ReadinessStatus;
  findings: ReadinessFinding[];
}

export interface ReadinessChecklist {
  items: ReadinessItem[];
  counts: { blocking: number; warnings: number; passed: number; notApplicable: number };
  /** True when no item that blocks signing fails. */
  ready: boolean;
}

/** How many findings of one item are listed; the rest are counted ("and 12 more"). */
export const MAX_FINDINGS_PER_ITEM = 50;

function evaluateRule(rule: ReadinessRule, input: ReadinessInput): ReadinessItem {
  const found = rule.check(input);
  const status: ReadinessStatus = found === null ? 'not-applicable' : found.length ? 'fail' : 'pass';
  let findings = found ?? [];
  if (findings.length > MAX_FINDINGS_PER_ITEM) {
    findings = [...findings.slice(0, MAX_FINDINGS_PER_ITEM), { text: `… and ${findings.length - MAX_FINDINGS_PER_ITEM} more.` }];
  }
  const { id, severity, title, fix, step, source } = rule;
  return { id, severity, title, fix, step, source, status, findings };
}

export function evaluateReadiness(input: ReadinessInput, rules: readonly ReadinessRule[] = READINESS_RULES): ReadinessChecklist {
  const items = rules.map((r) => evaluateRule(r, input));
  const failing = items.filter((i) => i.status === 'fail');
  const counts = {
    blocking: failing.filter((i) => i.severity === 'blocks-signing').length,
    warnings: failing.filter((i) => i.severity === 'warning').length,
    passed: items.filter((i) => i.status === 'pass').length,
    notApplicable: items.filter((i) => i.status === 'not-applicable').length,
  };
  return { items, counts, ready: counts.blocking === 0 };
}
