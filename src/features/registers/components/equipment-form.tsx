import { useState, type FormEvent } from 'react';
import {
  EQUIPMENT_KIND_LABELS,
  EQUIPMENT_KIND_VALUES,
  EQUIPMENT_STATUSES,
  EQUIPMENT_STATUS_LABELS,
  type EquipmentView,
} from '../../../../shared/schemas/equipment';
import { FLAW_ORIENTATIONS } from '../../../../shared/schemas/technique';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { FormErrorNotice } from '../../../components/ui/form-error';
import { formErrors } from '../../../lib/field-errors';

interface NotchRow {
  label: string;
  orientation: (typeof FLAW_ORIENTATIONS)[number];
  angleDeg: string;
  depthMm: string;
  lengthMm: string;
  edgeDistanceMm: string;
}

export interface EquipmentFormValues {
  kind: (typeof EQUIPMENT_KIND_VALUES)[number];
  description: string;
  model: string;
  serialNumber: string;
  calibratedOn: string;
  calibrationDueOn: string;
  status: (typeof EQUIPMENT_STATUSES)[number];
  conductivityIacs: string;
  material: string;
  notes: string;
  notches: NotchRow[];
}

const text = (value: number | string | null | undefined) => (value === null || value === undefined ? '' : String(value));
const numberOrNull = (value: string) => (value.trim() === '' ? null : Number(value.replace(',', '.')));

export function toEquipmentInput(values: EquipmentFormValues) {
  return {
    description: values.description,
    model: values.model.trim() || null,
    serialNumber: values.serialNumber,
    calibratedOn: values.calibratedOn || null,
    calibrationDueOn: values.calibrationDueOn || null,
    status: values.status,
    conductivityIacs: values.kind === 'reference-standard' ? numberOrNull(values.conductivityIacs) : null,
    material: values.kind === 'reference-standard' ? values.material.trim() || null : null,
    notes: values.notes.trim() || null,
    notches:
      values.kind === 'reference-standard'
        ? values.notches.map((notch) => ({
            label: notch.label.trim() || null,
            orientation: notch.orientation,
            angleDeg: numberOrNull(notch.angleDeg),
            depthMm: Number(notch.depthMm.replace(',', '.')),
            lengthMm: Number(notch.lengthMm.replace(',', '.')),
            edgeDistanceMm: numberOrNull(notch.edgeDistanceMm),
          }))
        : [],
  };
}

/** The form's fields by the paths the server names, with their labels. */
const EQUIPMENT_FIELDS = {
  kind: 'Kind',
  description: 'Description',
  model: 'Model',
  serialNumber: 'Serial number',
  calibratedOn: 'Calibrated',
  calibrationDueOn: 'Calibration due',
  status: 'Status',
  conductivityIacs: 'Conductivity',
  material: 'Material',
  notches: 'Notches',
  notes: 'Notes',
};

const cellClass = 'w-full rounded border border-ink/25 bg-white px-1.5 py-1 text-sm';

export function EquipmentForm({
  item,
  pending,
  error,
  onSubmit,
  onCancel,
}: {
  item?: EquipmentView;
  pending: boolean;
  error: unknown;
  onSubmit(values: EquipmentFormValues): void;
  onCancel(): void;
}) {
  const [values, setValues] = useState<EquipmentFormValues>({
    kind: item?.kind ?? 'probe',
    description: item?.description ?? '',
    model: item?.model ?? '',
    serialNumber: item?.serialNumber ?? '',
    calibratedOn: item?.calibratedOn ?? '',
    calibrationDueOn: item?.calibrationDueOn ?? '',
    status: item?.status ?? 'in_service',
    conductivityIacs: text(item?.conductivityIacs),
    material: item?.material ?? '',
    notes: item?.notes ?? '',
    notches: (item?.notches ?? []).map((notch) => ({
      label: notch.label ?? '',
      orientation: notch.orientation,
      angleDeg: text(notch.angleDeg),
      depthMm: text(notch.depthMm),
      lengthMm: text(notch.lengthMm),
      edgeDistanceMm: text(notch.edgeDistanceMm),
    })),
  });
  const apiError = error instanceof ApiError ? error : null;
  const fieldError = formErrors(error, EQUIPMENT_FIELDS).at;
  const set = <K extends keyof EquipmentFormValues>(key: K, value: EquipmentFormValues[K]) => setValues((current) => ({ ...current, [key]: value }));
  const setNotch = (index: number, key: keyof NotchRow, value: string) =>
    set(
      'notches',
      values.notches.map((notch, i) => (i === index ? { ...notch, [key]: value } : notch)),
    );
  const submit = (event: FormEvent) => {
    event.preventDefault();
    onSubmit(values);
  };
  const isStandard = values.kind === 'reference-standard';

  return (
    <form onSubmit={submit} className="grid grid-cols-2 gap-3" noValidate>
      {item ? (
        <p className="col-span-2 text-sm">
          <span className="font-bold">Kind:</span> {EQUIPMENT_KIND_LABELS[item.kind]}
        </p>
      ) : (
        <div className="col-span-2">
          <SelectField label="Kind" value={values.kind} onChange={(e) => set('kind', e.target.value as EquipmentFormValues['kind'])} error={fieldError('kind')}>
            {EQUIPMENT_KIND_VALUES.map((kind) => (
              <option key={kind} value={kind}>
                {EQUIPMENT_KIND_LABELS[kind]}
              </option>
            ))}
          </SelectField>
        </div>
      )}
      <div className="col-span-2">
        <TextField label="Description" required value={values.description} onChange={(e) => set('description', e.target.value)} error={fieldError('description')} />
      </div>
      <TextField label="Model" value={values.model} onChange={(e) => set('model', e.target.value)} error={fieldError('model')} />
      <TextField label="Serial number" required value={values.serialNumber} onChange={(e) => set('serialNumber', e.target.value)} error={fieldError('serialNumber')} />
      <TextField label="Calibrated" type="date" value={values.calibratedOn} onChange={(e) => set('calibratedOn', e.target.value)} error={fieldError('calibratedOn')} />
      <TextField label="Calibration due" type="date" value={values.calibrationDueOn} onChange={(e) => set('calibrationDueOn', e.target.value)} error={fieldError('calibrationDueOn')} />
      <SelectField label="Status" value={values.status} onChange={(e) => set('status', e.target.value as EquipmentFormValues['status'])} error={fieldError('status')}>
        {EQUIPMENT_STATUSES.map((status) => (
          <option key={status} value={status}>
            {EQUIPMENT_STATUS_LABELS[status]}
          </option>
        ))}
      </SelectField>
      {isStandard && (
        <>
          <TextField label="Conductivity (%IACS)" inputMode="decimal" value={values.conductivityIacs} onChange={(e) => set('conductivityIacs', e.target.value)} error={fieldError('conductivityIacs')} />
          <TextField label="Material" value={values.material} onChange={(e) => set('material', e.target.value)} error={fieldError('material')} />
          <fieldset className="col-span-2 flex flex-col gap-2">
            <legend className="text-sm font-bold">Notches</legend>
            {values.notches.length === 0 && <p className="text-xs text-ink-soft">No notches yet. Add one per flaw orientation the standard demonstrates.</p>}
            {values.notches.length > 0 && (
              <table className="w-full text-xs">
                <thead>
                  <tr className="text-left text-ink-soft">
                    <th className="pr-1">Label</th>
                    <th className="pr-1">Orientation</th>
                    <th className="pr-1">Angle °</th>
                    <th className="pr-1">Depth mm</th>
                    <th className="pr-1">Length mm</th>
                    <th className="pr-1">Edge distance mm</th>
                    <th>
                      <span className="sr-only">Remove</span>
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {values.notches.map((notch, index) => (
                    <tr key={index}>
                      <td className="pr-1">
                        <input aria-label={`Notch ${index + 1} label`} className={cellClass} value={notch.label} onChange={(e) => setNotch(index, 'label', e.target.value)} />
                      </td>
                      <td className="pr-1">
                        <select aria-label={`Notch ${index + 1} orientation`} className={cellClass} value={notch.orientation} onChange={(e) => setNotch(index, 'orientation', e.target.value)}>
                          {FLAW_ORIENTATIONS.map((orientation) => (
                            <option key={orientation}>{orientation}</option>
                          ))}
                        </select>
                      </td>
                      {(['angleDeg', 'depthMm', 'lengthMm', 'edgeDistanceMm'] as const).map((key) => (
                        <td key={key} className="pr-1">
                          <input
                            aria-label={`Notch ${index + 1} ${key}`}
                            aria-invalid={Boolean(fieldError(`notches.${index}.${key}`))}
                            inputMode="decimal"
                            className={`${cellClass} aria-[invalid=true]:border-fail`}
                            value={notch[key]}
                            onChange={(e) => setNotch(index, key, e.target.value)}
                          />
                        </td>
                      ))}
                      <td>
                        <Button variant="ghost" aria-label={`Remove notch ${index + 1}`} onClick={() => set('notches', values.notches.filter((_, i) => i !== index))}>
                          ✕
                        </Button>
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            )}
            <div>
              <Button
                variant="secondary"
                onClick={() => set('notches', [...values.notches, { label: '', orientation: 'axial', angleDeg: '', depthMm: '', lengthMm: '', edgeDistanceMm: '' }])}
              >
                Add a notch
              </Button>
            </div>
            {fieldError('notches') && <p className="text-xs font-bold text-fail">{fieldError('notches')}</p>}
          </fieldset>
        </>
      )}
      <div className="col-span-2">
        <TextAreaField label="Notes" rows={2} value={values.notes} onChange={(e) => set('notes', e.target.value)} error={fieldError('notes')} />
      </div>
      {apiError && (
        <div className="col-span-2">
          <FormErrorNotice error={apiError} fields={EQUIPMENT_FIELDS} />
        </div>
      )}
      <div className="col-span-2 mt-2 flex justify-end gap-2">
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" busy={pending} busyLabel="Saving…">
          {item ? 'Save changes' : 'Register equipment'}
        </Button>
      </div>
    </form>
  );
}
