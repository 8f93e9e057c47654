/**
 * The one registry of calculations. The CLI, the HTTP API and the app all go through it.
 */
import { z } from 'zod';
import { MAX_REPORTED_PROBLEMS } from './input-limits';
import { CalcRangeError, type CalcIssue, type Calculation } from './types';
import { emCalculations } from './em';
import { limitCalculations } from './limits';
import { labCalculations } from './lab';
import { screeningCalculations } from './screening';

export { ENGINE_VERSION, RULE_SET_VERSION } from './versions';

const all: Calculation[] = [...emCalculations, ...limitCalculations, ...labCalculations, ...screeningCalculations] as Calculation[];

export const calculations: ReadonlyMap<string, Calculation> = new Map(all.map((c) => [c.name, c]));

if (calculations.size !== all.length) {
  throw new Error('calc registry: duplicate calculation name');
}

export function getCalculation(name: string): Calculation | undefined {
  return calculations.get(name);
}

export type CalcOutcome =
  | { ok: true; result: unknown }
  /** `problemCount` is there when more problems were found than `issues` lists. */
  | { ok: false; error: { message: string; issues: CalcIssue[]; problemCount?: number } };

/** Problems named in the one-line message; `issues` carries up to MAX_REPORTED_PROBLEMS. */
const MESSAGE_PROBLEMS = 20;

/** Validates raw input against the calculation's schema and runs it; never throws for bad input. */
export function runCalculation(name: string, rawInput: unknown): CalcOutcome {
  const calc = calculations.get(name);
  if (!calc) {
    return {
      ok: false,
      error: {
        message: `Unknown calculation "${name}". Known: ${[...calculations.keys()].join(', ')}`,
        issues: [{ path: [], message: 'unknown calculation' }],
      },
    };
  }
  const parsed = calc.input.safeParse(rawInput);
  if (!parsed.success) {
    // A large bad input could list thousands of problems: report the first ones and the count.
    const all = parsed.error.issues;
    const issues = all.slice(0, MAX_REPORTED_PROBLEMS).map((i) => ({ path: i.path as (string | number)[], message: i.message }));
    const listed = issues.slice(0, MESSAGE_PROBLEMS).map((i) => `${i.path.join('.') || '(root)'}: ${i.message}`);
    const more = all.length > listed.length ? ` (and ${all.length - listed.length} more problem${all.length - listed.length === 1 ? '' : 's'})` : '';
    return {
      ok: false,
      error: { message: `Invalid input for ${name}: ${listed.join('; ')}${more}`, issues, ...(all.length > issues.length ? { problemCount: all.length } : {}) },
    };
  }
  try {
    return { ok: true, result: calc.compute(parsed.data) };
  } catch (err) {
    if (err instanceof CalcRangeError) {
      return { ok: false, error: { message: err.message, issues: err.issues } };
    }
    throw err;
  }
}

let listing: ReturnType<typeof buildListing> | undefined;

/** Name, title, sources and input JSON Schema of every calculation (for `--list` and the API). */
export function listCalculations() {
  listing ??= buildListing();
  return listing;
}

function buildListing() {
  return [...calculations.values()].map((c) => ({
    name: c.name,
    title: c.title,
    description: c.description,
    sources: c.sources,
    inputSchema: z.toJSONSchema(c.input, { io: 'input', unrepresentable: 'any' }),
  }));
}
