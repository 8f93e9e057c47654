/**
 * Sessions in the same SQLite file (better-sqlite3-session-store), so they survive a restart.
 * This subclass changes three things about the package:
 * - its statements are prepared once (the package prepares each one again on every call, and a
 *   session is read on every request);
 * - expiry is compared with the app's clock (`expire` holds an ISO-8601 UTC instant, which sorts
 *   as text), so the idle window is one clock's, not SQLite's `datetime('now')` beside Node's;
 * - `touch` writes nothing: a session's expiry moves only when the session is saved, which
 *   server/auth/session-cadence.ts does at most every few minutes (a read is not a write);
 * and it unrefs the package's cleanup timer and stops it on close.
 */
import session from 'express-session';
import type Database from 'better-sqlite3';
// eslint-disable-next-line @typescript-eslint/no-require-imports
const makeStore = require('better-sqlite3-session-store') as (
  s: typeof session,
) => new (options: { client: Database.Database; expired?: { clear?: boolean; intervalMs?: number } }) => session.MemoryStore & { clearExpiredSessions(): void };
// (typed as MemoryStore only because it is a concrete Store class; the package implements
// get/set/destroy/touch/all/length/clear on SQLite.)

const CLEANUP_INTERVAL_MS = 15 * 60 * 1000;
/** The package's lifetime for a session whose cookie has no max-age (ours always has one). */
const DEFAULT_LIFETIME_MS = 24 * 3600 * 1000;

type Callback = (err?: unknown) => void;

export function createSessionStore(sqlite: Database.Database) {
  const Base = makeStore(session);
  class FieldfileSessionStore extends Base {
    private timer?: NodeJS.Timeout;
    private statements?: { get: Database.Statement; set: Database.Statement; destroy: Database.Statement; clearExpired: Database.Statement };

    /** Prepared on first use: the package creates its table in its constructor. */
    private sql() {
      this.statements ??= {
        get: sqlite.prepare('SELECT sess FROM sessions WHERE sid = ? AND expire > ?').pluck(),
        set: sqlite.prepare('INSERT OR REPLACE INTO sessions (sid, sess, expire) VALUES (?, ?, ?)'),
        destroy: sqlite.prepare('DELETE FROM sessions WHERE sid = ?'),
        clearExpired: sqlite.prepare('DELETE FROM sessions WHERE expire <= ?'),
      };
      return this.statements;
    }

    startInterval() {
      this.timer = setInterval(() => this.clearExpiredSessions(), CLEANUP_INTERVAL_MS);
      this.timer.unref();
    }

    clearExpiredSessions() {
      try {
        this.sql().clearExpired.run(new Date().toISOString());
      } catch (err) {
        console.error('[fieldfile] clearing expired sessions failed', err);
      }
    }

    get(sid: string, cb: (err: unknown, session?: session.SessionData | null) => void) {
      let sess: string | undefined;
      try {
        sess = this.sql().get.get(sid, new Date().toISOString()) as string | undefined;
      } catch (err) {
        return cb(err);
      }
      cb(null, sess ? JSON.parse(sess) : null);
    }

    set(sid: string, sess: session.SessionData, cb: Callback = () => {}) {
      const lifetimeMs = sess.cookie?.maxAge || DEFAULT_LIFETIME_MS;
      try {
        this.sql().set.run(sid, JSON.stringify(sess), new Date(Date.now() + lifetimeMs).toISOString());
      } catch (err) {
        return cb(err);
      }
      cb(null);
    }

    destroy(sid: string, cb: Callback = () => {}) {
      try {
        this.sql().destroy.run(sid);
      } catch (err) {
        return cb(err);
      }
      cb(null);
    }

    touch(_sid: string, _sess: session.SessionData, cb: Callback = () => {}) {
      cb(null);
    }

    close() {
      if (this.timer) clearInterval(this.timer);
    }
  }
  return new FieldfileSessionStore({ client: sqlite, expired: { clear: true, intervalMs: CLEANUP_INTERVAL_MS } });
}
