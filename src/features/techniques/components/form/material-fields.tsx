import { useWatch } from 'react-hook-form';
import { useMaterials } from '../../api/techniques';
import { CheckField, ChoiceField, InputField, Section, TextBoxField, numberOptions, useFieldError, type TechniqueFormApi } from './form-kit';

export function MaterialFields({ form }: { form: TechniqueFormApi }) {
  const materials = useMaterials();
  const { register, setValue, control } = form;
  const permeability = useWatch({ control, name: 'material.relativePermeability' });
  const errors = {
    name: useFieldError(form, 'material.name'),
    conductivityIacs: useFieldError(form, 'material.conductivityIacs'),
    relativePermeability: useFieldError(form, 'material.relativePermeability'),
    justification: useFieldError(form, 'material.ferromagneticJustification'),
  };

  const pick = (id: string) => {
    const material = materials.data?.items.find((item) => String(item.id) === id);
    if (!material) return;
    const options = { shouldDirty: true, shouldValidate: true } as const;
    setValue('material.name', material.name, options);
    setValue('material.conductivityIacs', material.conductivityIacs, options);
    setValue('material.relativePermeability', material.relativePermeability, options);
  };

  return (
    <Section title="Material">
      <ChoiceField
        label="Pick from the materials library"
        value=""
        onChange={(event) => pick(event.target.value)}
        hint={materials.isError ? 'The library could not be loaded; enter the values yourself.' : 'Fills the fields below; the values stay editable (use the conductivity measured on the part where it matters).'}
      >
        <option value="">{materials.isLoading ? 'Loading the library…' : 'Choose a material…'}</option>
        {materials.data?.items.map((material) => (
          <option key={material.id} value={material.id}>
            {material.name}: {material.conductivityIacs} %IACS, μr {material.relativePermeability}
          </option>
        ))}
      </ChoiceField>
      <InputField label="Material name" {...register('material.name')} error={errors.name} />
      <div className="grid grid-cols-2 gap-3">
        <InputField label="Conductivity" unit="%IACS" inputMode="decimal" {...register('material.conductivityIacs', numberOptions)} error={errors.conductivityIacs} />
        <InputField
          label="Relative permeability μr"
          inputMode="decimal"
          {...register('material.relativePermeability', numberOptions)}
          error={errors.relativePermeability}
          hint="1 for non-magnetic metals"
        />
      </div>
      {typeof permeability === 'number' && permeability > 1 && (
        <div className="flex flex-col gap-2 rounded-md border border-warn/40 bg-amber-50 p-3">
          <p className="text-xs font-bold text-warn">Ferromagnetic material: permeability swamps the eddy current signal unless the part is magnetically saturated.</p>
          <CheckField label="Magnetic saturation is used" {...register('material.saturated')} />
          <TextBoxField label="Justification when saturation is not used" {...register('material.ferromagneticJustification')} error={errors.justification} />
        </div>
      )}
    </Section>
  );
}
