// createApp() builds the Express application and never listens: the tests use
// it directly, server/index.ts listens. Request flow: security headers → body
// parser → session → passport → timeouts → same-origin + CSRF → route guard →
// validation → service → presenter → JSON; errors end in one handler.
import express, { type Express } from 'express';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { csrfSync } from 'csrf-sync';
import type { AppDeps } from './app-deps';
import { initModels } from './models';
import { configureTrail } from './services/trail-anchors';
import { createHelmet, createSameOriginCheck } from './middlewares/security';
import { attachAbility, createSessionMiddleware, enforceSessionTimeouts, requireOwnPassword } from './middlewares/session';
import { denyUndeclared } from './middlewares/authorize';
import { refuseIllFormedText } from './middlewares/text-input';
import { createLoadShedding } from './middlewares/load-shedding';
import { apiNotFound, createErrorHandler } from './middlewares/error-handler';
import { createPassport } from './auth/passport';
import { healthRoutes } from './routes/health.routes';
import { sessionRoutes } from './routes/session.routes';
import { featureRoutes } from './routes';

export interface CreateAppOptions {
  /** Folder of the built client; served with an SPA fallback when it exists. */
  clientDir?: string;
}

export function createApp(deps: AppDeps, options: CreateAppOptions = {}): Express & { close(): void } {
  const { config, sequelize, logger } = deps;
  initModels(sequelize);
  configureTrail(config);

  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy ? 1 : false);
  // First: an overloaded process refuses extra work before spending anything on it.
  app.use(createLoadShedding({ maxInFlight: config.maxInFlightRequests }));
  app.use(createHelmet(config.session.cookieSecure));

  const api = express.Router();
  api.use(denyUndeclared);
  api.use(healthRoutes(deps));
  api.use(express.json({ limit: '100kb', strict: true }));
  api.use(refuseIllFormedText);

  const { middleware: sessionMiddleware, store } = createSessionMiddleware(sequelize, config);
  const passport = createPassport(deps);
  api.use(sessionMiddleware);
  api.use(passport.initialize());
  api.use(passport.session());
  api.use(enforceSessionTimeouts(config));
  api.use(attachAbility);
  api.use(createSameOriginCheck(() => config.publicUrl));

  const csrf = csrfSync({ getTokenFromRequest: (req) => req.get('x-csrf-token') });
  api.use((req, res, next) => {
    // Signing in carries no token yet (there is no session); the same-origin check above still applies.
    // Without a signed-in user there is nothing to forge: the route's guard answers 401.
    if ((req.method === 'POST' && req.path === '/session') || !res.locals.user) return next();
    csrf.csrfSynchronisedProtection(req, res, next);
  });

  api.use(requireOwnPassword);
  api.use(sessionRoutes(deps, passport, csrf));
  for (const factory of featureRoutes) api.use(factory(deps));
  api.use(apiNotFound);
  api.use(createErrorHandler(logger));
  app.use('/api', api);

  const clientDir = options.clientDir;
  if (clientDir && existsSync(path.join(clientDir, 'index.html'))) {
    app.use('/assets', express.static(path.join(clientDir, 'assets'), { immutable: true, maxAge: '1y', index: false }));
    app.use(express.static(clientDir, { index: false }));
    app.get('/{*splat}', (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      // root: the dot-folder check of `send` then looks only below the client folder.
      res.sendFile('index.html', { root: clientDir });
    });
  }
  // Outside /api: a plain message, never a stack trace.
  app.use(((error, _req, res, _next) => {
    logger.error('Unhandled error outside the API', error);
    res.status(500).type('text/plain').send('Something went wrong on the server.');
  }) as express.ErrorRequestHandler);

  return Object.assign(app, {
    close() {
      // The session store sweeps expired sessions on a timer; stop it with the app.
      (store as unknown as { stopExpiringSessions?: () => void }).stopExpiringSessions?.();
    },
  });
}
