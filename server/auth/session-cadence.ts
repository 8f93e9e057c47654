/**
 * How long a session lives, and how often its expiry moves.
 *
 * - Idle: a signed-in session ends SESSION_IDLE_MS after it was last extended (the cookie and the
 *   stored row expire together). A request extends it only when the last extension is at least
 *   SESSION_EXTEND_EVERY_MS old, so a read is not also a write; a session therefore ends between
 *   SESSION_IDLE_MS − SESSION_EXTEND_EVERY_MS and SESSION_IDLE_MS after its last request
 *   (11 h 55 min to 12 h).
 * - Absolute: however busy, a session ends SESSION_ABSOLUTE_MS after sign-in.
 */
import type { RequestHandler } from 'express';

export const SESSION_IDLE_MS = 12 * 3600 * 1000;
export const SESSION_EXTEND_EVERY_MS = 5 * 60 * 1000;
export const SESSION_ABSOLUTE_MS = 7 * 24 * 3600 * 1000;

declare module 'express-session' {
  interface SessionData {
    /** When the user signed in (ms since epoch), for the absolute lifetime. */
    signedInAt?: number;
    /** When the session's expiry was last moved (ms since epoch); the sign-in counts as one. */
    extendedAt?: number;
  }
}

/** A signed-in session older than SESSION_ABSOLUTE_MS is signed out; the request goes on anonymous. */
export const endSessionsPastAbsoluteLifetime: RequestHandler = (req, _res, next) => {
  if (!req.user) return next();
  const started = req.session.signedInAt;
  if (typeof started === 'number' && Date.now() - started <= SESSION_ABSOLUTE_MS) return next();
  req.logout((err) => next(err));
};

/**
 * Moves a signed-in session's expiry to now + SESSION_IDLE_MS when its last move is
 * SESSION_EXTEND_EVERY_MS old or more: changing `extendedAt` makes express-session save the row
 * and send the cookie again (with rolling off and a store whose touch writes nothing, nothing
 * else does on a plain read).
 */
export const extendSessionWhenDue: RequestHandler = (req, _res, next) => {
  if (!req.user) return next();
  const now = Date.now();
  const last = req.session.extendedAt ?? req.session.signedInAt ?? 0;
  if (now - last >= SESSION_EXTEND_EVERY_MS) req.session.extendedAt = now;
  next();
};
