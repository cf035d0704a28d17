import session from 'express-session';
import connectSessionSequelize from 'connect-session-sequelize';
import type { RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import type { AppConfig } from '../config/env';
import { defineAbilityFor } from '../../shared/abilities';
import type { SessionUser } from '../../shared/types/session';
import { AppError } from '../lib/app-error';

const SequelizeStore = connectSessionSequelize(session.Store);

export const SESSION_COOKIE = 'whorl.sid';

export function createSessionMiddleware(sequelize: Sequelize, config: AppConfig) {
  const absoluteMs = config.session.absoluteHours * 3_600_000;
  const store = new SequelizeStore({
    db: sequelize,
    table: 'Session',
    // The store does not check expiry on read (checked in enforceSessionTimeouts); sweep often anyway.
    checkExpirationInterval: 5 * 60_000,
    expiration: absoluteMs,
    // Touch is not needed: the idle clock lives in the session itself.
    ...({ disableTouch: true } as object),
  });
  const middleware = session({
    name: SESSION_COOKIE,
    secret: config.session.secret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: false,
    proxy: config.trustProxy,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.session.cookieSecure,
      maxAge: absoluteMs,
      path: '/',
    },
  });
  return { middleware, store };
}

/** Idle (default 30 min) and absolute (default 12 h) timeouts, checked on every request. */
export function enforceSessionTimeouts(config: AppConfig): RequestHandler {
  const idleMs = config.session.idleMinutes * 60_000;
  const absoluteMs = config.session.absoluteHours * 3_600_000;
  return (req, _res, next) => {
    const current = req.session;
    if (!current || !req.user) return next();
    const now = Date.now();
    const signedInAt = current.signedInAt ?? now;
    const lastSeenAt = current.lastSeenAt ?? now;
    if (now - lastSeenAt > idleMs || now - signedInAt > absoluteMs) {
      current.destroy(() => {
        req.user = undefined;
        next();
      });
      return;
    }
    // Refresh the idle clock at most once a minute: a session write per request is needless load.
    if (now - lastSeenAt > 60_000) current.lastSeenAt = now;
    next();
  };
}

/** Puts the signed-in user and their CASL ability on res.locals. */
export const attachAbility: RequestHandler = (req, res, next) => {
  const user = req.user as SessionUser | undefined;
  if (user && typeof user === 'object' && 'roles' in user) {
    res.locals.user = user;
    res.locals.ability = defineAbilityFor(user);
  }
  next();
};

/**
 * After an administrator set a person's password, that person may only read
 * their session, sign out, or choose a password of their own: the
 * administrator knows the one they set.
 */
export const requireOwnPassword: RequestHandler = (req, res, next) => {
  const user = res.locals.user as SessionUser | undefined;
  if (!user?.passwordChangeRequired || req.path === '/session' || req.path === '/session/password') return next();
  next(new AppError('Choose a new password first: an administrator set the one you signed in with', { status: 403, code: 'password_change_required' }));
};
