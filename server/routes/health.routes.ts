import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import type { AppDeps } from '../app-deps';

export function healthRoutes({ sequelize }: AppDeps): Router {
  const router = Router();
  router.get('/health', requires.public('monitoring probes call it without a session'), async (_req, res) => {
    try {
      await sequelize.query('SELECT 1');
      res.json({ ok: true, database: 'up' });
    } catch {
      res.status(503).json({ ok: false, database: 'down' });
    }
  });
  return router;
}
