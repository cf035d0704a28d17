// A notice is one message to several people: the same content, rendered with
// each person's name and written to the outbox once per person.
import type { Sequelize, Transaction } from 'sequelize';
import { enqueueMail, type OutboxDraft } from './outbox';
import { recordUrl, renderMail } from './render';
import { displayNames } from './record-facts';

export interface Notice {
  kind: string;
  to: number[];
  subject: string;
  paragraphs: string[];
  /** Client path of the record ("/actions/12"); made absolute with PUBLIC_URL. */
  path: string;
  linkLabel: string;
  recordType: string;
  recordId: number;
  /** Reminders: unique per record, kind and day (the recipient is added per message). */
  dedupeKey?: string;
}

export async function queueNotices(
  sequelize: Sequelize,
  transaction: Transaction,
  notices: Notice[],
  { publicUrl, now, exceptUserId }: { publicUrl: string; now: Date; exceptUserId?: number | null },
): Promise<number> {
  const everyone = [...new Set(notices.flatMap((notice) => notice.to))];
  const names = await displayNames(sequelize, everyone, transaction);
  const drafts: OutboxDraft[] = [];
  for (const notice of notices) {
    for (const userId of new Set(notice.to)) {
      if (userId === exceptUserId || !names.has(userId)) continue;
      drafts.push({
        kind: notice.kind,
        toUserId: userId,
        recordType: notice.recordType,
        recordId: notice.recordId,
        dedupeKey: notice.dedupeKey,
        mail: renderMail({
          subject: notice.subject,
          greeting: `Hello ${names.get(userId)},`,
          paragraphs: notice.paragraphs,
          link: { label: notice.linkLabel, url: recordUrl(publicUrl, notice.path) },
        }),
      });
    }
  }
  return enqueueMail(transaction, drafts, now);
}
