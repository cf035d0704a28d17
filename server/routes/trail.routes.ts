import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import { parseQuery } from '../lib/validate';
import { TrailQuerySchema, type TrailVerificationView } from '../../shared/schemas/trail';
import { readRecordTrail } from '../services/trail-read.service';
import { verifyTrail } from '../services/trail.service';
import type { AppDeps } from '../app-deps';
import { assertMayReadTrail } from '../services/trail-read-access';

export function trailRoutes({ sequelize, config }: AppDeps): Router {
  const router = Router();

  // A record's timeline, for whoever may read the record (people's and evidence timelines are narrower).
  // The record is a number ("F-2026-0015"), a technique code or "type:id"; entries come in words.
  router.get('/trail', requires.can('read', 'Trail'), async (req, res) => {
    const { record, limit } = parseQuery(TrailQuerySchema, req);
    const ability = res.locals.ability!;
    res.json(await readRecordTrail({ sequelize, config }, record, limit, (found) => assertMayReadTrail(sequelize, ability, found.type, found.id)));
  });

  router.get('/trail/verify', requires.can('verify', 'Trail'), async (_req, res) => {
    const started = performance.now();
    const result = await verifyTrail(sequelize);
    const body: TrailVerificationView = {
      ...result,
      checkedAt: new Date().toISOString(),
      durationMs: Math.round(performance.now() - started),
    };
    res.json(body);
  });

  return router;
}
