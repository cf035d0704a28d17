import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import { parseQuery } from '../lib/validate';
import { TrailQuerySchema, type TrailEntryView, type TrailVerificationView } from '../../shared/schemas/trail';
import { TrailEntry, User } from '../models';
import { verifyTrail } from '../services/trail.service';
import type { AppDeps } from '../app-deps';
import { assertMayReadTrail } from '../services/trail-read-access';

export function trailRoutes({ sequelize }: AppDeps): Router {
  const router = Router();

  // A record's timeline, for whoever may read the record (people's and evidence timelines are narrower).
  router.get('/trail', requires.can('read', 'Trail'), async (req, res) => {
    const { record, limit } = parseQuery(TrailQuerySchema, req);
    const [recordType, recordId] = record.split(':');
    await assertMayReadTrail(sequelize, res.locals.ability!, recordType, recordId);
    const entries = await TrailEntry.findAll({ where: { recordType, recordId }, order: [['seq', 'ASC']], limit });
    const userIds = [...new Set(entries.map((entry) => entry.userId).filter((id): id is number => id !== null))];
    const users = userIds.length ? await User.findAll({ where: { id: userIds }, attributes: ['id', 'displayName'] }) : [];
    const names = new Map(users.map((user) => [user.id, user.displayName]));
    const items: TrailEntryView[] = entries.map((entry) => ({
      seq: Number(entry.seq),
      at: entry.at.toISOString(),
      userId: entry.userId,
      userName: entry.userId ? (names.get(entry.userId) ?? null) : null,
      recordType: entry.recordType,
      recordId: entry.recordId,
      event: entry.event,
      changes: entry.changes,
      hash: entry.hash,
    }));
    res.json({ items, total: items.length });
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
