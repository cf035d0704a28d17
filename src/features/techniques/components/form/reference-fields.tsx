import { useFieldArray, useWatch } from 'react-hook-form';
import { FLAW_ORIENTATIONS } from '../../../../../shared/schemas/technique';
import { Button } from '../../../../components/ui/button';
import { ORIENTATION_CHOICES } from '../labels';
import { ChoiceField, InputField, Section, numberOptions, useFieldError, type TechniqueFormApi } from './form-kit';

function NotchRow({ form, index, onRemove }: { form: TechniqueFormApi; index: number; onRemove(): void }) {
  const { register, control } = form;
  const orientation = useWatch({ control, name: `reference.notches.${index}.orientation` });
  const error = (field: string) => useFieldError(form, `reference.notches.${index}.${field}`);
  const errors = { orientation: error('orientation'), angleDeg: error('angleDeg'), depthMm: error('depthMm'), lengthMm: error('lengthMm'), edgeDistanceMm: error('edgeDistanceMm') };
  return (
    <div className="rounded-md border border-ink/10 bg-paper/60 p-3" data-testid={`notch-${index}`}>
      <div className="mb-2 flex items-center justify-between">
        <p className="text-sm font-bold">Notch {index + 1}</p>
        <Button variant="ghost" onClick={onRemove} aria-label={`Remove notch ${index + 1}`}>
          Remove
        </Button>
      </div>
      <div className="grid grid-cols-2 gap-3">
        <ChoiceField label="Orientation" {...register(`reference.notches.${index}.orientation`)} error={errors.orientation}>
          {FLAW_ORIENTATIONS.map((value) => (
            <option key={value} value={value}>
              {ORIENTATION_CHOICES[value]}
            </option>
          ))}
        </ChoiceField>
        {orientation !== 'laminar' && (
          <InputField label="Angle to the axis" unit="°" inputMode="decimal" {...register(`reference.notches.${index}.angleDeg`, numberOptions)} error={errors.angleDeg} hint="Optional" />
        )}
        <InputField label="Notch depth" unit="mm" inputMode="decimal" {...register(`reference.notches.${index}.depthMm`, numberOptions)} error={errors.depthMm} />
        <InputField label="Notch length" unit="mm" inputMode="decimal" {...register(`reference.notches.${index}.lengthMm`, numberOptions)} error={errors.lengthMm} />
        <InputField
          label="Distance from an edge"
          unit="mm"
          inputMode="decimal"
          {...register(`reference.notches.${index}.edgeDistanceMm`, numberOptions)}
          error={errors.edgeDistanceMm}
          hint="Optional: for the edge-effect check"
        />
      </div>
    </div>
  );
}

export function ReferenceFields({ form }: { form: TechniqueFormApi }) {
  const { fields, append, remove } = useFieldArray({ control: form.control, name: 'reference.notches' });
  const conductivityError = useFieldError(form, 'reference.conductivityIacs');
  return (
    <Section
      title="Reference standard and notches"
      actions={
        <Button variant="secondary" onClick={() => append({ orientation: 'transverse', depthMm: 0.5, lengthMm: 2 })}>
          Add a notch
        </Button>
      }
    >
      <InputField
        label="Reference standard conductivity"
        unit="%IACS"
        inputMode="decimal"
        {...form.register('reference.conductivityIacs', numberOptions)}
        error={conductivityError}
      />
      {fields.length === 0 && <p className="text-sm text-ink-soft">No notches yet: every expected flaw orientation needs a matching notch.</p>}
      {fields.map((field, index) => (
        <NotchRow key={field.id} form={form} index={index} onRemove={() => remove(index)} />
      ))}
    </Section>
  );
}
