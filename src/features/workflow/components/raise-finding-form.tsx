import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { FormErrorNotice } from '../../../components/ui/form-error';
import { SENT_FROM_DIALOG } from '../../../components/ui/dialog';
import { formErrors } from '../../../lib/field-errors';
import { useRaiseFinding } from '../api/workflow';

const RAISE_FIELDS = {
  title: 'Title',
  rule: 'Rule or clause not met',
  requirement: 'Requirement',
  objectiveEvidence: 'Objective evidence',
  techniqueCode: 'Technique',
};

/** A finding written by the auditor (a clause of the criteria not met), not from a checklist result. */
export function RaiseFindingForm({ auditId, techniqueCodes, onCancel }: { auditId: number; techniqueCodes: string[]; onCancel(): void }) {
  const raise = useRaiseFinding(auditId);
  const navigate = useNavigate();
  const [form, setForm] = useState({ title: '', rule: '', requirement: '', objectiveEvidence: '', techniqueCode: '' });
  const set = (key: keyof typeof form) => (e: { target: { value: string } }) => setForm({ ...form, [key]: e.target.value });
  const error = formErrors(raise.error, RAISE_FIELDS).at;
  const submit = (event: FormEvent) => {
    event.preventDefault();
    const { techniqueCode, ...rest } = form;
    raise.mutate({ ...rest, ...(techniqueCode ? { techniqueCode } : {}) }, { onSuccess: (finding) => navigate(`/findings/${finding.id}`, { state: SENT_FROM_DIALOG }) });
  };
  return (
    <form onSubmit={submit} className="flex flex-col gap-3">
      <TextField label="Title" required value={form.title} onChange={set('title')} error={error('title')} />
      <TextField label="Rule or clause not met" required value={form.rule} onChange={set('rule')} error={error('rule')} hint="e.g. QP-ET-01 clause 9.2" />
      <TextAreaField label="Requirement" required rows={2} value={form.requirement} onChange={set('requirement')} error={error('requirement')} />
      <TextAreaField label="Objective evidence" required rows={3} value={form.objectiveEvidence} onChange={set('objectiveEvidence')} error={error('objectiveEvidence')} hint="What you saw: documents, records, parts, with their identifiers." />
      <SelectField label="Technique (optional)" value={form.techniqueCode} onChange={set('techniqueCode')}>
        <option value="">Not about one technique</option>
        {techniqueCodes.map((code) => (
          <option key={code} value={code}>{code}</option>
        ))}
      </SelectField>
      <FormErrorNotice error={raise.error} fields={RAISE_FIELDS} title="The finding was not raised" />
      <div className="flex justify-end gap-2">
        <Button variant="secondary" onClick={onCancel}>Cancel</Button>
        <Button type="submit" busy={raise.isPending} busyLabel="Raising…">Raise the finding</Button>
      </div>
    </form>
  );
}
