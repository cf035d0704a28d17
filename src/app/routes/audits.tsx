import { SectionPending } from '../../components/ui/section-pending';

export function Component() {
  return <SectionPending title="Audits" purpose="Internal audits of techniques and the work done with them, with a checklist run per technique." />;
}
