// Deny by default: every API route declares what it needs with one of these
// guards. A route that declares nothing answers 500 (see denyUndeclared) and a
// test walks the router to make sure none is left undeclared.
import type { RequestHandler } from 'express';
import type { AppAction, SubjectName } from '../../shared/abilities';
import { forbiddenMessage } from '../../shared/labels/permissions';
import { AppError } from '../lib/app-error';

export const REQUIREMENT = Symbol.for('whorl.requirement');

export type Requirement =
  | { kind: 'public'; reason: string }
  | { kind: 'signed-in'; reason: string }
  | { kind: 'can'; action: AppAction; subject: SubjectName };

type GuardHandler = RequestHandler & { [REQUIREMENT]: Requirement };

function mark(requirement: Requirement, handler: RequestHandler): GuardHandler {
  return Object.assign(handler, { [REQUIREMENT]: requirement });
}

const unauthenticated = () => new AppError('Sign in first', { status: 401, code: 'unauthenticated' });

export const requires = {
  /** Open to anyone (sign-in, health). Give the reason: it shows in reviews. */
  public(reason: string): GuardHandler {
    return mark({ kind: 'public', reason }, (_req, res, next) => {
      res.locals.requirement = 'public';
      next();
    });
  },
  /** Any signed-in user; the service checks the loaded record's rule itself. */
  signedIn(reason: string): GuardHandler {
    return mark({ kind: 'signed-in', reason }, (_req, res, next) => {
      if (!res.locals.user) return next(unauthenticated());
      res.locals.requirement = 'signed-in';
      next();
    });
  },
  /** A CASL rule on the subject type, checked before any work is done. */
  can(action: AppAction, subject: SubjectName): GuardHandler {
    return mark({ kind: 'can', action, subject }, (_req, res, next) => {
      const { user, ability } = res.locals;
      if (!user || !ability) return next(unauthenticated());
      if (!ability.can(action, subject)) {
        return next(new AppError(forbiddenMessage(action, subject), { status: 403, code: 'forbidden' }));
      }
      res.locals.requirement = 'can';
      next();
    });
  },
};

/** Refuses any API response from a handler whose route declared no requirement. */
export const denyUndeclared: RequestHandler = (_req, res, next) => {
  const json = res.json.bind(res);
  res.json = (body: unknown) => {
    if (!res.locals.requirement) {
      res.status(500);
      return json({ error: { code: 'undeclared_route', message: 'This route declares no access rule' } });
    }
    return json(body);
  };
  next();
};
