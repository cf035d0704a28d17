import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import { parseBody, parseParams, parseQuery } from '../lib/validate';
import { IdParamSchema } from '../../shared/schemas/common';
import { MaterialCreateSchema, MaterialListQuerySchema, MaterialUpdateSchema } from '../../shared/schemas/technique-register';
import { createMaterial, listMaterials, updateMaterial } from '../services/material.service';
import type { AppDeps } from '../app-deps';

export function materialRoutes({ sequelize }: AppDeps): Router {
  const router = Router();

  router.get('/materials', requires.can('read', 'Material'), async (req, res) => {
    const { q } = parseQuery(MaterialListQuerySchema, req);
    res.json(await listMaterials(q));
  });

  router.post('/materials', requires.can('create', 'Material'), async (req, res) => {
    const input = parseBody(MaterialCreateSchema, req);
    res.status(201).json(await createMaterial(sequelize, res.locals.user!.id, input));
  });

  router.patch('/materials/:id', requires.can('update', 'Material'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const input = parseBody(MaterialUpdateSchema, req);
    res.json(await updateMaterial(sequelize, res.locals.user!.id, id, input));
  });

  return router;
}
