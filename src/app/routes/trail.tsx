import { PageHeader } from '../../components/ui/states';
import { TrailVerification } from '../../features/trail/components/trail-verification';
import { RecordLookup } from '../../features/trail/components/record-lookup';

export function Component() {
  return (
    <div>
      <PageHeader title="Trail" />
      <TrailVerification />
      <RecordLookup />
    </div>
  );
}
