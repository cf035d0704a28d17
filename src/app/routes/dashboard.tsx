import { SectionPending } from '../../components/ui/section-pending';

export function Component() {
  return <SectionPending title="Dashboard" purpose="Charts of open findings by class and age, actions on time, and the checklist rules that fail most often." />;
}
