/** A domain error that carries its HTTP status; the error handler turns it into the JSON body. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const badRequest = (message: string, fields?: Record<string, string>) => new HttpError(400, 'bad_request', message, fields);
export const unprocessable = (message: string, fields?: Record<string, string>) => new HttpError(422, 'invalid_input', message, fields);
export const unauthorized = (message = 'Sign in to continue.') => new HttpError(401, 'unauthorized', message);
export const forbidden = (message = 'Your role does not allow this.') => new HttpError(403, 'forbidden', message);
export const notFound = (message = 'Not found.') => new HttpError(404, 'not_found', message);
export const conflict = (message: string, fields?: Record<string, string>) => new HttpError(409, 'conflict', message, fields);

/** A 429: the caller may try again after `retryAfterSec` (sent as Retry-After). */
export class RetryLaterError extends HttpError {
  constructor(
    code: string,
    message: string,
    readonly retryAfterSec: number,
  ) {
    super(429, code, message);
  }
}
export const tooManyRequests = (code: 'too_many_attempts' | 'busy', message: string, retryAfterSec: number) => new RetryLaterError(code, message, Math.max(1, Math.ceil(retryAfterSec)));
