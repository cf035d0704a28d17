import { useFieldArray, useWatch } from 'react-hook-form';
import { FLAW_LOCATIONS, FLAW_ORIENTATIONS } from '../../../../../shared/schemas/technique';
import { Button } from '../../../../components/ui/button';
import { LOCATION_LABELS, ORIENTATION_CHOICES, ORIENTATION_HELP } from '../labels';
import { ChoiceField, InputField, Section, numberOptions, useFieldError, type TechniqueFormApi } from './form-kit';

function FlawRow({ form, index, onRemove, canRemove }: { form: TechniqueFormApi; index: number; onRemove(): void; canRemove: boolean }) {
  const { register, control } = form;
  const location = useWatch({ control, name: `flaws.${index}.location` });
  const orientation = useWatch({ control, name: `flaws.${index}.orientation` });
  const error = (field: string) => useFieldError(form, `flaws.${index}.${field}`);
  const errors = {
    id: error('id'),
    orientation: error('orientation'),
    angleDeg: error('angleDeg'),
    location: error('location'),
    depthMm: error('depthMm'),
    lengthMm: error('lengthMm'),
    metalAboveMm: error('metalAboveMm'),
  };
  return (
    <div className="rounded-md border border-ink/10 bg-paper/60 p-3" data-testid={`flaw-${index}`}>
      <div className="mb-2 flex items-center justify-between">
        <p className="text-sm font-bold">Expected flaw {index + 1}</p>
        <Button variant="ghost" onClick={onRemove} disabled={!canRemove} aria-label={`Remove flaw ${index + 1}`}>
          Remove
        </Button>
      </div>
      <div className="grid grid-cols-2 gap-3">
        <InputField label="Flaw identifier" {...register(`flaws.${index}.id`)} error={errors.id} hint="Short and unique, e.g. bore-crack" />
        <ChoiceField label="Orientation" {...register(`flaws.${index}.orientation`)} error={errors.orientation} hint={ORIENTATION_HELP}>
          {FLAW_ORIENTATIONS.map((value) => (
            <option key={value} value={value}>
              {ORIENTATION_CHOICES[value]}
            </option>
          ))}
        </ChoiceField>
        <ChoiceField label="Location" {...register(`flaws.${index}.location`)} error={errors.location}>
          {FLAW_LOCATIONS.map((value) => (
            <option key={value} value={value}>
              {LOCATION_LABELS[value]}
            </option>
          ))}
        </ChoiceField>
        {orientation !== 'laminar' && (
          <InputField
            label="Angle to the part axis"
            unit="°"
            inputMode="decimal"
            {...register(`flaws.${index}.angleDeg`, numberOptions)}
            error={errors.angleDeg}
            hint="Optional: overrides the orientation for an inclined crack"
          />
        )}
        <InputField
          label={location === 'surface' ? 'Crack depth' : 'Depth below the inspected surface'}
          unit="mm"
          inputMode="decimal"
          {...register(`flaws.${index}.depthMm`, numberOptions)}
          error={errors.depthMm}
        />
        <InputField label="Length" unit="mm" inputMode="decimal" {...register(`flaws.${index}.lengthMm`, numberOptions)} error={errors.lengthMm} />
        {location !== 'surface' && (
          <InputField
            label="Metal above the flaw (layered structures)"
            unit="mm"
            inputMode="decimal"
            {...register(`flaws.${index}.metalAboveMm`, numberOptions)}
            error={errors.metalAboveMm}
            hint="Optional: air gaps and sealant excluded"
          />
        )}
      </div>
    </div>
  );
}

export function FlawFields({ form }: { form: TechniqueFormApi }) {
  const { fields, append, remove } = useFieldArray({ control: form.control, name: 'flaws' });
  const listError = form.formState.errors.flaws?.message ?? form.formState.errors.flaws?.root?.message;
  return (
    <Section
      title="Expected flaws"
      actions={
        <Button
          variant="secondary"
          onClick={() => append({ id: `flaw-${fields.length + 1}`, orientation: 'transverse', location: 'surface', depthMm: 0.5, lengthMm: 2 })}
        >
          Add a flaw
        </Button>
      }
    >
      {fields.map((field, index) => (
        <FlawRow key={field.id} form={form} index={index} onRemove={() => remove(index)} canRemove={fields.length > 1} />
      ))}
      {listError && <p className="text-xs font-bold text-fail">{listError}</p>}
    </Section>
  );
}
