// The form each event needs: nothing but a confirmation, a reason, a note, a
// class, a containment, a root cause and plan, a summary, a new due date, or —
// for signed events — the meaning of the signature and the signer's password.
import { useState, type FormEvent } from 'react';
import { recordMachines, FINDING_CLASSES, ROOT_CAUSE_METHODS, type RecordKind } from '../../../../machines';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { FormErrorNotice } from '../../../components/ui/form-error';
import { formErrors } from '../../../lib/field-errors';
import { CLASS_LABELS, METHOD_LABELS, eventLabel } from './labels';

type Payload = Record<string, unknown>;

const REASON_EVENTS = ['CANCEL', 'WITHDRAW', 'NOT_EFFECTIVE', 'RETURN_PLAN', 'RETURN', 'REJECT_EXTENSION'];

export function signedMeaningOf(kind: RecordKind, type: string): string | null {
  return (recordMachines[kind].signedEvents as Record<string, string>)[type] ?? null;
}

/** What the confirmation says for events that need no input. */
const CONFIRM_TEXT: Record<string, string> = {
  START_FIELDWORK: 'The audit moves to fieldwork: the checklist can be run and findings raised.',
  FINISH_FIELDWORK: 'Fieldwork ends; the audit moves to reporting. No more checklist runs.',
  CLOSE: 'The audit closes. This cannot be undone.',
  SUBMIT: 'The finding goes to the quality manager for classification. You can no longer withdraw it yourself.',
  START: 'You start the root-cause investigation of this corrective action.',
  APPROVE_PLAN: 'The root cause and plan are approved; the owner carries out the plan.',
  APPROVE_EXTENSION: 'The due date moves to the requested date.',
};

/** Every field an event form may show, by the path the server names. */
const EVENT_FIELDS = {
  note: 'Note',
  reason: 'Reason',
  class: 'Class',
  method: 'Method',
  rootCause: 'Root cause analysis',
  plan: 'Plan',
  dueDate: 'New due date',
  summary: 'Summary',
  password: 'Password',
  description: 'What was done at once',
};

function fieldError(error: unknown, path: string): string | undefined {
  return formErrors(error, EVENT_FIELDS).at(path);
}

export function EventForm({
  kind,
  type,
  proposedClass = null,
  planDueBy = null,
  pending,
  error,
  onSubmit,
  onCancel,
}: {
  kind: RecordKind;
  type: string;
  proposedClass?: string | null;
  /** The latest day a plan item may fall due (the corrective action's own due date). */
  planDueBy?: string | null;
  pending: boolean;
  error: unknown;
  onSubmit(payload: Payload): void;
  onCancel(): void;
}) {
  const meaning = signedMeaningOf(kind, type);
  const [text, setText] = useState('');
  const [password, setPassword] = useState('');
  const [findingClass, setFindingClass] = useState(proposedClass ?? '');
  const [method, setMethod] = useState('five_whys');
  const [plan, setPlan] = useState([{ description: '', dueDate: '' }]);
  const [dueDate, setDueDate] = useState('');

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (meaning) return onSubmit({ password });
    if (REASON_EVENTS.includes(type)) return onSubmit({ reason: text });
    switch (type) {
      case 'CLASSIFY':
        return onSubmit({ class: findingClass, ...(text.trim() ? { note: text } : {}) });
      case 'RECORD_CONTAINMENT':
        return onSubmit({ description: text });
      case 'CONFIRM_EFFECTIVE':
        return onSubmit({ note: text });
      case 'SUBMIT_PLAN':
        return onSubmit({ method, rootCause: text, plan });
      case 'REQUEST_EXTENSION':
        return onSubmit({ dueDate, reason: text });
      default:
        if (kind === 'action' && type === 'SUBMIT') return onSubmit({ summary: text });
        return onSubmit({});
    }
  };

  const textField = (label: string, path: string, hint?: string) => (
    <TextAreaField label={label} required rows={4} value={text} onChange={(e) => setText(e.target.value)} error={fieldError(error, path)} hint={hint} />
  );

  let body: React.ReactNode;
  if (meaning) {
    body = (
      <>
        <p className="rounded-md border border-copper/40 bg-copper-soft/40 p-3 text-sm">
          You are signing electronically. Meaning of your signature: <strong>“{meaning}”</strong>. Your printed name, role, the time (UTC) and a
          hash of the record as it stands are kept with it, and it cannot be withdrawn.
        </p>
        <TextField label="Your password" type="password" autoComplete="current-password" required value={password} onChange={(e) => setPassword(e.target.value)} />
      </>
    );
  } else if (REASON_EVENTS.includes(type)) {
    body = textField('Reason', 'reason');
  } else if (type === 'CLASSIFY') {
    body = (
      <>
        <SelectField
          label="Class"
          required
          value={findingClass}
          onChange={(e) => setFindingClass(e.target.value)}
          error={fieldError(error, 'class')}
          hint={proposedClass ? `${CLASS_LABELS[proposedClass as keyof typeof CLASS_LABELS] ?? proposedClass} was proposed when this finding was raised from an extent of condition` : undefined}
        >
          <option value="">Choose a class</option>
          {FINDING_CLASSES.map((value) => (
            <option key={value} value={value}>
              {CLASS_LABELS[value]}
            </option>
          ))}
        </SelectField>
        <TextAreaField
          label={findingClass === 'observation' ? 'Note (required: an observation closes at once)' : 'Note (optional)'}
          required={findingClass === 'observation'}
          rows={3}
          value={text}
          onChange={(e) => setText(e.target.value)}
          hint="Major: containment within a day, corrective action within 30 days. Minor: 90 days (the organisation's policy may differ)."
        />
      </>
    );
  } else if (type === 'RECORD_CONTAINMENT') {
    body = textField('What was done at once', 'description', 'Parts quarantined, technique suspended, results on hold…');
  } else if (type === 'CONFIRM_EFFECTIVE') {
    body = textField('How effectiveness was checked', 'note');
  } else if (type === 'SUBMIT_PLAN') {
    body = (
      <>
        <SelectField label="Root-cause method" value={method} onChange={(e) => setMethod(e.target.value)} error={fieldError(error, 'method')}>
          {ROOT_CAUSE_METHODS.map((value) => (
            <option key={value} value={value}>
              {METHOD_LABELS[value]}
            </option>
          ))}
        </SelectField>
        {textField('Root-cause analysis', 'rootCause')}
        <fieldset className="flex flex-col gap-2">
          <legend className="text-sm font-bold">Plan items</legend>
          {plan.map((item, index) => (
            <div key={index} className="grid grid-cols-[1fr_auto_auto] items-end gap-2">
              <TextField
                label={`Item ${index + 1}`}
                required
                value={item.description}
                onChange={(e) => setPlan(plan.map((p, i) => (i === index ? { ...p, description: e.target.value } : p)))}
                error={fieldError(error, `plan.${index}.description`)}
              />
              <TextField
                label="Due"
                type="date"
                required
                max={planDueBy ?? undefined}
                hint={planDueBy ? `by ${planDueBy}` : undefined}
                value={item.dueDate}
                onChange={(e) => setPlan(plan.map((p, i) => (i === index ? { ...p, dueDate: e.target.value } : p)))}
                error={fieldError(error, `plan.${index}.dueDate`)}
              />
              <Button variant="ghost" disabled={plan.length === 1} onClick={() => setPlan(plan.filter((_, i) => i !== index))} aria-label={`Remove item ${index + 1}`}>
                ✕
              </Button>
            </div>
          ))}
          <Button variant="secondary" onClick={() => setPlan([...plan, { description: '', dueDate: '' }])}>
            Add a plan item
          </Button>
        </fieldset>
      </>
    );
  } else if (type === 'REQUEST_EXTENSION') {
    body = (
      <>
        <TextField label="New due date" type="date" required value={dueDate} onChange={(e) => setDueDate(e.target.value)} error={fieldError(error, 'dueDate')} />
        {textField('Reason', 'reason')}
      </>
    );
  } else if (kind === 'action' && type === 'SUBMIT') {
    body = textField('Summary of what was done', 'summary', 'The evidence files attached to this action go with the submission.');
  } else {
    body = <p className="text-sm text-ink-soft">{CONFIRM_TEXT[type] ?? `Send “${eventLabel(type)}”?`}</p>;
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-3">
      {body}
      <FormErrorNotice error={error} fields={EVENT_FIELDS} title="Not done" />
      <div className="mt-2 flex justify-end gap-2">
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" busy={pending} busyLabel="Working…">
          {meaning ? `Sign: ${eventLabel(type)}` : eventLabel(type)}
        </Button>
      </div>
    </form>
  );
}
