/**
 * Passport keeps the signed-in user in the session (the sign-in route checks the password itself,
 * within the sign-in guard, then calls req.login). The session holds only the user id and the
 * active organisation; the user and their roles come from a read cache that any database write
 * empties (server/read-caches.ts), so a role change or a deactivation takes effect at once.
 */
import passport, { type PassportStatic } from 'passport';
import type { Db } from '../../db/client';
import type { ReadCaches } from '../read-caches';
import type { SessionUser } from '../../constants/schemas/auth';
import { loadSessionUser } from '../services/users-service';

/** Signed-in users kept at once (one entry per user and organisation). */
const CACHED_SESSION_USERS = 10_000;

/** Frozen: one cached object serves every request of that user until the next write. */
function frozen(user: SessionUser): SessionUser {
  Object.freeze(user.roles);
  Object.freeze(user.organisation);
  return Object.freeze(user);
}

export type Passport = InstanceType<PassportStatic['Authenticator']>;

interface SerializedUser {
  id: number;
  organisationId: number;
}

export function createPassport(db: Db, readCaches: ReadCaches): Passport {
  const instance = new passport.Authenticator();
  const users = readCaches.create<SessionUser | null>(CACHED_SESSION_USERS);
  instance.serializeUser<SerializedUser>((user, done) => done(null, { id: user.id, organisationId: user.organisation.id }));
  instance.deserializeUser<SerializedUser>((s, done) => {
    try {
      const user = users.get(`${s.id}:${s.organisationId}`, () => {
        const loaded = loadSessionUser(db, s.id, s.organisationId);
        return loaded ? frozen(loaded) : null;
      });
      done(null, user ?? false);
    } catch (err) {
      done(err);
    }
  });
  return instance;
}
