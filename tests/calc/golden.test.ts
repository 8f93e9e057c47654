/**
 * Golden outputs: stored screening results are reused by (input hash, ENGINE_VERSION,
 * RULE_SET_VERSION), so an output may change only together with a version bump. This test
 * recomputes the fixed inputs of golden/inputs.ts and compares the full outputs, byte for byte,
 * with golden/outputs.json:
 * - outputs differ and both versions are the stored ones → fails, naming each changed case and the
 *   first differing field: bump ENGINE_VERSION (code or formula) or RULE_SET_VERSION (a limit,
 *   threshold or table value) in calc/versions.ts;
 * - a version differs from the stored one → fails until outputs.json is regenerated:
 *   `UPDATE_GOLDEN=1 npx vitest run tests/calc/golden.test.ts`.
 * The expected values are the engine's own earlier outputs (a regression guard, not a reference);
 * the published values are checked by the other calc tests.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { screenDevice, screeningDepthProfile } from '../../calc/screening';
import { ENGINE_VERSION, RULE_SET_VERSION } from '../../calc/versions';
import { GOLDEN_DEPTH, GOLDEN_SCREENING } from './golden/inputs';

const FILE = path.join(__dirname, 'golden', 'outputs.json');

interface Golden {
  engineVersion: string;
  ruleSetVersion: string;
  /** case name → the output (compared as JSON text: numbers round-trip exactly) */
  outputs: Record<string, unknown>;
}

function compute(): Record<string, string> {
  const outputs: Record<string, string> = {};
  for (const [name, input] of Object.entries(GOLDEN_SCREENING)) outputs[`screening/${name}`] = JSON.stringify(screenDevice(input));
  for (const [name, input] of Object.entries(GOLDEN_DEPTH)) outputs[`depth-profile/${name}`] = JSON.stringify(screeningDepthProfile(input));
  return outputs;
}

/** The first path at which two JSON values differ, with both values. */
export function firstDifference(a: unknown, b: unknown, at = '$'): string | null {
  if (Object.is(a, b)) return null;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null || Array.isArray(a) !== Array.isArray(b)) {
    return `${at}: stored ${JSON.stringify(a)?.slice(0, 160)}, now ${JSON.stringify(b)?.slice(0, 160)}`;
  }
  const keys = [...new Set([...Object.keys(a), ...Object.keys(b)])];
  for (const k of keys) {
    const d = firstDifference((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], Array.isArray(a) ? `${at}[${k}]` : `${at}.${k}`);
    if (d) return d;
  }
  return null;
}

describe('golden outputs guard stored results', () => {
  const now = compute();
  if (process.env.UPDATE_GOLDEN) {
    const outputs = Object.fromEntries(Object.entries(now).map(([k, v]) => [k, JSON.parse(v)]));
    writeFileSync(FILE, `${JSON.stringify({ engineVersion: ENGINE_VERSION, ruleSetVersion: RULE_SET_VERSION, outputs } satisfies Golden)}\n`);
  }
  const stored = JSON.parse(readFileSync(FILE, 'utf8')) as Golden;

  it('the stored outputs belong to the current ENGINE_VERSION and RULE_SET_VERSION', () => {
    const bumped = [
      stored.engineVersion !== ENGINE_VERSION ? `ENGINE_VERSION ${stored.engineVersion} → ${ENGINE_VERSION}` : null,
      stored.ruleSetVersion !== RULE_SET_VERSION ? `RULE_SET_VERSION ${stored.ruleSetVersion} → ${RULE_SET_VERSION}` : null,
    ].filter(Boolean);
    expect(bumped, `Versions changed (${bumped.join('; ')}): regenerate with UPDATE_GOLDEN=1 npx vitest run tests/calc/golden.test.ts`).toEqual([]);
  });

  it('outputs are byte-identical to the stored ones (else bump a version)', () => {
    if (stored.engineVersion !== ENGINE_VERSION || stored.ruleSetVersion !== RULE_SET_VERSION) return; // the test above says what to do
    const changed: string[] = [];
    for (const name of new Set([...Object.keys(stored.outputs), ...Object.keys(now)])) {
      const before = stored.outputs[name];
      if (before === undefined || now[name] === undefined) {
        changed.push(`${name}: case ${now[name] === undefined ? 'removed' : 'added'}`);
        continue;
      }
      if (JSON.stringify(before) === now[name]) continue;
      changed.push(`${name}: ${firstDifference(before, JSON.parse(now[name])) ?? 'same values, different text (key order or number formatting)'}`);
    }
    expect(
      changed,
      `Outputs changed without a version bump (ENGINE_VERSION ${ENGINE_VERSION}, RULE_SET_VERSION ${RULE_SET_VERSION} as stored). ` +
        'Bump ENGINE_VERSION in calc/versions.ts for a code or formula change, RULE_SET_VERSION for a limit or table value, then regenerate with UPDATE_GOLDEN=1. Changed:\n' +
        changed.join('\n'),
    ).toEqual([]);
  });
});

describe('firstDifference (the golden test’s report)', () => {
  it('names the first differing path and both values', () => {
    expect(firstDifference({ rows: [{ marginDb: 1 }] }, { rows: [{ marginDb: 2 }] })).toBe('$.rows[0].marginDb: stored 1, now 2');
    expect(firstDifference({ a: [1, 2] }, { a: [1, 2] })).toBeNull();
    expect(firstDifference({ a: 1 }, { a: 1, b: 'x' })).toBe('$.b: stored undefined, now "x"');
  });
});
