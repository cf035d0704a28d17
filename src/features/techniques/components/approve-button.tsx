// Approving a draft is irreversible: the revision becomes read-only and the one in
// force is superseded. The dialog says so, with the checklist verdict.
import { useState } from 'react';
import type { TechniqueRevisionView, TechniqueView } from '../../../../shared/schemas/technique-register';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { useApproveRevision } from '../api/techniques';
import { VerdictBadge } from './badges';
import { RULE_LABELS } from './labels';

export function ApproveButton({
  technique,
  revision,
  disabledReason,
  onApproved,
}: {
  technique: TechniqueView;
  revision: TechniqueRevisionView;
  disabledReason?: string;
  onApproved?(): void;
}) {
  const [open, setOpen] = useState(false);
  const approve = useApproveRevision(technique.id);
  if (!revision.allowedEvents.includes('APPROVE')) return null;
  const inForce = technique.revisions.find((candidate) => candidate.state === 'approved');
  return (
    <>
      <Button onClick={() => setOpen(true)} disabled={Boolean(disabledReason)} title={disabledReason}>
        Approve revision {revision.revision}
      </Button>
      {disabledReason && <span className="sr-only">{disabledReason}</span>}
      <ConfirmDialog
        open={open}
        title={`Approve ${technique.code} revision ${revision.revision}?`}
        confirmLabel={`Approve revision ${revision.revision}`}
        pending={approve.isPending}
        error={approve.error}
        onCancel={() => {
          setOpen(false);
          approve.reset();
        }}
        onConfirm={() =>
          // The promise, not mutate's callbacks: this button unmounts as soon as the revision is approved.
          approve
            .mutateAsync({ revision: revision.revision, version: revision.version })
            .then(() => {
              setOpen(false);
              onApproved?.();
            })
            .catch(() => undefined)
        }
      >
        <p>
          Once approved, revision {revision.revision} is read-only: changes need a new revision.
          {inForce ? ` Revision ${inForce.revision}, now in force, will be superseded.` : ''} You approve it as the responsible Level 3, with your name
          and the time on the record.
        </p>
        <p className="mt-2 flex flex-wrap items-center gap-2">
          Checklist: <VerdictBadge verdict={revision.verdict} />
        </p>
        {revision.failedRules.length > 0 && (
          <p className="mt-1 font-bold text-fail">Failing: {revision.failedRules.map((rule) => RULE_LABELS[rule]).join(', ')}. The checklist supports your judgement; it does not replace it.</p>
        )}
      </ConfirmDialog>
    </>
  );
}
