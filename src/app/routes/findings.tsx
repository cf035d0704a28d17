import { SectionPending } from '../../components/ui/section-pending';

export function Component() {
  return <SectionPending title="Findings" purpose="Nonconformities raised by audits: review, classification, containment, effectiveness and closure." />;
}
