import { SectionPending } from '../../components/ui/section-pending';

export function Component() {
  return <SectionPending title="Corrective actions" purpose="Root cause, plan, implementation, evidence and verification of each corrective action." />;
}
