/**
 * Shared shapes of the calculation engine. Every result carries a `derivation` so that a
 * reviewer can see the formula, the inputs with units, the intermediate values and the
 * published source behind each figure.
 */
import type { z } from 'zod';

export interface Quantity {
  value: number | string | boolean | null;
  unit: string;
}

export interface Derivation {
  /** The formula as text, with the source's symbols, e.g. "P_th = ERP_20cm · (d/20 cm)^x". */
  formula: string;
  /** Inputs as used (after defaults), each with its unit ("1" for dimensionless). */
  inputs: Record<string, Quantity>;
  /** Intermediate values worth showing, each with its unit. */
  intermediate: Record<string, Quantity>;
  /** The headline result(s), each with its unit. */
  result: Record<string, Quantity>;
  /** Document and clause/table, e.g. "47 CFR §1.1307(b)(3)(i)(B)". */
  source: string;
  /** Cautions, assumptions, "from memory" markers, common-practice notes. */
  notes: string[];
}

export type WithDerivation<T> = T & { derivation: Derivation };

export interface CalcIssue {
  path: (string | number)[];
  message: string;
}

/**
 * Thrown by a calculation when its input is well-formed but outside the formula's validity
 * range (the message names the valid range). Never extrapolate silently.
 */
export class CalcRangeError extends Error {
  readonly issues: CalcIssue[];
  constructor(message: string, issues: CalcIssue[] = []) {
    // An expected answer, always caught and reported by its message (a whole filing gets dozens):
    // no stack trace is captured, which costs several times the calculation itself. V8's
    // Error.stackTraceLimit; engines without it (the app's) are left alone.
    const errorClass = Error as { stackTraceLimit?: unknown };
    const stackTraceLimit = errorClass.stackTraceLimit;
    if (typeof stackTraceLimit === 'number') errorClass.stackTraceLimit = 0;
    super(message);
    if (typeof stackTraceLimit === 'number') errorClass.stackTraceLimit = stackTraceLimit;
    this.name = 'CalcRangeError';
    this.issues = issues.length ? issues : [{ path: [], message }];
  }
}

export interface Calculation<S extends z.ZodType = z.ZodType, O = unknown> {
  /** kebab-case name used by the CLI (`calc/cli.ts <name>`) and the API (`/api/calc/<name>`). */
  name: string;
  title: string;
  description: string;
  input: S;
  // Method syntax on purpose: it keeps specific calculations assignable to Calculation[].
  compute(input: z.output<S>): WithDerivation<O>;
  /** Published sources the calculation implements. */
  sources: string[];
}

/** Identity helper that keeps the input type tied to the compute function. */
export function defineCalculation<S extends z.ZodType, O>(calc: Calculation<S, O>): Calculation<S, O> {
  return calc;
}

/** A derivation quantity; non-finite numbers become null because JSON cannot carry them. */
export function q(value: Quantity['value'], unit: string): Quantity {
  return { value: typeof value === 'number' && !Number.isFinite(value) ? null : value, unit };
}
