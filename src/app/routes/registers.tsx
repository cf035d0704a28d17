import { SectionPending } from '../../components/ui/section-pending';

export function Component() {
  return <SectionPending title="Registers" purpose="Personnel certifications, equipment calibration and materials." />;
}
