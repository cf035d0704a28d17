import { PageHeader } from '../../components/ui/states';
import { MessagesView } from '../../features/messages/components/messages-view';

export function Component() {
  return (
    <div>
      <PageHeader title="Messages" />
      <p className="mb-4 max-w-3xl text-sm text-ink-soft">
        Every e-mail Whorl has sent you, newest first: assignments, returns, reminders and digests, with where each one stands and the record it is
        about.
      </p>
      <MessagesView />
    </div>
  );
}
