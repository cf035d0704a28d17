import { SectionPending } from '../../components/ui/section-pending';

export function Component() {
  return <SectionPending title="Mailbox" purpose="E-mail reminders caught by the local mail server." />;
}
