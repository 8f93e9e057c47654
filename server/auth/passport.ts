/**
 * Passport keeps the signed-in user in the session (the sign-in route checks the password itself,
 * within the sign-in guard, then calls req.login). The session holds only the user id and the
 * active organisation; the user and their roles are re-read on every request, so a role change or
 * a deactivation takes effect at once.
 */
import passport, { type PassportStatic } from 'passport';
import type { Db } from '../../db/client';
import { loadSessionUser } from '../services/users-service';

export type Passport = InstanceType<PassportStatic['Authenticator']>;

interface SerializedUser {
  id: number;
  organisationId: number;
}

export function createPassport(db: Db): Passport {
  const instance = new passport.Authenticator();
  instance.serializeUser<SerializedUser>((user, done) => done(null, { id: user.id, organisationId: user.organisation.id }));
  instance.deserializeUser<SerializedUser>((s, done) => {
    try {
      done(null, loadSessionUser(db, s.id, s.organisationId) ?? false);
    } catch (err) {
      done(err);
    }
  });
  return instance;
}
