/**
 * The one error handler, mounted last: HttpErrors keep their status and message; body-parser
 * failures become 400s; anything else is logged and answered with a plain 500 (no stack traces).
 */
import type { ErrorRequestHandler, RequestHandler } from 'express';
import { HttpError, notFound, RetryLaterError } from '../http-error';

/** The start of the message the signed-version triggers raise (db/migrations/*_signed_versions_frozen.sql). */
export const FROZEN_MESSAGE = 'signed version is frozen';

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(notFound(`No API route ${req.method} ${req.originalUrl}.`));
};

export const errorHandler: ErrorRequestHandler = (err, _req, res, _next) => {
  if (err instanceof HttpError) {
    if (err instanceof RetryLaterError) res.set('Retry-After', String(err.retryAfterSec));
    res.status(err.status).json({ error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) } });
    return;
  }
  const e = err as { type?: string; status?: number; message?: string };
  if (e?.type === 'entity.parse.failed') {
    res.status(400).json({ error: { code: 'malformed_json', message: 'The request body is not valid JSON.' } });
    return;
  }
  if (e?.type === 'entity.too.large') {
    res.status(413).json({ error: { code: 'too_large', message: 'The request body is too large.' } });
    return;
  }
  if (typeof e?.message === 'string' && e.message.startsWith(FROZEN_MESSAGE)) {
    // The data layer's own guard (the signed-version triggers) refused a write the services let through.
    res.status(409).json({ error: { code: 'version_signed', message: 'This version is signed and can no longer change. Start the next version to edit.' } });
    return;
  }
  if (typeof e?.status === 'number' && e.status >= 400 && e.status < 500) {
    res.status(e.status).json({ error: { code: 'bad_request', message: e.message ?? 'Bad request.' } });
    return;
  }
  console.error('[fieldfile] unhandled error', err);
  res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on the server. Try again; if it persists, tell your admin.' } });
};
