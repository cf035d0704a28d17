// Approving a draft is irreversible: the revision becomes read-only and the one in
// force is superseded. The dialog says so, with the checklist verdict.
import { useState } from 'react';
import type { TechniqueRevisionView, TechniqueView } from '../../../../shared/schemas/technique-register';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { Loading, ErrorNotice } from '../../../components/ui/states';
import { useQuery } from '@tanstack/react-query';
import { getTechniqueChecklistQueryOptions, useApproveRevision } from '../api/techniques';
import { VerdictBadge } from './badges';
import { RULE_LABELS } from './labels';
import { registerChecksMade } from './checklist-panel';
import type { TechniqueChecklistView } from '../../../../shared/schemas/technique-register';

/** The server's verdict on this revision with the register facts: what approving it would record. */
function ServerVerdict({ view }: { view: TechniqueChecklistView }) {
  const { output } = view;
  const failing = [...new Set(output.results.filter((result) => result.status === 'fail').map((result) => RULE_LABELS[result.rule]))];
  const warning = [...new Set(output.results.filter((result) => result.status === 'warn').map((result) => RULE_LABELS[result.rule]))];
  return (
    <div className="mt-2 flex flex-col gap-1" data-testid="approval-verdict">
      <p className="flex flex-wrap items-center gap-2">
        Checklist, as the server evaluates it now with the people and equipment registers: <VerdictBadge verdict={output.verdict} />
      </p>
      <p>
        {output.summary.fail} failed · {output.summary.warn} {output.summary.warn === 1 ? 'warning' : 'warnings'} · {output.summary.pass} passed
      </p>
      {failing.length > 0 && <p className="font-bold text-fail">Failing: {failing.join(', ')}.</p>}
      {warning.length > 0 && <p className="font-bold text-warn">Warnings: {warning.join(', ')}.</p>}
      {!registerChecksMade(output) && (
        <p>The people and equipment checks could not be made: the technique is not linked to the registers yet.</p>
      )}
      <p>The checklist supports your judgement; it does not replace it.</p>
    </div>
  );
}

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
  // Asked afresh each time the dialog opens: the registers may have changed since the editor's live view.
  const verdict = useQuery({ ...getTechniqueChecklistQueryOptions(technique.id, revision.revision), enabled: open, staleTime: 0, refetchOnMount: 'always' });
  const verdictReady = open && verdict.data?.revision.revision === revision.revision && !verdict.isFetching;
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
        confirmDisabled={!verdictReady}
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
        {verdict.error ? <ErrorNotice error={verdict.error} title="The server's checklist could not be read; approve once it can" /> : null}
        {!verdictReady && !verdict.error && <Loading what="Asking the server for its checklist of this revision" />}
        {verdictReady && verdict.data && <ServerVerdict view={verdict.data} />}
      </ConfirmDialog>
    </>
  );
}
