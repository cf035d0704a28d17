import { SectionPending } from '../../components/ui/section-pending';

export function Component() {
  return <SectionPending title="Techniques" purpose="The register of written eddy current techniques, their revisions and approvals, with the checklist evaluated as you type." />;
}
