/**
 * calc/cli.ts — the JSON command line over the registry (issue 3 "Design"): `--list` prints every
 * name with its input JSON Schema; `<name>` reads one JSON object on stdin and prints one JSON object,
 * exit 0; invalid JSON, schema-invalid input or input outside a formula's validity range exit 2 with
 * `{ error: { message, issues } }` on stdout. Expected numbers: reported-sar ×10^(1/10) (KDB 447498
 * practice, hand-computed); liquid-target range 300 MHz–6 GHz (IEEE 1528-2013 Table 3, from memory).
 */
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { calculations } from '../../calc/registry';

const root = path.resolve(__dirname, '../..');
const tsx = path.join(root, 'node_modules/.bin/tsx');

function cli(args: string[], stdin = '') {
  const r = spawnSync(tsx, ['calc/cli.ts', ...args], { cwd: root, input: stdin, encoding: 'utf8', timeout: 30_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr, json: () => JSON.parse(r.stdout) };
}

function expectErrorBody(body: unknown) {
  expect(body).toMatchObject({ error: { message: expect.any(String), issues: expect.any(Array) } });
  const { issues } = (body as { error: { issues: unknown[] } }).error;
  expect(issues.length).toBeGreaterThan(0);
  for (const issue of issues) expect(issue).toMatchObject({ path: expect.any(Array), message: expect.any(String) });
}

describe('calc/cli.ts', () => {
  it('--list prints every registered calculation with an input JSON Schema', () => {
    const r = cli(['--list']);
    expect(r.code).toBe(0);
    const listed = r.json().calculations as { name: string; inputSchema: Record<string, unknown> }[];
    expect(listed.map((c) => c.name).sort()).toEqual([...calculations.keys()].sort());
    for (const c of listed) {
      // An object schema, or a union of object schemas (oneOf/anyOf) for inputs with alternatives.
      const alternatives = (c.inputSchema.oneOf ?? c.inputSchema.anyOf ?? [c.inputSchema]) as { type?: string }[];
      expect(c.inputSchema.$schema, c.name).toEqual(expect.any(String));
      for (const alt of alternatives) expect(alt.type, c.name).toBe('object');
    }
    for (const name of ['reported-sar', 'repeat-measurements', 'simultaneous-transmission', 'uncertainty-budget', 'liquid-target', 'liquid-check', 'system-check', 'power-drift']) {
      expect(listed.map((c) => c.name)).toContain(name);
    }
  });

  it('a valid call exits 0 with one JSON object carrying the derivation', () => {
    const r = cli(['reported-sar'], JSON.stringify({ measuredSarWPerKg: 1, measuredPowerDbm: 23, tuneUpPowerDbm: 24 }));
    expect(r.code).toBe(0);
    const out = r.json();
    expect(out.reportedSarWPerKg).toBeCloseTo(1.258925, 6);
    expect(out.derivation).toMatchObject({ formula: expect.any(String), source: expect.stringMatching(/KDB/) });
  });

  it('invalid JSON exits 2 with the error body on stdout', () => {
    const r = cli(['system-check'], '{"measuredSarWPerKg": 1,');
    expect(r.code).toBe(2);
    expectErrorBody(r.json());
  });

  it('schema-invalid input exits 2 naming the field', () => {
    const r = cli(['system-check'], JSON.stringify({ measuredSarWPerKg: 'high', targetSarWPerKg: 50 }));
    expect(r.code).toBe(2);
    const body = r.json();
    expectErrorBody(body);
    expect(body.error.issues[0].path).toEqual(['measuredSarWPerKg']);
  });

  it('input outside the validity range exits 2 naming the range (liquid-target at 10 GHz)', () => {
    const r = cli(['liquid-target'], JSON.stringify({ frequencyHz: 10e9 }));
    expect(r.code).toBe(2);
    const body = r.json();
    expectErrorBody(body);
    expect(body.error.message).toMatch(/6 GHz/);
  });

  it('an unknown calculation name exits 2', () => {
    const r = cli(['no-such-calculation'], '{}');
    expect(r.code).toBe(2);
    expectErrorBody(r.json());
  });
});
