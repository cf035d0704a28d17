import { CheckField, InputField, Section, numberOptions, useFieldError, type TechniqueFormApi } from './form-kit';

export function ScanFields({ form }: { form: TechniqueFormApi }) {
  const { register } = form;
  const errors = { indexMm: useFieldError(form, 'scan.indexMm'), minEdgeDistanceMm: useFieldError(form, 'scan.minEdgeDistanceMm') };
  return (
    <Section title="Scan">
      <div className="grid grid-cols-2 gap-3">
        <InputField
          label="Scan index (step between passes)"
          unit="mm"
          inputMode="decimal"
          {...register('scan.indexMm', numberOptions)}
          error={errors.indexMm}
          hint="Leave empty for coils that go round or through the part"
        />
        <InputField
          label="Closest coil-centre-to-edge distance"
          unit="mm"
          inputMode="decimal"
          {...register('scan.minEdgeDistanceMm', numberOptions)}
          error={errors.minEdgeDistanceMm}
          hint="Leave empty when the scan area has no edge"
        />
      </div>
      <CheckField label="A guide or fixture holds the edge distance" {...register('scan.edgeGuide')} />
    </Section>
  );
}
