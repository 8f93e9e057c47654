/**
 * passport-local with the users service. The session holds only the user id and the active
 * organisation; the user and their roles are re-read on every request, so a role change or a
 * deactivation takes effect at once.
 */
import passport, { type PassportStatic } from 'passport';

export type Passport = InstanceType<PassportStatic['Authenticator']>;
import { Strategy as LocalStrategy } from 'passport-local';
import type { Db } from '../../db/client';
import { checkCredentials, loadSessionUser } from '../services/users-service';

interface SerializedUser {
  id: number;
  organisationId: number;
}

export function createPassport(db: Db): Passport {
  const instance = new passport.Authenticator();
  instance.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: true }, (email, password, done) => {
      checkCredentials(db, email, password).then(
        (r) => done(null, r.ok ? r.user : false),
        (err) => done(err),
      );
    }),
  );
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
