// The admin mailbox: what the local SMTP fake caught (empty when a real SMTP server is configured).
import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import { parseParams, parseQuery } from '../lib/validate';
import { IdParamSchema } from '../../shared/schemas/common';
import { MailboxListQuerySchema, type CaughtMailSummary, type CaughtMailView } from '../../shared/schemas/mailbox';
import type { AppDeps } from '../app-deps';
import { CaughtMail, OutboxMessage } from '../models';
import { notFound } from '../lib/app-error';
import { Op } from 'sequelize';

function summary(mail: CaughtMail): CaughtMailSummary {
  return {
    id: mail.id,
    subject: mail.subject ?? '(no subject)',
    from: mail.fromHeader,
    to: Array.isArray(mail.envelopeTo) ? mail.envelopeTo : [],
    receivedAt: mail.receivedAt.toISOString(),
    messageId: mail.messageId,
  };
}

export function mailboxRoutes(deps: AppDeps): Router {
  const router = Router();

  router.get('/mailbox', requires.can('read', 'Mailbox'), async (req, res) => {
    const query = parseQuery(MailboxListQuerySchema, req);
    const where = query.q
      ? { [Op.or]: [{ subject: { [Op.like]: `%${query.q}%` } }, { toHeader: { [Op.like]: `%${query.q}%` } }] }
      : {};
    const { rows, count } = await CaughtMail.findAndCountAll({
      where,
      attributes: ['id', 'subject', 'fromHeader', 'envelopeTo', 'receivedAt', 'messageId'],
      order: [['receivedAt', 'DESC'], ['id', 'DESC']],
      limit: query.pageSize,
      offset: (query.page - 1) * query.pageSize,
    });
    // What is still waiting in the outbox, so an admin sees a mail server that refuses.
    const [pending, retrying, lastFailure] = await Promise.all([
      OutboxMessage.count({ where: { status: 'pending' } }),
      OutboxMessage.count({ where: { status: 'pending', attempts: { [Op.gt]: 0 } } }),
      OutboxMessage.findOne({ where: { status: 'pending', attempts: { [Op.gt]: 0 } }, order: [['updatedAt', 'DESC']], attributes: ['lastError', 'updatedAt'] }),
    ]);
    const outbox = { pending, retrying, lastError: lastFailure?.lastError ?? null };
    res.json({ items: rows.map(summary), total: count, catching: !deps.config.mail.smtpUrl, outbox });
  });

  router.get('/mailbox/:id', requires.can('read', 'Mailbox'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const mail = await CaughtMail.findByPk(id);
    if (!mail) throw notFound('Message');
    const view: CaughtMailView = { ...summary(mail), text: mail.textBody, html: mail.htmlBody };
    res.json(view);
  });

  return router;
}
