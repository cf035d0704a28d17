import { useWatch } from 'react-hook-form';
import { PART_FORMS, type PartForm } from '../../../../../shared/schemas/technique';
import { PART_FORM_LABELS } from '../labels';
import { ChoiceField, InputField, Section, numberOptions, useFieldError, type TechniqueFormApi } from './form-kit';

const FIELDS_BY_FORM: Record<PartForm, ('thicknessMm' | 'diameterMm' | 'wallMm')[]> = {
  plate: ['thicknessMm'],
  bar: ['diameterMm'],
  tube: ['diameterMm', 'wallMm'],
  bore: ['diameterMm', 'thicknessMm'],
};

const LABELS: Record<PartForm, Partial<Record<'thicknessMm' | 'diameterMm' | 'wallMm', string>>> = {
  plate: { thicknessMm: 'Thickness (whole stack for layered structures)' },
  bar: { diameterMm: 'Bar diameter' },
  tube: { diameterMm: 'Outside diameter', wallMm: 'Wall thickness' },
  bore: { diameterMm: 'Bore diameter', thicknessMm: 'Bore length (material thickness)' },
};

export function PartFields({ form }: { form: TechniqueFormApi }) {
  const { register, setValue, control } = form;
  const partForm = (useWatch({ control, name: 'part.form' }) ?? 'plate') as PartForm;
  const errors = {
    form: useFieldError(form, 'part.form'),
    thicknessMm: useFieldError(form, 'part.thicknessMm'),
    diameterMm: useFieldError(form, 'part.diameterMm'),
    wallMm: useFieldError(form, 'part.wallMm'),
  };
  const formField = register('part.form');

  return (
    <Section title="Part form and dimensions">
      <ChoiceField
        label="Part form"
        {...formField}
        onChange={(event) => {
          // Dimensions that do not belong to the new form are cleared, so they cannot linger unseen.
          const next = event.target.value as PartForm;
          for (const field of ['thicknessMm', 'diameterMm', 'wallMm'] as const) {
            if (!FIELDS_BY_FORM[next].includes(field)) setValue(`part.${field}`, undefined, { shouldDirty: true });
          }
          return formField.onChange(event);
        }}
        error={errors.form}
      >
        {PART_FORMS.map((value) => (
          <option key={value} value={value}>
            {PART_FORM_LABELS[value]}
          </option>
        ))}
      </ChoiceField>
      <div className="grid grid-cols-2 gap-3">
        {FIELDS_BY_FORM[partForm].map((field) => (
          <InputField
            key={`${partForm}-${field}`}
            label={LABELS[partForm][field]!}
            unit="mm"
            inputMode="decimal"
            {...register(`part.${field}`, numberOptions)}
            error={errors[field]}
          />
        ))}
      </div>
    </Section>
  );
}
