import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import { parseBody, parseParams, parseQuery } from '../lib/validate';
import { IdParamSchema } from '../../shared/schemas/common';
import { UserCreateSchema, UserListQuerySchema, UserUpdateSchema } from '../../shared/schemas/user';
import { createUser, listUsers, unlockUser, updateUser } from '../services/user-admin.service';
import type { AppDeps } from '../app-deps';
import { User } from '../models';
import { userIncludes } from '../services/user-loader';
import { presentUser } from '../presenters/user.presenter';
import { notFound } from '../lib/app-error';

export function userRoutes(deps: AppDeps): Router {
  const router = Router();

  router.get('/users', requires.can('read', 'User'), async (req, res) => {
    res.json(await listUsers(parseQuery(UserListQuerySchema, req)));
  });

  router.get('/users/:id', requires.can('read', 'User'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const user = await User.findByPk(id, { include: userIncludes });
    if (!user) throw notFound('User');
    res.json(presentUser(user));
  });

  router.post('/users', requires.can('create', 'User'), async (req, res) => {
    const input = parseBody(UserCreateSchema, req);
    res.status(201).json(await createUser(deps, res.locals.user!.id, input));
  });

  router.patch('/users/:id', requires.can('update', 'User'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const input = parseBody(UserUpdateSchema, req);
    res.json(await updateUser(deps, res.locals.user!.id, id, input));
  });

  router.post('/users/:id/unlock', requires.can('unlock', 'User'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    res.json(await unlockUser(deps, res.locals.user!.id, id));
  });

  return router;
}
