/**
 * Parses a request part with a shared zod schema. A body that fails the schema is a 422 with
 * one message per field, so forms can show each error inline.
 */
import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { MAX_REPORTED_PROBLEMS } from '../../calc/input-limits';
import { notFound, unprocessable } from '../http-error';

/** A refused body names at most this many fields (a huge bad body must not give a huge answer). */
export const MAX_FIELD_PROBLEMS = MAX_REPORTED_PROBLEMS;

export function zodFieldErrors(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    if (Object.keys(fields).length >= MAX_FIELD_PROBLEMS) {
      fields._more = `…and more problems (${error.issues.length} in all); fix these first.`;
      break;
    }
    const key = issue.path.length ? issue.path.join('.') : '_';
    if (issue.code === 'unrecognized_keys') {
      for (const k of issue.keys) fields[[...issue.path, k].join('.')] = `Unknown field "${k}".`;
      continue;
    }
    fields[key] ??= issue.message;
  }
  return fields;
}

export function parseWith<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const parsed = schema.safeParse(value);
  if (!parsed.success) {
    const fields = zodFieldErrors(parsed.error);
    const summary = Object.entries(fields)
      .slice(0, 20)
      .map(([k, m]) => (k === '_' ? m : `${k}: ${m}`))
      .join(' ');
    throw unprocessable(`Please fix the highlighted fields. ${summary}`.trim(), fields);
  }
  return parsed.data;
}

/** Replaces req.body with the parsed value. */
export function validateBody<S extends z.ZodType>(schema: S): RequestHandler {
  return (req, _res, next) => {
    req.body = parseWith(schema, req.body ?? {});
    next();
  };
}

/** Ids in paths are plain decimal integers: `0x1`, `1e0`, ` 1` or `01` name nothing (404). */
const ID_PATTERN = /^[1-9][0-9]{0,14}$/;

/** For `router.param('id', strictId)`: a route's id that is not a plain decimal integer is a 404. */
export const strictId = (req: unknown, _res: unknown, next: (err?: unknown) => void, value: unknown) => {
  next(typeof value === 'string' && ID_PATTERN.test(value) ? undefined : notFound('Not found: the id in the address is not a plain number.'));
};

export function parseIdParam(raw: unknown, notFoundMessage = 'Not found.'): number {
  if (typeof raw !== 'string' || !ID_PATTERN.test(raw)) throw notFound(notFoundMessage);
  return Number(raw);
}
