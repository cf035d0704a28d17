// The messages the local SMTP fake caught: a list on the left, the chosen
// message on the right (text, or the HTML in a sandboxed frame).
import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { EmptyState, ErrorNotice, Loading } from '../../../components/ui/states';
import { useListParams } from '../../../hooks/use-list-params';
import { useCaughtMail, useMailbox } from '../api/mailbox';

const when = (iso: string) => new Date(iso).toLocaleString(undefined, { month: 'short', day: 'numeric', hour: '2-digit', minute: '2-digit' });

function MessageView({ id }: { id: number }) {
  const message = useCaughtMail(id);
  const [showHtml, setShowHtml] = useState(false);
  if (message.isLoading) return <Loading what="Opening the message" />;
  if (message.error) return <ErrorNotice error={message.error} title="The message could not be opened" />;
  const mail = message.data!;
  return (
    <article aria-labelledby="mail-subject" className="flex flex-col gap-3">
      <header className="border-b border-ink/10 pb-3">
        <h2 id="mail-subject" className="text-lg font-bold text-ink">{mail.subject}</h2>
        <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 text-sm text-ink-soft">
          <dt className="font-bold">From</dt>
          <dd>{mail.from ?? '—'}</dd>
          <dt className="font-bold">To</dt>
          <dd>{mail.to.join(', ')}</dd>
          <dt className="font-bold">Received</dt>
          <dd>{new Date(mail.receivedAt).toLocaleString()}</dd>
          <dt className="font-bold">Message-ID</dt>
          <dd><code className="text-xs">{mail.messageId ?? '—'}</code></dd>
        </dl>
      </header>
      {mail.html && (
        <div className="flex gap-1" role="group" aria-label="Show the message as">
          <Button variant={showHtml ? 'ghost' : 'secondary'} onClick={() => setShowHtml(false)} aria-pressed={!showHtml}>Text</Button>
          <Button variant={showHtml ? 'secondary' : 'ghost'} onClick={() => setShowHtml(true)} aria-pressed={showHtml}>HTML</Button>
        </div>
      )}
      {showHtml && mail.html ? (
        // sandbox without allow-scripts: the HTML body is shown, never run.
        <iframe title="HTML body" sandbox="" srcDoc={mail.html} className="h-96 w-full rounded-md border border-ink/10 bg-white" />
      ) : (
        <pre className="whitespace-pre-wrap rounded-md border border-ink/10 bg-white p-3 font-sans text-sm text-ink">{mail.text ?? '(no text part)'}</pre>
      )}
    </article>
  );
}

export function MailboxView() {
  const list = useListParams({ sort: '-receivedAt', pageSize: 25 });
  const mailbox = useMailbox(list.query);
  const [openId, setOpenId] = useState<number | null>(null);
  const items = mailbox.data?.items ?? [];
  const pages = Math.max(1, Math.ceil((mailbox.data?.total ?? 0) / list.pageSize));

  return (
    <div className="flex flex-col gap-3">
      {mailbox.data && !mailbox.data.catching && (
        <p className="rounded-md border border-ink/10 bg-white px-3 py-2 text-sm text-ink-soft">
          A real mail server is configured (SMTP_URL), so messages go out to people's inboxes and nothing new is caught here.
        </p>
      )}
      {mailbox.data && mailbox.data.outbox.retrying > 0 && (
        <p role="status" className="rounded-md border border-warn/40 bg-amber-50 px-3 py-2 text-sm text-ink">
          {mailbox.data.outbox.retrying} {mailbox.data.outbox.retrying === 1 ? 'message is' : 'messages are'} waiting because the mail server
          refused or could not be reached; Whorl keeps retrying and nothing is lost.
          {mailbox.data.outbox.lastError ? <> Last error: <code className="text-xs">{mailbox.data.outbox.lastError}</code></> : null}
        </p>
      )}
      <label className="flex flex-col gap-1 text-sm font-bold">
        Search subject or recipient
        <input
          type="search"
          className="w-72 rounded-md border border-ink/25 bg-white px-2.5 py-1.5 font-normal"
          defaultValue={list.q}
          onChange={(event) => list.update({ q: event.target.value })}
        />
      </label>
      {mailbox.isLoading && <Loading what="Loading the mailbox" />}
      {mailbox.error ? <ErrorNotice error={mailbox.error} title="The mailbox could not be loaded" /> : null}
      {mailbox.data && items.length === 0 && (
        <EmptyState title="No messages caught yet">Reminders and notices appear here as Whorl sends them.</EmptyState>
      )}
      {items.length > 0 && (
        <div className="grid gap-4 lg:grid-cols-[minmax(18rem,2fr)_3fr]">
          <div className="flex flex-col gap-2">
            <ul className="divide-y divide-ink/5 overflow-hidden rounded-lg border border-ink/10 bg-white" aria-label="Caught messages">
              {items.map((item) => (
                <li key={item.id}>
                  <button
                    type="button"
                    onClick={() => setOpenId(item.id)}
                    aria-current={openId === item.id}
                    className={`block w-full px-3 py-2 text-left text-sm hover:bg-paper ${openId === item.id ? 'bg-lagoon-soft/50' : ''}`}
                  >
                    <span className="block truncate font-bold text-ink">{item.subject}</span>
                    <span className="flex justify-between gap-2 text-xs text-ink-soft">
                      <span className="truncate">{item.to.join(', ')}</span>
                      <span className="shrink-0">{when(item.receivedAt)}</span>
                    </span>
                  </button>
                </li>
              ))}
            </ul>
            <div className="flex items-center justify-between text-xs text-ink-soft">
              <span>{mailbox.data?.total} {mailbox.data?.total === 1 ? "message" : "messages"} · page {list.page} of {pages}</span>
              <div className="flex gap-1">
                <Button variant="secondary" disabled={list.page <= 1} onClick={() => list.update({ page: list.page - 1 }, { resetPage: false })}>‹ Newer</Button>
                <Button variant="secondary" disabled={list.page >= pages} onClick={() => list.update({ page: list.page + 1 }, { resetPage: false })}>Older ›</Button>
              </div>
            </div>
          </div>
          <div className="rounded-lg border border-ink/10 bg-paper p-4">
            {openId === null ? <p className="text-sm text-ink-soft">Choose a message to read it.</p> : <MessageView id={openId} />}
          </div>
        </div>
      )}
    </div>
  );
}
