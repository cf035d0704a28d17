import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import { parseBody, parseParams } from '../lib/validate';
import { IdParamSchema } from '../../shared/schemas/common';
import { AreaCreateSchema, AreaUpdateSchema, type AreaView } from '../../shared/schemas/area';
import { Area, User } from '../models';
import { appendTrail } from '../services/trail.service';
import { AppError, notFound } from '../lib/app-error';
import type { AppDeps } from '../app-deps';

function presentArea(area: Area & { lead?: User | null }): AreaView {
  return { id: area.id, code: area.code, name: area.name, leadUserId: area.leadUserId, leadName: area.lead?.displayName ?? null };
}

async function requireLeadUser(leadUserId: number | null | undefined) {
  if (leadUserId == null) return;
  if (!(await User.findByPk(leadUserId, { attributes: ['id'] }))) {
    throw new AppError('Some body fields are not valid', { status: 400, code: 'invalid_input', details: [{ path: 'leadUserId', message: 'no such user' }] });
  }
}

export function areaRoutes({ sequelize }: AppDeps): Router {
  const router = Router();
  const include = [{ model: User, as: 'lead', attributes: ['id', 'displayName'] }];

  router.get('/areas', requires.can('read', 'Area'), async (_req, res) => {
    const areas = await Area.findAll({ include, order: [['name', 'ASC']] });
    res.json({ items: areas.map(presentArea), total: areas.length });
  });

  router.post('/areas', requires.can('create', 'Area'), async (req, res) => {
    const input = parseBody(AreaCreateSchema, req);
    await requireLeadUser(input.leadUserId);
    const area = await sequelize.transaction(async (transaction) => {
      const created = await Area.create(input, { transaction });
      await appendTrail(sequelize, transaction, {
        userId: res.locals.user!.id,
        recordType: 'area',
        recordId: created.id,
        event: 'AREA_CREATED',
        changes: input,
      });
      return created;
    });
    res.status(201).json(presentArea((await Area.findByPk(area.id, { include }))!));
  });

  router.patch('/areas/:id', requires.can('update', 'Area'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const input = parseBody(AreaUpdateSchema, req);
    await requireLeadUser(input.leadUserId);
    await sequelize.transaction(async (transaction) => {
      const area = await Area.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!area) throw notFound('Area');
      const changes: Record<string, { before: unknown; after: unknown }> = {};
      for (const [key, value] of Object.entries(input) as [keyof typeof input, unknown][]) {
        if (value !== undefined && area.get(key) !== value) changes[key] = { before: area.get(key), after: value };
      }
      await area.update(input, { transaction });
      await appendTrail(sequelize, transaction, { userId: res.locals.user!.id, recordType: 'area', recordId: id, event: 'AREA_UPDATED', changes });
    });
    res.json(presentArea((await Area.findByPk(id, { include }))!));
  });

  return router;
}
