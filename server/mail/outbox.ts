// Writing mail: always into the outbox, inside the caller's transaction, so a
// message exists exactly when the change that causes it commits. A recipient
// who chose the daily digest gets the message held for it instead.
import { Op, type Transaction } from 'sequelize';
import { OutboxMessage, User } from '../models';
import type { RenderedMail } from './render';

export interface OutboxDraft {
  /** What the message is about, e.g. 'action-assigned', 'action-overdue'. */
  kind: string;
  toUserId: number;
  mail: RenderedMail;
  recordType?: string;
  recordId?: number | string;
  /** Makes the message unique (reminders: record, kind and day); a second insert is ignored. */
  dedupeKey?: string;
}

/** Queues messages for active recipients; returns how many were offered (duplicates are dropped silently). */
export async function enqueueMail(transaction: Transaction, drafts: OutboxDraft[], now: Date): Promise<number> {
  if (!drafts.length) return 0;
  const ids = [...new Set(drafts.map((draft) => draft.toUserId))];
  const people = await User.findAll({ where: { id: { [Op.in]: ids }, active: true }, attributes: ['id', 'email', 'mailDigest'], transaction });
  const byId = new Map(people.map((person) => [person.id, person]));
  const rows = drafts.flatMap((draft) => {
    const person = byId.get(draft.toUserId);
    if (!person) return [];
    return [{
      kind: draft.kind,
      toUserId: person.id,
      toAddress: person.email,
      subject: draft.mail.subject.slice(0, 255),
      textBody: draft.mail.text,
      htmlBody: draft.mail.html,
      recordType: draft.recordType ?? null,
      recordId: draft.recordId === undefined ? null : String(draft.recordId),
      dedupeKey: draft.dedupeKey ? `${draft.dedupeKey}:to:${person.id}`.slice(0, 191) : null,
      status: person.mailDigest ? ('held' as const) : ('pending' as const),
      nextAttemptAt: now,
    }];
  });
  if (!rows.length) return 0;
  // INSERT IGNORE: a reminder already queued for this record, kind, day and person stays as it is.
  await OutboxMessage.bulkCreate(rows, { transaction, ignoreDuplicates: true });
  return rows.length;
}
