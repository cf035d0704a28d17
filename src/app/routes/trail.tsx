import { SectionPending } from '../../components/ui/section-pending';

export function Component() {
  return <SectionPending title="Trail" purpose="Verification of the tamper-evident trail." />;
}
