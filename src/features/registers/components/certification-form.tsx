import { useState, type FormEvent } from 'react';
import {
  CERTIFICATION_SCHEMES,
  CERTIFICATION_SCHEME_LABELS,
  NDT_METHODS,
  type CertificationView,
} from '../../../../shared/schemas/certification';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { FormErrorNotice } from '../../../components/ui/form-error';
import { formErrors } from '../../../lib/field-errors';
import { usePeople } from '../api/certifications';

export interface CertificationFormValues {
  userId: number | null;
  method: (typeof NDT_METHODS)[number];
  level: 1 | 2 | 3;
  scheme: (typeof CERTIFICATION_SCHEMES)[number];
  certificateNumber: string;
  issuedOn: string;
  expiresOn: string;
  nearVisionExamOn: string;
  colourVisionCheckedOn: string;
  sectors: string;
  notes: string;
}

/** The form's fields by the paths the server names, with their labels. */
const CERTIFICATION_FIELDS = {
  userId: 'Person',
  method: 'Method',
  level: 'Level',
  scheme: 'Scheme',
  certificateNumber: 'Certificate number',
  issuedOn: 'Issued',
  expiresOn: 'Expires',
  nearVisionExamOn: 'Near-vision exam',
  colourVisionCheckedOn: 'Colour-vision check',
  sectors: 'Sectors',
  notes: 'Notes',
};

export function CertificationForm({
  certification,
  pending,
  error,
  onSubmit,
  onCancel,
}: {
  certification?: CertificationView;
  pending: boolean;
  error: unknown;
  onSubmit(values: CertificationFormValues): void;
  onCancel(): void;
}) {
  const people = usePeople();
  const [values, setValues] = useState<CertificationFormValues>({
    userId: certification?.userId ?? null,
    method: (certification?.method as CertificationFormValues['method']) ?? 'ET',
    level: certification?.level ?? 2,
    scheme: (certification?.scheme as CertificationFormValues['scheme']) ?? 'EN 4179',
    certificateNumber: certification?.certificateNumber ?? '',
    issuedOn: certification?.issuedOn ?? '',
    expiresOn: certification?.expiresOn ?? '',
    nearVisionExamOn: certification?.nearVisionExamOn ?? '',
    colourVisionCheckedOn: certification?.colourVisionCheckedOn ?? '',
    sectors: certification?.sectors.join(', ') ?? '',
    notes: certification?.notes ?? '',
  });
  const apiError = error instanceof ApiError ? error : null;
  const fieldError = formErrors(error, CERTIFICATION_FIELDS).at;
  const set = <K extends keyof CertificationFormValues>(key: K, value: CertificationFormValues[K]) =>
    setValues((current) => ({ ...current, [key]: value }));
  const submit = (event: FormEvent) => {
    event.preventDefault();
    onSubmit(values);
  };

  return (
    <form onSubmit={submit} className="grid grid-cols-2 gap-3" noValidate>
      <div className="col-span-2">
        {certification ? (
          <p className="text-sm">
            <span className="font-bold">Person:</span> {certification.personName}
          </p>
        ) : (
          <SelectField label="Person" required value={values.userId ?? ''} onChange={(e) => set('userId', e.target.value ? Number(e.target.value) : null)} error={fieldError('userId')}>
            <option value="">Choose a person…</option>
            {people.data?.items.map((person) => (
              <option key={person.id} value={person.id}>
                {person.displayName} ({person.email})
              </option>
            ))}
          </SelectField>
        )}
      </div>
      <SelectField label="Method" value={values.method} onChange={(e) => set('method', e.target.value as CertificationFormValues['method'])} error={fieldError('method')}>
        {NDT_METHODS.map((method) => (
          <option key={method} value={method}>
            {method}
          </option>
        ))}
      </SelectField>
      <SelectField label="Level" value={values.level} onChange={(e) => set('level', Number(e.target.value) as 1 | 2 | 3)} error={fieldError('level')}>
        {[1, 2, 3].map((level) => (
          <option key={level} value={level}>
            Level {level}
          </option>
        ))}
      </SelectField>
      <SelectField label="Scheme" value={values.scheme} onChange={(e) => set('scheme', e.target.value as CertificationFormValues['scheme'])} error={fieldError('scheme')}>
        {CERTIFICATION_SCHEMES.map((scheme) => (
          <option key={scheme} value={scheme}>
            {CERTIFICATION_SCHEME_LABELS[scheme]}
          </option>
        ))}
      </SelectField>
      <TextField label="Certificate number" required value={values.certificateNumber} onChange={(e) => set('certificateNumber', e.target.value)} error={fieldError('certificateNumber')} />
      <TextField label="Issued" type="date" required value={values.issuedOn} onChange={(e) => set('issuedOn', e.target.value)} error={fieldError('issuedOn')} />
      <TextField label="Expires" type="date" required value={values.expiresOn} onChange={(e) => set('expiresOn', e.target.value)} error={fieldError('expiresOn')} />
      <TextField
        label="Last near-vision exam"
        type="date"
        value={values.nearVisionExamOn}
        onChange={(e) => set('nearVisionExamOn', e.target.value)}
        hint="Counts for the policy period (12 months by default)."
        error={fieldError('nearVisionExamOn')}
      />
      <TextField label="Colour-vision check" type="date" value={values.colourVisionCheckedOn} onChange={(e) => set('colourVisionCheckedOn', e.target.value)} error={fieldError('colourVisionCheckedOn')} />
      <div className="col-span-2">
        <TextField label="Sectors" value={values.sectors} onChange={(e) => set('sectors', e.target.value)} hint="Separate sectors with commas, e.g. aerospace, in-service inspection." error={fieldError('sectors')} />
      </div>
      <div className="col-span-2">
        <TextAreaField label="Notes" rows={2} value={values.notes} onChange={(e) => set('notes', e.target.value)} error={fieldError('notes')} />
      </div>
      {apiError && (
        <div className="col-span-2">
          <FormErrorNotice error={apiError} fields={CERTIFICATION_FIELDS} />
        </div>
      )}
      <div className="col-span-2 mt-2 flex justify-end gap-2">
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" busy={pending} busyLabel="Saving…">
          {certification ? 'Save changes' : 'Record certificate'}
        </Button>
      </div>
    </form>
  );
}

export function toCertificationInput(values: CertificationFormValues) {
  return {
    method: values.method,
    level: values.level,
    scheme: values.scheme,
    certificateNumber: values.certificateNumber,
    issuedOn: values.issuedOn,
    expiresOn: values.expiresOn,
    nearVisionExamOn: values.nearVisionExamOn || null,
    colourVisionCheckedOn: values.colourVisionCheckedOn || null,
    sectors: values.sectors
      .split(',')
      .map((sector) => sector.trim())
      .filter(Boolean),
    notes: values.notes.trim() || null,
  };
}
