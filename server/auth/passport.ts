import passport, { type PassportStatic } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { checkCredentials, normaliseEmail, type SignInDeps } from './sign-in.service';
import { loadActiveSessionUser } from '../services/user-loader';

/** A passport instance of its own per app, so several apps (tests, two servers) never share strategies. */
export function createPassport(deps: SignInDeps): PassportStatic {
  const instance = new passport.Passport() as PassportStatic;
  instance.use(
    new LocalStrategy(
      { usernameField: 'email', passwordField: 'password', session: true, passReqToCallback: true },
      (req, email, password, done) => {
        // passport reads the raw body: the e-mail is trimmed and case-folded here too.
        checkCredentials(deps, { email: normaliseEmail(email), password, address: req.ip ?? 'unknown' })
          .then((result) => (result.ok ? done(null, { id: result.user.id }) : done(null, false)))
          .catch(done);
      },
    ),
  );
  instance.serializeUser((user, done) => done(null, (user as { id: number }).id));
  instance.deserializeUser((id: number, done) => {
    loadActiveSessionUser(Number(id))
      .then((user) => done(null, user ?? false))
      .catch(done);
  });
  return instance;
}
