/**
 * The bare stack the authenticated reads are measured against: Express 5 + express-session with
 * the stock better-sqlite3-session-store (its defaults: not rolling, but the store's touch updates
 * the row on every request) + passport (the session holds the user; deserializing reads nothing)
 * + one Drizzle read of a filing (the app's own filing query). No helmet, no body parsing, no
 * guards, no step statuses: what every authenticated read costs at the least, on the same SQLite
 * file as the app.
 */
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import session from 'express-session';
import passport from 'passport';
import { openDatabase } from '../../db/client';
import { findFiling } from '../../server/repos/filings-repo';

interface BareUser {
  id: number;
  organisationId: number;
}

export interface BareStack {
  /** e.g. http://127.0.0.1:41234 */
  base: string;
  /** Signs the given user in; resolves with the session cookie. */
  login(user: BareUser): Promise<string>;
  close(): Promise<void>;
}

/** `touchWrites: false` stubs out the store's touch, so a read writes nothing (the stricter baseline). */
export async function startBareStack(dbFile: string, { touchWrites = true } = {}): Promise<BareStack> {
  const handle = openDatabase(dbFile);
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const SqliteStore = require('better-sqlite3-session-store')(session) as new (o: { client: typeof handle.sqlite }) => session.Store;
  const auth = new passport.Authenticator();
  auth.serializeUser<BareUser>((user, done) => done(null, user as unknown as BareUser));
  auth.deserializeUser<BareUser>((user, done) => done(null, user as unknown as Express.User));
  const app = express();
  const store = new SqliteStore({ client: handle.sqlite });
  if (!touchWrites) store.touch = (_sid, _sess, cb) => cb?.();
  app.use(session({ secret: 'bare-stack-bench', store, resave: false, saveUninitialized: false }));
  app.use(auth.session());
  app.post('/login/:userId/:organisationId', (req, res, next) => {
    const user: BareUser = { id: Number(req.params.userId), organisationId: Number(req.params.organisationId) };
    req.login(user as unknown as Express.User, (err) => (err ? next(err) : res.status(204).end()));
  });
  app.get('/filings/:id', (req, res) => {
    const user = req.user as unknown as BareUser | undefined;
    if (!user) return void res.status(401).end();
    const row = findFiling(handle.db, user.organisationId, Number(req.params.id));
    if (!row) return void res.status(404).end();
    res.json({ filing: row });
  });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  return {
    base,
    async login(user) {
      const res = await fetch(`${base}/login/${user.id}/${user.organisationId}`, { method: 'POST' });
      if (res.status !== 204) throw new Error(`bare stack sign-in answered ${res.status}`);
      return res.headers.get('set-cookie')!.split(';')[0];
    },
    async close() {
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
      handle.sqlite.close();
    },
  };
}
