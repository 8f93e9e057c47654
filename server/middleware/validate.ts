/**
 * Parses a request part with a shared zod schema. A body that fails the schema is a 422 with
 * one message per field, so forms can show each error inline.
 */
import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { unprocessable } from '../http-error';

export function zodFieldErrors(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
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
