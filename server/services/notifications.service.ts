// Each person's notification history, read from the outbox (every message Whorl
// sends passes through it), and their choice of delivery. Administrators may
// read anyone's history, to answer "did the reminder go out?".
import { Op, type WhereOptions } from 'sequelize';
import type { AppDeps } from '../app-deps';
import { OutboxMessage, User } from '../models';
import { forbidden, notFound, staleVersion } from '../lib/app-error';
import { appendTrail } from './trail.service';
import type { ListResponse } from '../../shared/schemas/common';
import type { Delivery, DeliveryView, NotificationListQuery, NotificationView } from '../../shared/schemas/notifications';
import { presentNotification } from '../presenters/notification.presenter';

export interface NotificationReader {
  id: number;
  /** Administrators read everyone's messages; others only their own. */
  readsEveryone: boolean;
}

function recipientClause(reader: NotificationReader, person: NotificationListQuery['person']): WhereOptions {
  if (person === 'me' || person === reader.id) return { toUserId: reader.id };
  if (!reader.readsEveryone) throw forbidden('You may read only the messages sent to you');
  return person === 'all' ? {} : { toUserId: person };
}

async function present(rows: OutboxMessage[]): Promise<NotificationView[]> {
  const digestIds = [...new Set(rows.flatMap((row) => (row.digestId === null ? [] : [row.digestId])))];
  const userIds = [...new Set(rows.flatMap((row) => (row.toUserId === null ? [] : [row.toUserId])))];
  const [digests, people] = await Promise.all([
    digestIds.length ? OutboxMessage.findAll({ where: { id: { [Op.in]: digestIds } }, attributes: ['id', 'status', 'sentAt'] }) : [],
    userIds.length ? User.findAll({ where: { id: { [Op.in]: userIds } }, attributes: ['id', 'displayName'] }) : [],
  ]);
  const digestById = new Map(digests.map((digest) => [digest.id, digest]));
  const nameById = new Map(people.map((person) => [person.id, person.displayName]));
  return rows.map((row) =>
    presentNotification(row, {
      digest: row.digestId === null ? null : (digestById.get(row.digestId) ?? null),
      recipientName: row.toUserId === null ? null : (nameById.get(row.toUserId) ?? null),
    }),
  );
}

export async function listNotifications(reader: NotificationReader, query: NotificationListQuery): Promise<ListResponse<NotificationView>> {
  const where: WhereOptions = {
    ...recipientClause(reader, query.person),
    ...(query.q ? { subject: { [Op.like]: `%${query.q.replace(/[\\%_]/g, '\\$&')}%` } } : {}),
  };
  const { rows, count } = await OutboxMessage.findAndCountAll({
    where,
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return { items: await present(rows), total: count };
}

export async function getNotification(reader: NotificationReader, id: number): Promise<NotificationView> {
  const row = await OutboxMessage.findByPk(id);
  // Someone else's message is "not found" to a reader who may not see it: its existence is not theirs to know.
  if (!row || (!reader.readsEveryone && row.toUserId !== reader.id)) throw notFound('Message');
  return (await present([row]))[0];
}

export async function getDelivery(deps: AppDeps, userId: number): Promise<DeliveryView> {
  const user = await User.findByPk(userId, { attributes: ['id', 'mailDigest', 'version'] });
  if (!user) throw notFound('User');
  return { delivery: user.mailDigest ? 'daily_digest' : 'immediate', digestHourUtc: deps.config.reminders.digestHourUtc, version: user.version };
}

/**
 * A person's own choice. Messages already held for a digest stay in it; from now
 * on new messages follow the new choice.
 */
export async function setDelivery(deps: AppDeps, userId: number, delivery: Delivery, version: number): Promise<DeliveryView> {
  await deps.sequelize.transaction(async (transaction) => {
    const user = await User.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw notFound('User');
    if (user.version !== version) throw staleVersion();
    const mailDigest = delivery === 'daily_digest';
    if (user.mailDigest === mailDigest) return;
    await appendTrail(deps.sequelize, transaction, {
      userId,
      recordType: 'user',
      recordId: userId,
      event: 'MAIL_DELIVERY_CHANGED',
      changes: { delivery: { from: user.mailDigest ? 'daily_digest' : 'immediate', to: delivery } },
      at: deps.clock.now(),
    });
    user.mailDigest = mailDigest;
    await user.save({ transaction });
  });
  return getDelivery(deps, userId);
}
