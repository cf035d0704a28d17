import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import { parseQuery } from '../lib/validate';
import { TrailQuerySchema, type TrailVerificationView } from '../../shared/schemas/trail';
import { readRecordTrail } from '../services/trail-read.service';
import { verifyTrail } from '../services/trail.service';
import type { AppDeps } from '../app-deps';

export function trailRoutes({ sequelize, config }: AppDeps): Router {
  const router = Router();

  // A record's timeline: readable by everyone who may read the record (all signed-in users).
  // The record is a number ("F-2026-0015"), a technique code or "type:id"; entries come in words.
  router.get('/trail', requires.signedIn('every signed-in user may read a record and its timeline'), async (req, res) => {
    const { record, limit } = parseQuery(TrailQuerySchema, req);
    res.json(await readRecordTrail({ sequelize, config }, record, limit));
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
