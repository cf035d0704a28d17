import { useState, type FormEvent } from 'react';
import { INSPECTION_RESULTS, INSPECTION_RESULT_LABELS, type InspectionInput, type InspectionOptionsView, type InspectionResult, type InspectionView } from '../../../../shared/schemas/inspection';
import { EQUIPMENT_KIND_LABELS, EQUIPMENT_STATUS_LABELS } from '../../../../shared/schemas/equipment';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { ErrorNotice } from '../../../components/ui/states';
import { subject } from '@casl/ability';
import { useAbility } from '../../../lib/ability';

interface FormValues {
  techniqueRevisionId: string;
  performedOn: string;
  partNumber: string;
  serialNumber: string;
  workOrder: string;
  customer: string;
  inspectorId: string;
  result: InspectionResult | '';
  instrumentId: string;
  probeId: string;
  referenceStandardId: string;
  notes: string;
}

const idOrNull = (value: string) => (value ? Number(value) : null);
const todayIso = () => new Date().toISOString().slice(0, 10);

/** What the form sends: an unchosen select is left out, so the server names the missing field in words. */
function toInput(values: FormValues): InspectionInput {
  return {
    techniqueRevisionId: (Number(values.techniqueRevisionId) || undefined) as number,
    performedOn: values.performedOn,
    partNumber: values.partNumber,
    serialNumber: values.serialNumber,
    workOrder: values.workOrder,
    customer: values.customer,
    inspectorId: (Number(values.inspectorId) || undefined) as number,
    result: (values.result || undefined) as InspectionResult,
    instrumentId: idOrNull(values.instrumentId),
    probeId: idOrNull(values.probeId),
    referenceStandardId: idOrNull(values.referenceStandardId),
    notes: values.notes.trim() || null,
  };
}

/** Recorded as used, but worth a second look: past its calibration due date on the day, or out of service now. */
function calibrationHint(item: InspectionOptionsView['equipment'][number] | undefined, performedOn: string) {
  if (!item) return undefined;
  if (item.calibrationDueOn && performedOn && item.calibrationDueOn < performedOn) {
    return <span className="font-bold text-warn">Calibration was due {item.calibrationDueOn}, before this date.</span>;
  }
  if (item.status !== 'in_service') return <span className="font-bold text-warn">This item is {item.status.replace('_', ' ')} in the register.</span>;
  return item.calibrationDueOn ? `Calibration due ${item.calibrationDueOn}` : 'No calibration record';
}

const EQUIPMENT_SLOTS = [
  ['instrumentId', 'instrument'],
  ['probeId', 'probe'],
  ['referenceStandardId', 'reference-standard'],
] as const;

export function InspectionForm({
  options,
  item,
  defaultInspectorId,
  pending,
  error,
  onSubmit,
  onCancel,
}: {
  options: InspectionOptionsView;
  item?: InspectionView;
  defaultInspectorId?: number;
  pending: boolean;
  error: unknown;
  onSubmit(input: InspectionInput): void;
  onCancel(): void;
}) {
  // Whoever records names themself as inspector unless their role records for others (shared/abilities.ts).
  const ability = useAbility();
  const inspectors = options.inspectors.filter((p) => p.id === item?.inspector.id || ability.can('create', subject('Inspection', { inspectorId: p.id })));
  const ownOnly = inspectors.length < options.inspectors.length;
  const [values, setValues] = useState<FormValues>({
    techniqueRevisionId: item ? String(item.revision.id) : '',
    performedOn: item?.performedOn ?? todayIso(),
    partNumber: item?.partNumber ?? '',
    serialNumber: item?.serialNumber ?? '',
    workOrder: item?.workOrder ?? '',
    customer: item?.customer ?? '',
    inspectorId: item ? String(item.inspector.id) : defaultInspectorId && options.inspectors.some((p) => p.id === defaultInspectorId) ? String(defaultInspectorId) : '',
    result: item?.result ?? '',
    instrumentId: item?.instrument ? String(item.instrument.id) : '',
    probeId: item?.probe ? String(item.probe.id) : '',
    referenceStandardId: item?.referenceStandard ? String(item.referenceStandard.id) : '',
    notes: item?.notes ?? '',
  });
  const apiError = error instanceof ApiError ? error : null;
  const fieldErrors = apiError?.fieldErrors ?? [];
  const fieldError = (path: keyof FormValues) => fieldErrors.find((detail) => detail.path === path)?.message;
  const set = (key: keyof FormValues, value: string) => setValues((current) => ({ ...current, [key]: value }));
  const revision = options.revisions.find((r) => String(r.id) === values.techniqueRevisionId);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    onSubmit(toInput(values));
  };

  return (
    <form onSubmit={submit} className="grid grid-cols-1 gap-3 sm:grid-cols-2" noValidate aria-label={item ? 'Correct inspection' : 'Record inspection'}>
      <div className="sm:col-span-2">
        <SelectField
          label="Technique revision"
          value={values.techniqueRevisionId}
          onChange={(e) => set('techniqueRevisionId', e.target.value)}
          error={fieldError('techniqueRevisionId')}
          hint="Only revisions that were approved are offered; drafts cannot be worked to."
          required
          autoFocus
        >
          <option value="">Choose the revision the work was done to</option>
          {options.revisions.map((r) => (
            <option key={r.id} value={r.id}>
              {r.techniqueCode} rev {r.revision} — {r.techniqueTitle} ({r.state === 'approved' ? 'in force' : r.state}, approved {r.approvedOn})
            </option>
          ))}
        </SelectField>
      </div>
      <TextField
        label="Date performed"
        type="date"
        value={values.performedOn}
        min={revision?.approvedOn}
        max={todayIso()}
        onChange={(e) => set('performedOn', e.target.value)}
        error={fieldError('performedOn')}
        hint={revision ? `On or after ${revision.approvedOn}, not in the future` : undefined}
        required
      />
      <SelectField
        label="Inspector"
        value={values.inspectorId}
        onChange={(e) => set('inspectorId', e.target.value)}
        error={fieldError('inspectorId')}
        hint={ownOnly ? 'You record the inspections you performed; a quality manager records them for other inspectors.' : undefined}
        required
      >
        <option value="">Choose the inspector</option>
        {inspectors.map((p) => (
          <option key={p.id} value={p.id}>
            {p.name}
          </option>
        ))}
        {item && !options.inspectors.some((p) => p.id === item.inspector.id) && <option value={item.inspector.id}>{item.inspector.name} (no longer active)</option>}
      </SelectField>
      <TextField label="Part number" value={values.partNumber} maxLength={80} onChange={(e) => set('partNumber', e.target.value)} error={fieldError('partNumber')} required />
      <TextField label="Serial number" value={values.serialNumber} maxLength={80} onChange={(e) => set('serialNumber', e.target.value)} error={fieldError('serialNumber')} required />
      <TextField label="Work order" value={values.workOrder} maxLength={60} onChange={(e) => set('workOrder', e.target.value)} error={fieldError('workOrder')} required />
      <TextField label="Customer" value={values.customer} maxLength={120} onChange={(e) => set('customer', e.target.value)} error={fieldError('customer')} required />
      <div className="sm:col-span-2">
        <SelectField label="Result" value={values.result} onChange={(e) => set('result', e.target.value)} error={fieldError('result')} required>
          <option value="">Choose the result</option>
          {INSPECTION_RESULTS.map((result) => (
            <option key={result} value={result}>
              {INSPECTION_RESULT_LABELS[result]}
            </option>
          ))}
        </SelectField>
      </div>
      {EQUIPMENT_SLOTS.map(([field, kind]) => (
        <SelectField
          key={field}
          label={EQUIPMENT_KIND_LABELS[kind]}
          value={values[field]}
          onChange={(e) => set(field, e.target.value)}
          error={fieldError(field)}
          hint={calibrationHint(options.equipment.find((e) => String(e.id) === values[field]), values.performedOn)}
        >
          <option value="">None recorded</option>
          {options.equipment
            .filter((e) => e.kind === kind)
            .map((e) => (
              <option key={e.id} value={e.id}>
                {e.serialNumber} — {e.description}
                {e.status !== 'in_service' ? ` (${EQUIPMENT_STATUS_LABELS[e.status as keyof typeof EQUIPMENT_STATUS_LABELS] ?? e.status})` : ''}
              </option>
            ))}
        </SelectField>
      ))}
      <div className="sm:col-span-2">
        <TextAreaField label="Notes" rows={3} maxLength={2000} value={values.notes} onChange={(e) => set('notes', e.target.value)} error={fieldError('notes')} />
      </div>
      {apiError && (
        <div className="sm:col-span-2">
          {fieldErrors.length > 0 && fieldErrors.every((detail) => detail.path in values) ? (
            <p role="alert" className="text-sm font-bold text-fail">
              Not saved: correct the fields marked above.
            </p>
          ) : (
            <ErrorNotice error={apiError} title="Not saved" />
          )}
        </div>
      )}
      <div className="flex justify-end gap-2 sm:col-span-2">
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" busy={pending} busyLabel="Saving…">
          {item ? 'Save correction' : 'Record inspection'}
        </Button>
      </div>
    </form>
  );
}
