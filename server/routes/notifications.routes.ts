// Each person's messages and delivery choice (GET /api/notifications, /api/notifications/:id,
// GET and PATCH /api/me/delivery). Administrators may read everyone's.
import { subject } from '@casl/ability';
import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import { parseBody, parseParams, parseQuery } from '../lib/validate';
import { IdParamSchema } from '../../shared/schemas/common';
import { DeliveryPreferenceSchema, NotificationListQuerySchema } from '../../shared/schemas/notifications';
import { getDelivery, getNotification, listNotifications, setDelivery, type NotificationReader } from '../services/notifications.service';
import type { AppDeps } from '../app-deps';
import type { Response } from 'express';

function readerOf(res: Response): NotificationReader {
  const user = res.locals.user!;
  // May this reader open a message addressed to somebody else? (Administrators only.)
  return { id: user.id, readsEveryone: res.locals.ability!.can('read', subject('Notification', { toUserId: 0 })) };
}

export function notificationRoutes(deps: AppDeps): Router {
  const router = Router();

  router.get('/notifications', requires.can('read', 'Notification'), async (req, res) => {
    const query = parseQuery(NotificationListQuerySchema, req);
    res.json(await listNotifications(readerOf(res), query));
  });

  router.get('/notifications/:id', requires.can('read', 'Notification'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    res.json(await getNotification(readerOf(res), id));
  });

  router.get('/me/delivery', requires.signedIn('a person reads their own delivery choice'), async (_req, res) => {
    res.json(await getDelivery(deps, res.locals.user!.id));
  });

  router.patch('/me/delivery', requires.signedIn('a person sets their own delivery choice'), async (req, res) => {
    const input = parseBody(DeliveryPreferenceSchema, req);
    res.json(await setDelivery(deps, res.locals.user!.id, input.delivery, input.version));
  });

  return router;
}
