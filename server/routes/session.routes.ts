import { Router, type Request, type Response } from 'express';
import { packRules } from '@casl/ability/extra';
import type { PassportStatic } from 'passport';
import { requires } from '../middlewares/authorize';
import { parseBody } from '../lib/validate';
import { AppError } from '../lib/app-error';
import { SignInSchema } from '../../shared/schemas/session';
import { defineAbilityFor } from '../../shared/abilities';
import type { SessionResponse, SessionUser } from '../../shared/types/session';
import { recordTrail } from '../services/trail.service';
import { loadActiveSessionUser } from '../services/user-loader';
import { SESSION_COOKIE } from '../middlewares/session';
import type { AppDeps } from '../app-deps';
import { addressLockedUntil } from '../auth/sign-in.service';
import { changeOwnPassword } from '../auth/password-change';
import { PasswordChangeSchema } from '../../shared/schemas/user';

export interface CsrfTools {
  generateToken(req: Request, overwrite?: boolean): string;
}

// One answer whatever is wrong (unknown e-mail, wrong password, deactivated or
// temporarily locked account), so nobody learns which accounts exist or are locked.
const SIGN_IN_REFUSED = {
  status: 401,
  code: 'invalid_credentials',
  message: 'The e-mail address or password is not right. After repeated failures sign-in pauses for a few minutes.',
};

function sessionBody(req: Request, user: SessionUser, csrf: CsrfTools, fresh: boolean): SessionResponse {
  return {
    user,
    rules: packRules(defineAbilityFor(user).rules),
    csrfToken: fresh || !req.session.csrfToken ? csrf.generateToken(req, true) : req.session.csrfToken,
  };
}

export function sessionRoutes(deps: AppDeps, passport: PassportStatic, csrf: CsrfTools): Router {
  const { sequelize, config, clock } = deps;
  const router = Router();

  router.post('/session', requires.public('signing in'), async (req: Request, res: Response) => {
    // passport-local would also read credentials from the query string; passwords never travel in URLs.
    if (req.query && ('password' in req.query || 'email' in req.query)) {
      throw new AppError('Send credentials in the request body, never in the address', { status: 400, code: 'credentials_in_query' });
    }
    // Validated first: a malformed request is a 400 and never counts as a failed sign-in.
    const credentials = parseBody(SignInSchema, req);
    // passport reads req.body: hand it the trimmed, case-folded e-mail.
    req.body = { ...req.body, email: credentials.email };
    const pausedUntil = await addressLockedUntil(sequelize, req.ip ?? 'unknown', clock.now());
    if (pausedUntil) {
      res.setHeader('Retry-After', String(Math.max(1, Math.ceil((pausedUntil.getTime() - clock.now().getTime()) / 1000))));
      throw new AppError('Too many failed sign-ins from this address; wait a few minutes and try again', { status: 429, code: 'too_many_attempts' });
    }
    const user = await new Promise<{ id: number } | false>((resolve, reject) => {
      passport.authenticate('local', { session: false }, (error: unknown, found: { id: number } | false) => {
        if (error) reject(error);
        else resolve(found);
      })(req, res, () => undefined);
    });
    if (!user) throw new AppError(SIGN_IN_REFUSED.message, { status: SIGN_IN_REFUSED.status, code: SIGN_IN_REFUSED.code });
    // req.logIn regenerates the session: a new id at every sign-in (no fixation).
    await new Promise<void>((resolve, reject) => req.logIn(user, (error) => (error ? reject(error) : resolve())));
    const now = Date.now();
    req.session.signedInAt = now;
    req.session.lastSeenAt = now;
    const sessionUser = await loadActiveSessionUser(user.id);
    if (!sessionUser) throw new AppError(SIGN_IN_REFUSED.message, { status: SIGN_IN_REFUSED.status, code: SIGN_IN_REFUSED.code });
    await recordTrail(sequelize, { userId: user.id, recordType: 'user', recordId: user.id, event: 'SIGNED_IN' });
    res.json(sessionBody(req, sessionUser, csrf, true));
  });

  router.get('/session', requires.signedIn('the session of whoever asks'), (req, res) => {
    res.json(sessionBody(req, res.locals.user!, csrf, false));
  });

  // Choosing a new password: the person's own, or the one an administrator set must be replaced.
  router.post('/session/password', requires.signedIn('a person changes their own password'), async (req, res) => {
    const input = parseBody(PasswordChangeSchema, req);
    await changeOwnPassword(deps, { userId: res.locals.user!.id, sid: req.sessionID }, input);
    const sessionUser = await loadActiveSessionUser(res.locals.user!.id);
    if (!sessionUser) throw new AppError('Sign in first', { status: 401, code: 'unauthenticated' });
    res.json(sessionBody(req, sessionUser, csrf, false));
  });

  router.delete('/session', requires.signedIn('signing out'), async (req, res) => {
    const userId = res.locals.user!.id;
    await new Promise<void>((resolve, reject) => req.logout((error) => (error ? reject(error) : resolve())));
    await new Promise<void>((resolve, reject) => req.session.destroy((error) => (error ? reject(error) : resolve())));
    await recordTrail(sequelize, { userId, recordType: 'user', recordId: userId, event: 'SIGNED_OUT' });
    res.clearCookie(SESSION_COOKIE, { path: '/', httpOnly: true, sameSite: 'lax', secure: config.session.cookieSecure });
    res.status(204).end();
  });

  return router;
}
