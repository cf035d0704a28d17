import passport, { type PassportStatic } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { Sequelize } from 'sequelize';
import { checkCredentials } from './sign-in.service';
import { loadActiveSessionUser } from '../services/user-loader';

/** A passport instance of its own per app, so several apps (tests, two servers) never share strategies. */
export function createPassport(sequelize: Sequelize, lockThreshold: number): PassportStatic {
  const instance = new passport.Passport() as PassportStatic;
  instance.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: true }, (email, password, done) => {
      checkCredentials(sequelize, { email, password, lockThreshold, purpose: 'sign-in' })
        .then((result) => {
          if (result.ok) done(null, { id: result.user.id });
          else done(null, false, { message: result.reason });
        })
        .catch(done);
    }),
  );
  instance.serializeUser((user, done) => done(null, (user as { id: number }).id));
  instance.deserializeUser((id: number, done) => {
    loadActiveSessionUser(Number(id))
      .then((user) => done(null, user ?? false))
      .catch(done);
  });
  return instance;
}
