import type { OutboxMessage } from '../models';
import type { NotificationStatus, NotificationView } from '../../shared/schemas/notifications';
import { notificationKindLabel } from '../../shared/labels/notification-kinds';

const RECORD_PATHS: Record<string, (id: string) => string> = {
  action: (id) => `/actions/${id}`,
  finding: (id) => `/findings/${id}`,
  audit: (id) => `/audits/${id}`,
  certification: () => '/registers',
};

const STATUS_LABELS: Record<NotificationStatus, string> = {
  sending: 'Being sent',
  retrying: 'Not yet accepted by the mail server; Whorl keeps trying',
  sent: 'Sent',
  held_for_digest: 'Held for the next daily digest',
  sent_in_digest: 'Sent in a daily digest',
};

function statusOf(row: OutboxMessage, digest: OutboxMessage | null): { status: NotificationStatus; sentAt: Date | null } {
  switch (row.status) {
    case 'sent':
      return { status: 'sent', sentAt: row.sentAt };
    case 'held':
      return { status: 'held_for_digest', sentAt: null };
    case 'digested':
      // The digest itself may still be on its way.
      return digest?.status === 'sent' ? { status: 'sent_in_digest', sentAt: digest.sentAt } : { status: 'sending', sentAt: null };
    default:
      return { status: row.attempts > 0 ? 'retrying' : 'sending', sentAt: null };
  }
}

export function presentNotification(row: OutboxMessage, related: { digest: OutboxMessage | null; recipientName: string | null }): NotificationView {
  const { status, sentAt } = statusOf(row, related.digest);
  const path = row.recordType && row.recordId ? RECORD_PATHS[row.recordType]?.(row.recordId) : undefined;
  return {
    id: row.id,
    subject: row.subject,
    kindLabel: notificationKindLabel(row.kind),
    recipient: { id: row.toUserId, displayName: related.recipientName, address: row.toAddress },
    createdAt: row.createdAt.toISOString(),
    status,
    statusLabel: STATUS_LABELS[status],
    sentAt: sentAt ? sentAt.toISOString() : null,
    recordPath: path ?? null,
    text: row.textBody,
  };
}
