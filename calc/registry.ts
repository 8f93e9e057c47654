/**
 * The one registry of calculations. The CLI, the HTTP API and the app all go through it.
 */
import { z } from 'zod';
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
  | { ok: false; error: { message: string; issues: CalcIssue[] } };

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
    const issues = parsed.error.issues.map((i) => ({ path: i.path as (string | number)[], message: i.message }));
    return {
      ok: false,
      error: {
        message: `Invalid input for ${name}: ${issues.map((i) => `${i.path.join('.') || '(root)'}: ${i.message}`).join('; ')}`,
        issues,
      },
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
