import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { requires } from '../middlewares/authorize';
import type { AppDeps } from '../app-deps';

/** How long the probe waits for the database: the answer comes within a second whatever the database does. */
export const HEALTH_PING_TIMEOUT_MS = 800;

/** SELECT 1 against its own timer: a hung server (stopped, not dead) reads as down instead of holding the probe. */
async function pingDatabase(sequelize: Sequelize, timeoutMs: number): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<false>((resolve) => {
    timer = setTimeout(() => resolve(false), timeoutMs);
  });
  const ping = sequelize.query('SELECT 1').then(
    () => true,
    () => false,
  );
  try {
    return await Promise.race([ping, timeout]);
  } finally {
    clearTimeout(timer);
  }
}

export function healthRoutes({ sequelize }: AppDeps): Router {
  const router = Router();
  router.get('/health', requires.public('monitoring probes call it without a session'), async (_req, res) => {
    if (await pingDatabase(sequelize, HEALTH_PING_TIMEOUT_MS)) {
      res.json({ ok: true, database: 'up' });
    } else {
      res.setHeader('Retry-After', '5');
      res.status(503).json({ ok: false, database: 'down' });
    }
  });
  return router;
}
