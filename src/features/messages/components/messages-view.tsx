// The notification history: every message Whorl sent, newest first, each with
// what it is about, where its delivery stands and the record it concerns.
// Administrators may read anyone's, and see whether the mail server keeps up.
import { Link } from 'react-router-dom';
import { useAbility } from '../../../lib/ability';
import { subject } from '@casl/ability';
import { Button } from '../../../components/ui/button';
import { FilterSearch, FilterSelect } from '../../../components/ui/list-filter';
import { EmptyState, ErrorNotice, Loading } from '../../../components/ui/states';
import { useListParams } from '../../../hooks/use-list-params';
import type { NotificationStatus, NotificationView } from '../../../../shared/schemas/notifications';
import { useDeliveryHealth, useNotifications, usePeople } from '../api/messages';
import { DeliveryChoice } from './delivery-choice';

const when = (iso: string) =>
  new Date(iso).toLocaleString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', timeZone: 'UTC' }) + ' UTC';

const STATUS_TONE: Record<NotificationStatus, string> = {
  sent: 'border-lagoon/40 text-ink',
  sent_in_digest: 'border-lagoon/40 text-ink',
  held_for_digest: 'border-ink/25 text-ink-soft',
  sending: 'border-ink/25 text-ink-soft',
  retrying: 'border-warn/50 text-ink',
};

function MessageCard({ message, showRecipient }: { message: NotificationView; showRecipient: boolean }) {
  return (
    <li className="rounded-lg border border-ink/10 bg-white p-3">
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <p className="text-xs font-bold text-lagoon">{message.kindLabel}</p>
        <p className="text-xs text-ink-soft">
          <time dateTime={message.createdAt}>{when(message.createdAt)}</time>
        </p>
      </div>
      <h3 className="mt-0.5 font-bold text-ink">{message.subject}</h3>
      <div className="mt-1 flex flex-wrap items-center gap-x-3 gap-y-1 text-sm">
        <span className={`rounded border px-1.5 py-0.5 text-xs ${STATUS_TONE[message.status]}`}>
          {message.statusLabel}
          {message.sentAt ? `, ${when(message.sentAt)}` : ''}
        </span>
        {showRecipient && (
          <span className="text-ink-soft">
            To {message.recipient.displayName ?? message.recipient.address}
          </span>
        )}
        {message.recordPath && (
          <Link className="font-bold text-lagoon underline" to={message.recordPath}>
            Open the record
          </Link>
        )}
      </div>
      <details className="mt-2 text-sm">
        <summary className="cursor-pointer text-ink-soft">Read the message</summary>
        <p className="mt-2 whitespace-pre-wrap rounded border border-ink/10 bg-paper p-3 text-ink">{message.text}</p>
      </details>
    </li>
  );
}

function DeliveryHealthNote() {
  const health = useDeliveryHealth(true);
  if (!health.data) return null;
  const { catching, outbox } = health.data;
  return (
    <div className="flex flex-col gap-2 text-sm">
      {catching && (
        <p className="rounded-md border border-ink/10 bg-white px-3 py-2 text-ink-soft">
          No mail server is configured, so a mail catcher inside Whorl receives every message instead of people's inboxes. Configure one to deliver them.
        </p>
      )}
      {outbox.retrying > 0 && (
        <p role="status" className="rounded-md border border-warn/40 bg-amber-50 px-3 py-2 text-ink">
          {outbox.retrying} {outbox.retrying === 1 ? 'message is' : 'messages are'} waiting because the mail server refused or could not be reached;
          Whorl keeps retrying and nothing is lost.
          {outbox.lastError ? <> The server last answered: {outbox.lastError}</> : null}
        </p>
      )}
    </div>
  );
}

export function MessagesView() {
  const ability = useAbility();
  // Reading a message addressed to someone else is the administrator's right only.
  const readsEveryone = ability.can('read', subject('Notification', { toUserId: 0 }));
  const list = useListParams({ pageSize: 20 });
  const person = readsEveryone ? (list.filters.person ?? 'me') : 'me';
  const messages = useNotifications({ ...list.query, person });
  const people = usePeople(readsEveryone);
  const items = messages.data?.items ?? [];
  const total = messages.data?.total ?? 0;
  const pages = Math.max(1, Math.ceil(total / list.pageSize));
  const showRecipient = person !== 'me';

  return (
    <div className="flex flex-col gap-4">
      <DeliveryChoice />
      {readsEveryone && <DeliveryHealthNote />}
      <section aria-labelledby="history-heading" className="flex flex-col gap-3">
        <h2 id="history-heading" className="font-bold text-ink">
          {person === 'me' ? 'Sent to you' : person === 'all' ? 'Sent to everyone' : 'Sent to the person chosen'}
        </h2>
        <div className="flex flex-wrap items-end gap-3">
          {readsEveryone && (
            <FilterSelect
              label="Whose messages"
              anyLabel="Mine"
              value={person === 'me' ? '' : person}
              options={[{ value: 'all', label: 'Everyone' }, ...(people.data?.items ?? []).map((user) => ({ value: String(user.id), label: user.displayName }))]}
              onChange={(value) => list.update({ person: value || null })}
            />
          )}
          <FilterSearch label="Search the subjects" placeholder="e.g. CA-2026-0012" defaultValue={list.q} onChange={(value) => list.update({ q: value })} />
        </div>
        {messages.isLoading && <Loading what="Loading the messages" />}
        {messages.error ? <ErrorNotice error={messages.error} title="The messages could not be loaded" /> : null}
        {messages.data && items.length === 0 && (
          <EmptyState title={list.q ? 'No message matches the search' : 'No messages yet'}>
            Assignments, returns, reminders and digests appear here as Whorl sends them.
          </EmptyState>
        )}
        {items.length > 0 && (
          <>
            <ol className="flex flex-col gap-2" aria-label="Messages, newest first" aria-busy={messages.isPlaceholderData || undefined}>
              {items.map((message) => (
                <MessageCard key={message.id} message={message} showRecipient={showRecipient} />
              ))}
            </ol>
            <div className="flex items-center justify-between text-sm text-ink-soft">
              <span>
                {total} {total === 1 ? 'message' : 'messages'} · page {list.page} of {pages}
              </span>
              <div className="flex gap-2">
                <Button variant="secondary" disabled={list.page <= 1} onClick={() => list.update({ page: list.page - 1 }, { resetPage: false })}>
                  Newer
                </Button>
                <Button variant="secondary" disabled={list.page >= pages} onClick={() => list.update({ page: list.page + 1 }, { resetPage: false })}>
                  Older
                </Button>
              </div>
            </div>
          </>
        )}
      </section>
    </div>
  );
}
