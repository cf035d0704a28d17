import { useState } from 'react';
import type { RecordKind } from '../../../../machines';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { useRecordEvent, type RecordPath } from '../api/workflow';
import { EventForm, signedMeaningOf } from './event-form';
import { eventLabel } from './labels';

const PATHS: Record<RecordKind, RecordPath> = { audit: 'audits', finding: 'findings', action: 'actions' };
const DANGER = ['CANCEL', 'WITHDRAW', 'NOT_EFFECTIVE', 'RETURN_PLAN', 'RETURN', 'REJECT_EXTENSION'];

/** One button per event the server says this person may send now, each opening the form the event needs. */
export function EventActions({
  kind,
  record,
}: {
  kind: RecordKind;
  /**
   * `proposedClass`: a finding raised from an extent of condition starts its classification with it.
   * `dueDate`: a corrective action's own due date, the latest day a plan item may fall due.
   */
  record: { id: number; version: number; allowedEvents: string[]; proposedClass?: string | null; dueDate?: string | null };
}) {
  const [open, setOpen] = useState<string | null>(null);
  const mutation = useRecordEvent(PATHS[kind], record.id);
  const close = () => {
    setOpen(null);
    mutation.reset();
  };
  if (!record.allowedEvents.length) return null;
  return (
    <div className="flex flex-wrap gap-2" role="group" aria-label="Actions">
      {record.allowedEvents.map((type) => (
        <Button key={type} variant={DANGER.includes(type) ? 'secondary' : 'primary'} onClick={() => setOpen(type)}>
          {signedMeaningOf(kind, type) ? '✍ ' : ''}
          {eventLabel(type)}
        </Button>
      ))}
      {open && (
        <Dialog open title={eventLabel(open)} onClose={close}>
          <EventForm
            kind={kind}
            type={open}
            proposedClass={record.proposedClass ?? null}
            planDueBy={kind === 'action' ? (record.dueDate ?? null) : null}
            pending={mutation.isPending}
            error={mutation.error}
            onCancel={close}
            onSubmit={(payload) => mutation.mutate({ type: open, version: record.version, ...payload }, { onSuccess: close })}
          />
        </Dialog>
      )}
    </div>
  );
}
