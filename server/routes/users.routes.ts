import { Router, type Request, type Response } from 'express';
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

  // Lock state and pending password changes are shown to administrators only.
  const audience = (res: Response) => ({ administrator: res.locals.ability!.can('unlock', 'User'), now: deps.clock.now() });
  const actor = (req: Request, res: Response) => ({ id: res.locals.user!.id, ability: res.locals.ability!, sid: req.sessionID });

  router.get('/users', requires.can('read', 'User'), async (req, res) => {
    res.json(await listUsers(parseQuery(UserListQuerySchema, req), audience(res)));
  });

  router.get('/users/:id', requires.can('read', 'User'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const user = await User.findByPk(id, { include: userIncludes });
    if (!user) throw notFound('User');
    res.json(presentUser(user, audience(res)));
  });

  router.post('/users', requires.can('create', 'User'), async (req, res) => {
    const input = parseBody(UserCreateSchema, req);
    res.status(201).json(await createUser(deps, actor(req, res), input));
  });

  router.patch('/users/:id', requires.can('update', 'User'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const input = parseBody(UserUpdateSchema, req);
    res.json(await updateUser(deps, actor(req, res), id, input));
  });

  router.post('/users/:id/unlock', requires.can('unlock', 'User'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    res.json(await unlockUser(deps, actor(req, res), id));
  });

  return router;
}
