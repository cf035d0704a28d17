import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { FormErrorNotice } from '../../../components/ui/form-error';
import { SENT_FROM_DIALOG } from '../../../components/ui/dialog';
import { formErrors } from '../../../lib/field-errors';
import { useAreaOptions, useCreateAudit, useTechniqueOptions } from '../api/workflow';

const PLAN_FIELDS = {
  title: 'Title',
  criteria: 'Criteria',
  areaId: 'Audited area',
  plannedStart: 'Planned start',
  plannedEnd: 'Planned end',
  techniques: 'Techniques in scope',
};

/** Plans an audit led by the signed-in auditor: area, dates, criteria and the techniques in scope. */
export function PlanAuditForm({ leadAuditorId, leadAreaId, onCancel }: { leadAuditorId: number; leadAreaId: number | null; onCancel(): void }) {
  const areas = useAreaOptions();
  const techniques = useTechniqueOptions();
  const create = useCreateAudit();
  const navigate = useNavigate();
  const [form, setForm] = useState({ title: '', criteria: '', areaId: '', plannedStart: '', plannedEnd: '' });
  const [scope, setScope] = useState<number[]>([]);
  const error = formErrors(create.error, PLAN_FIELDS).at;
  const set = (key: keyof typeof form) => (e: { target: { value: string } }) => setForm({ ...form, [key]: e.target.value });

  // The revision shown is the one sent: the server refuses it if it is no longer in force.
  const revisionOf = (techniqueId: number) => techniques.data?.items.find((technique) => technique.id === techniqueId)?.revision;
  const submit = (event: FormEvent) => {
    event.preventDefault();
    create.mutate(
      { ...form, areaId: Number(form.areaId), leadAuditorId, techniques: scope.map((techniqueId) => ({ techniqueId, revision: revisionOf(techniqueId) })) },
      { onSuccess: (audit) => navigate(`/audits/${audit.id}`, { state: SENT_FROM_DIALOG }) },
    );
  };

  return (
    <form onSubmit={submit} className="flex flex-col gap-3">
      <TextField label="Title" required value={form.title} onChange={set('title')} error={error('title')} />
      <TextAreaField label="Criteria (what the audit checks against)" required rows={3} value={form.criteria} onChange={set('criteria')} error={error('criteria')} />
      <SelectField label="Audited area" required value={form.areaId} onChange={set('areaId')} error={error('areaId')}
        hint="You cannot audit the area you belong to.">
        <option value="">Choose an area</option>
        {(areas.data?.items ?? []).filter((area) => area.id !== leadAreaId).map((area) => (
          <option key={area.id} value={area.id}>{area.name}</option>
        ))}
      </SelectField>
      <div className="grid grid-cols-2 gap-3">
        <TextField label="Planned start" type="date" required value={form.plannedStart} onChange={set('plannedStart')} error={error('plannedStart')} />
        <TextField label="Planned end" type="date" required value={form.plannedEnd} onChange={set('plannedEnd')} error={error('plannedEnd')} />
      </div>
      <fieldset className="flex max-h-48 flex-col gap-1 overflow-y-auto rounded border border-ink/15 p-2">
        <legend className="px-1 text-sm font-bold">Techniques in scope</legend>
        {(techniques.data?.items ?? []).map((technique) => (
          <label key={technique.id} className="flex items-center gap-2 text-sm">
            <input type="checkbox" checked={scope.includes(technique.id)}
              onChange={(e) => setScope(e.target.checked ? [...scope, technique.id] : scope.filter((id) => id !== technique.id))} />
            {technique.code} rev {technique.revision} — {technique.title}
          </label>
        ))}
        {techniques.data && !techniques.data.items.length && <p className="text-sm text-ink-soft">No technique has an approved revision in force.</p>}
        <p className="text-xs text-ink-soft">Only approved revisions in force are offered; a technique with only a draft is audited once approved.</p>
        {error('techniques') && <p className="text-xs font-bold text-fail">{error('techniques')}</p>}
      </fieldset>
      <FormErrorNotice error={create.error} fields={PLAN_FIELDS} title="The audit was not planned" />
      <div className="flex justify-end gap-2">
        <Button variant="secondary" onClick={onCancel}>Cancel</Button>
        <Button type="submit" busy={create.isPending} busyLabel="Planning…" disabled={!scope.length}>Plan the audit</Button>
      </div>
    </form>
  );
}
