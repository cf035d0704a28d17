// The daily digest for people who chose it (users.mail_digest): from the
// configured hour (UTC), everything held for them goes out as one message,
// once a day (unique key digest:<user>:<day>).
import { Op, QueryTypes } from 'sequelize';
import { OutboxMessage } from '../models';
import { enqueueMail } from '../mail/outbox';
import { recordUrl } from '../mail/render';
import { isoDay } from './reminder-sources';
import type { ScheduledJob } from './scheduler';
import { readTrailHead } from '../services/trail.service';

const escapeHtml = (value: string) => value.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
const linkIn = (text: string) => text.match(/https?:\/\/\S+/)?.[0] ?? null;

export const digestJob: ScheduledJob = {
  name: 'daily-digest',
  everySeconds: 15 * 60,
  async run(deps, transaction, now) {
    if (now.getUTCHours() < deps.config.reminders.digestHourUtc) return;
    const today = isoDay(now);
    const people = await deps.sequelize.query<{ to_user_id: number; display_name: string }>(
      `SELECT DISTINCT o.to_user_id, u.display_name FROM outbox_messages o JOIN users u ON u.id = o.to_user_id
        WHERE o.status = 'held' AND o.created_at <= ?`,
      { replacements: [now], type: QueryTypes.SELECT, transaction },
    );
    // Printed in every digest: a copy of the trail's head in each reader's mailbox, outside the database.
    const head = people.length ? await readTrailHead(deps.sequelize) : null;
    const headLine = head ? `Trail head at ${now.toISOString().slice(0, 16).replace('T', ' ')} UTC: sequence ${head.seq}, hash ${head.hash}` : '';
    for (const person of people) {
      const userId = Number(person.to_user_id);
      const digestKey = `digest:${userId}:${today}:to:${userId}`;
      // Today's digest already went out: what arrived since waits for tomorrow's.
      if (await OutboxMessage.count({ where: { dedupeKey: digestKey }, transaction })) continue;
      const held = await OutboxMessage.findAll({
        where: { toUserId: userId, status: 'held', createdAt: { [Op.lte]: now } },
        order: [['id', 'ASC']],
        transaction,
        lock: transaction.LOCK.UPDATE,
      });
      if (!held.length) continue;
      const items = held.map((message) => ({ subject: message.subject, link: linkIn(message.textBody) }));
      const subject = `Whorl daily digest for ${today}: ${items.length} ${items.length === 1 ? 'item' : 'items'}`;
      const text = [
        `Hello ${person.display_name},`,
        '',
        `Here is what Whorl had for you since your last digest:`,
        '',
        ...items.map((item) => `• ${item.subject}${item.link ? `\n  ${item.link}` : ''}`),
        '',
        `Home page: ${recordUrl(deps.config.publicUrl, '/')}`,
        '',
        headLine,
      ].join('\n');
      const html = [
        `<p>Hello ${escapeHtml(person.display_name)},</p><p>Here is what Whorl had for you since your last digest:</p><ul>`,
        ...items.map((item) => `<li>${item.link ? `<a href="${escapeHtml(item.link)}">${escapeHtml(item.subject)}</a>` : escapeHtml(item.subject)}</li>`),
        '</ul>',
        `<p style="font-family:monospace;font-size:11px;color:#555">${escapeHtml(headLine)}</p>`,
      ].join('\n');
      await enqueueMail(
        transaction,
        [{ kind: 'daily-digest', toUserId: userId, mail: { subject, text, html }, dedupeKey: `digest:${userId}:${today}` }],
        now,
      );
      const [digest] = await deps.sequelize.query<{ id: number }>(
        `SELECT id FROM outbox_messages WHERE dedupe_key = ?`,
        { replacements: [digestKey], type: QueryTypes.SELECT, transaction },
      );
      // No row: the person was deactivated meanwhile; their held mail stays held.
      if (!digest) continue;
      // The digest row itself must go out even though this person holds mail: send it as pending.
      await OutboxMessage.update({ status: 'pending' }, { where: { id: digest.id, status: 'held' }, transaction });
      await OutboxMessage.update({ status: 'digested', digestId: digest.id }, { where: { id: held.map((message) => message.id) }, transaction });
    }
  },
};
