import { Router, type Request, type Response } from 'express';
import { packRules } from '@casl/ability/extra';
import rateLimit from 'express-rate-limit';
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

export interface CsrfTools {
  generateToken(req: Request, overwrite?: boolean): string;
}

const SIGN_IN_REFUSALS: Record<string, { status: number; code: string; message: string }> = {
  invalid: { status: 401, code: 'invalid_credentials', message: 'The e-mail address or password is not right' },
  inactive: { status: 401, code: 'invalid_credentials', message: 'The e-mail address or password is not right' },
  locked: {
    status: 423,
    code: 'account_locked',
    message: 'This account is locked after too many failed sign-ins; ask an administrator to unlock it',
  },
};

function sessionBody(req: Request, user: SessionUser, csrf: CsrfTools, fresh: boolean): SessionResponse {
  return {
    user,
    rules: packRules(defineAbilityFor(user).rules),
    csrfToken: fresh || !req.session.csrfToken ? csrf.generateToken(req, true) : req.session.csrfToken,
  };
}

export function sessionRoutes({ sequelize, config }: AppDeps, passport: PassportStatic, csrf: CsrfTools): Router {
  const router = Router();

  // Per IP, counting failed attempts only: the (limit+1)th failure inside the window is 429.
  const signInLimiter = rateLimit({
    windowMs: config.signIn.rateWindowMinutes * 60_000,
    limit: config.signIn.rateLimit,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    handler: (_req, res, _next, options) => {
      res.locals.requirement = 'public';
      res.setHeader('Retry-After', String(Math.ceil(options.windowMs / 1000)));
      res.status(429).json({
        error: { code: 'too_many_attempts', message: 'Too many failed sign-ins from this address; wait and try again' },
      });
    },
  });

  router.post('/session', requires.public('signing in'), signInLimiter, async (req: Request, res: Response) => {
    // passport-local would also read credentials from the query string; passwords never travel in URLs.
    if (req.query && ('password' in req.query || 'email' in req.query)) {
      throw new AppError('Send credentials in the request body, never in the address', { status: 400, code: 'credentials_in_query' });
    }
    parseBody(SignInSchema, req);
    const { user, info } = await new Promise<{ user: { id: number } | false; info?: { message?: string } }>((resolve, reject) => {
      passport.authenticate('local', { session: false }, (error: unknown, found: { id: number } | false, details?: { message?: string }) => {
        if (error) reject(error);
        else resolve({ user: found, info: details });
      })(req, res, () => undefined);
    });
    if (!user) {
      const refusal = SIGN_IN_REFUSALS[info?.message ?? 'invalid'] ?? SIGN_IN_REFUSALS.invalid;
      throw new AppError(refusal.message, { status: refusal.status, code: refusal.code });
    }
    // req.logIn regenerates the session: a new id at every sign-in (no fixation).
    await new Promise<void>((resolve, reject) => req.logIn(user, (error) => (error ? reject(error) : resolve())));
    const now = Date.now();
    req.session.signedInAt = now;
    req.session.lastSeenAt = now;
    const sessionUser = await loadActiveSessionUser(user.id);
    if (!sessionUser) throw new AppError('This account cannot sign in', { status: 401, code: 'invalid_credentials' });
    await recordTrail(sequelize, { userId: user.id, recordType: 'user', recordId: user.id, event: 'SIGNED_IN' });
    res.json(sessionBody(req, sessionUser, csrf, true));
  });

  router.get('/session', requires.signedIn('the session of whoever asks'), (req, res) => {
    res.json(sessionBody(req, res.locals.user!, csrf, false));
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
