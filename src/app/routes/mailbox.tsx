import { PageHeader } from '../../components/ui/states';
import { MailboxView } from '../../features/mailbox/components/mailbox-view';

export function Component() {
  return (
    <div>
      <PageHeader title="Mailbox" />
      <p className="mb-4 max-w-3xl text-sm text-ink-soft">
        Without a configured mail server, Whorl keeps the e-mail it sends here instead: assignments, reminders, escalations and digests, as the
        recipients would read them.
      </p>
      <MailboxView />
    </div>
  );
}
