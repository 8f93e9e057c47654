/**
 * Sessions in the same SQLite file (better-sqlite3-session-store), so they survive a restart.
 * The package starts a cleanup timer that keeps the process alive and outlives the database;
 * this subclass unrefs it and stops it on close.
 */
import session from 'express-session';
import type Database from 'better-sqlite3';
// eslint-disable-next-line @typescript-eslint/no-require-imports
const makeStore = require('better-sqlite3-session-store') as (s: typeof session) => new (options: {
  client: Database.Database;
  expired?: { clear?: boolean; intervalMs?: number };
}) => session.MemoryStore & { clearExpiredSessions(): void };
// (typed as MemoryStore only because it is a concrete Store class; the package implements
// get/set/destroy/touch/all/length/clear on SQLite.)

const CLEANUP_INTERVAL_MS = 15 * 60 * 1000;

export function createSessionStore(sqlite: Database.Database) {
  const Base = makeStore(session);
  class FieldfileSessionStore extends Base {
    private timer?: NodeJS.Timeout;
    startInterval() {
      this.timer = setInterval(() => this.clearExpiredSessions(), CLEANUP_INTERVAL_MS);
      this.timer.unref();
    }
    close() {
      if (this.timer) clearInterval(this.timer);
    }
  }
  return new FieldfileSessionStore({ client: sqlite, expired: { clear: true, intervalMs: CLEANUP_INTERVAL_MS } });
}
