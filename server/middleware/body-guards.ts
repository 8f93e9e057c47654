/**
 * Guards on request bodies, before any route sees them:
 * - a state-changing request whose body is neither JSON nor a multipart upload is a 415;
 * - JSON nested deeper than MAX_JSON_DEPTH is refused (a 4 000-deep array stored as a draft once
 *   made a filing unreadable), as is text with a lone UTF-16 surrogate (it cannot be stored or
 *   sent back as valid UTF-8; silently replacing it would change what the user typed).
 */
import type { RequestHandler } from 'express';
import { HttpError, unprocessable } from '../http-error';

export const MAX_JSON_DEPTH = 32;

const BODY_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

const hasBody = (headers: Record<string, string | string[] | undefined>) => headers['transfer-encoding'] !== undefined || Number(headers['content-length'] ?? 0) > 0;

export const requireJsonBody: RequestHandler = (req, _res, next) => {
  if (!BODY_METHODS.has(req.method) || !hasBody(req.headers)) return next();
  if (req.is('application/json') || req.is('multipart/form-data')) return next();
  next(new HttpError(415, 'unsupported_media_type', 'Send the body as JSON with the header Content-Type: application/json.'));
};

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
const wellFormed = (s: string) => !LONE_SURROGATE.test(s);

/** Walks the parsed body iteratively (a recursive walk could itself overflow the stack). */
export function findBodyProblem(body: unknown): string | undefined {
  const stack: { value: unknown; depth: number; path: string }[] = [{ value: body, depth: 0, path: '' }];
  while (stack.length) {
    const { value, depth, path } = stack.pop()!;
    if (typeof value === 'string') {
      if (!wellFormed(value)) return `The text at ${path || 'the top level'} contains an invalid character (a lone UTF-16 surrogate); remove it and send again.`;
      continue;
    }
    if (value === null || typeof value !== 'object') continue;
    if (depth >= MAX_JSON_DEPTH) return `The body is nested more than ${MAX_JSON_DEPTH} levels deep at ${path}; no Fieldfile request needs that.`;
    for (const [k, v] of Object.entries(value)) {
      if (!wellFormed(k)) return `A field name at ${path || 'the top level'} contains an invalid character (a lone UTF-16 surrogate).`;
      stack.push({ value: v, depth: depth + 1, path: Array.isArray(value) ? `${path}[${k}]` : path ? `${path}.${k}` : k });
    }
  }
  return undefined;
}

const strictUtf8 = new TextDecoder('utf-8', { fatal: true });
const INVALID_UTF8 = Symbol('invalid-utf8');

/**
 * For express.json's `verify`: notes bytes that are not valid UTF-8 (the parser would replace
 * them with U+FFFD, silently changing the text), so refuseMalformedJson can refuse the request.
 */
export function noteInvalidUtf8(req: object, _res: unknown, buf: Buffer): void {
  try {
    strictUtf8.decode(buf);
  } catch {
    (req as Record<symbol, boolean>)[INVALID_UTF8] = true;
  }
}

export const refuseMalformedJson: RequestHandler = (req, _res, next) => {
  if (req.body === undefined || !req.is('application/json')) return next();
  const problem = (req as unknown as Record<symbol, boolean>)[INVALID_UTF8] ? 'The body is not valid UTF-8 text; send it encoded as UTF-8.' : findBodyProblem(req.body);
  next(problem ? unprocessable(problem, { _: problem }) : undefined);
};
