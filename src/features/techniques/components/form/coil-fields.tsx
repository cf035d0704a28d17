import { useFieldArray } from 'react-hook-form';
import { COIL_MODES, COIL_TYPES } from '../../../../../shared/schemas/technique';
import { Button } from '../../../../components/ui/button';
import { COIL_TYPE_LABELS } from '../labels';
import { CheckField, ChoiceField, InputField, Section, numberOptions, useFieldError, type TechniqueFormApi } from './form-kit';
import { FrequencyInput } from './frequency-input';

function CoilRow({ form, index, onRemove, canRemove }: { form: TechniqueFormApi; index: number; onRemove(): void; canRemove: boolean }) {
  const { register } = form;
  const errors = {
    type: useFieldError(form, `coils.${index}.type`),
    diameterMm: useFieldError(form, `coils.${index}.diameterMm`),
    mode: useFieldError(form, `coils.${index}.mode`),
  };
  return (
    <div className="rounded-md border border-ink/10 bg-paper/60 p-3" data-testid={`coil-${index}`}>
      <div className="mb-2 flex items-center justify-between">
        <p className="text-sm font-bold">Coil {index + 1}</p>
        <Button variant="ghost" onClick={onRemove} disabled={!canRemove} aria-label={`Remove coil ${index + 1}`}>
          Remove
        </Button>
      </div>
      <div className="grid grid-cols-2 gap-3">
        <ChoiceField label="Coil type" {...register(`coils.${index}.type`)} error={errors.type}>
          {COIL_TYPES.map((type) => (
            <option key={type} value={type}>
              {COIL_TYPE_LABELS[type]}
            </option>
          ))}
        </ChoiceField>
        <InputField label="Coil diameter" unit="mm" inputMode="decimal" {...register(`coils.${index}.diameterMm`, numberOptions)} error={errors.diameterMm} />
        <ChoiceField label="Mode" {...register(`coils.${index}.mode`)} error={errors.mode}>
          {COIL_MODES.map((mode) => (
            <option key={mode} value={mode}>
              {mode === 'absolute' ? 'Absolute' : 'Differential'}
            </option>
          ))}
        </ChoiceField>
        <div className="flex items-end pb-1.5">
          <CheckField label="Shielded coil" {...register(`coils.${index}.shielded`)} />
        </div>
      </div>
      <div className="mt-3">
        <FrequencyInput form={form} index={index} />
      </div>
    </div>
  );
}

export function CoilFields({ form }: { form: TechniqueFormApi }) {
  const { fields, append, remove } = useFieldArray({ control: form.control, name: 'coils' });
  const listError = useFieldError(form, 'coils.root') ?? form.formState.errors.coils?.message;
  return (
    <Section
      title="Coils"
      actions={
        <Button variant="secondary" onClick={() => append({ type: 'surface', diameterMm: 5, shielded: false, mode: 'absolute', frequenciesHz: [100_000] })}>
          Add a coil
        </Button>
      }
    >
      {fields.map((field, index) => (
        <CoilRow key={field.id} form={form} index={index} onRemove={() => remove(index)} canRemove={fields.length > 1} />
      ))}
      {listError && <p className="text-xs font-bold text-fail">{listError}</p>}
    </Section>
  );
}
