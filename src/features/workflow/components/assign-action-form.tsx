import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { FormErrorNotice } from '../../../components/ui/form-error';
import { formErrors } from '../../../lib/field-errors';
import { useAssignAction, usePeopleWithRole } from '../api/workflow';

const ASSIGN_FIELDS = { ownerId: 'Owner', dueDate: 'Due date' };

/** The quality manager assigns the finding's corrective action: an owner (not the finding's author) and a due date. */
export function AssignActionForm({ findingId, authorId, suggestedDueDate, onDone }: { findingId: number; authorId: number | null; suggestedDueDate: string | null; onDone(): void }) {
  const level3 = usePeopleWithRole('level3');
  const technicians = usePeopleWithRole('technician');
  const assign = useAssignAction();
  const [ownerId, setOwnerId] = useState('');
  const [dueDate, setDueDate] = useState(suggestedDueDate ?? '');
  const people = [...(level3.data?.items ?? []), ...(technicians.data?.items ?? [])]
    .filter((person, index, all) => person.id !== authorId && all.findIndex((other) => other.id === person.id) === index);
  const errors = formErrors(assign.error, ASSIGN_FIELDS);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    assign.mutate({ findingId, ownerId: Number(ownerId), dueDate }, { onSuccess: onDone });
  };
  return (
    <form onSubmit={submit} className="flex flex-col gap-3">
      <SelectField label="Owner" required value={ownerId} onChange={(e) => setOwnerId(e.target.value)} hint="The finding's author cannot own its action." error={errors.at('ownerId')}>
        <option value="">Choose the owner</option>
        {people.map((person) => (
          <option key={person.id} value={person.id}>{person.displayName}{person.areaName ? ` (${person.areaName})` : ''}</option>
        ))}
      </SelectField>
      <TextField label="Due date" type="date" required value={dueDate} onChange={(e) => setDueDate(e.target.value)} error={errors.at('dueDate')} />
      <FormErrorNotice error={assign.error} fields={ASSIGN_FIELDS} title="The action was not assigned" />
      <div className="flex justify-end gap-2">
        <Button variant="secondary" onClick={onDone}>Cancel</Button>
        <Button type="submit" busy={assign.isPending} busyLabel="Assigning…">Assign the corrective action</Button>
      </div>
    </form>
  );
}
