// The materials library: nominal conductivity and permeability with where each
// value comes from. Everyone reads it; an administrator adds and corrects entries.
import { useState, type FormEvent } from 'react';
import type { MaterialView } from '../../../../shared/schemas/technique-register';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { TextAreaField, TextField } from '../../../components/ui/field';
import { EmptyState, ErrorNotice, Loading } from '../../../components/ui/states';
import { basisInWords } from '../../../../shared/labels';
import { useMaterials, useSaveMaterial } from '../api/techniques';

function MaterialForm({ material, onDone }: { material?: MaterialView; onDone(): void }) {
  const save = useSaveMaterial();
  const [values, setValues] = useState({
    name: material?.name ?? '',
    conductivityIacs: material ? String(material.conductivityIacs) : '',
    relativePermeability: material ? String(material.relativePermeability) : '1',
    source: material?.source ?? '',
  });
  const error = save.error instanceof ApiError ? save.error : null;
  const fieldError = (path: string) => error?.fieldErrors.find((detail) => detail.path === path)?.message;
  const set = (key: keyof typeof values) => (event: { target: { value: string } }) => setValues((current) => ({ ...current, [key]: event.target.value }));
  const number = (text: string) => (text.trim() === '' ? Number.NaN : Number(text.replace(',', '.')));
  const submit = (event: FormEvent) => {
    event.preventDefault();
    save.mutate(
      {
        id: material?.id,
        version: material?.version,
        name: values.name,
        conductivityIacs: number(values.conductivityIacs),
        relativePermeability: number(values.relativePermeability),
        source: values.source,
      },
      { onSuccess: onDone },
    );
  };
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3">
      <TextField label="Name" value={values.name} onChange={set('name')} error={fieldError('name')} required />
      <div className="grid grid-cols-2 gap-3">
        <TextField label="Conductivity (%IACS)" inputMode="decimal" value={values.conductivityIacs} onChange={set('conductivityIacs')} error={fieldError('conductivityIacs')} />
        <TextField label="Relative permeability μr" inputMode="decimal" value={values.relativePermeability} onChange={set('relativePermeability')} error={fieldError('relativePermeability')} />
      </div>
      <TextAreaField label="Source of the values" value={values.source} onChange={set('source')} error={fieldError('source')} hint="A handbook table, a measurement with a calibrated meter, …" />
      {error && error.fieldErrors.length === 0 && <ErrorNotice error={error} title="Not saved" />}
      <div className="flex justify-end gap-2">
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
        <Button type="submit" busy={save.isPending} busyLabel="Saving…">
          {material ? 'Save changes' : 'Add material'}
        </Button>
      </div>
    </form>
  );
}

export function MaterialsLibrary({ canEdit }: { canEdit: boolean }) {
  const materials = useMaterials();
  const [editing, setEditing] = useState<MaterialView | 'new' | null>(null);
  if (materials.isLoading) return <Loading what="Loading the materials library" />;
  if (materials.error) return <ErrorNotice error={materials.error} title="The materials library could not be loaded" />;
  const items = materials.data?.items ?? [];
  return (
    <div className="flex flex-col gap-3">
      {canEdit && (
        <div className="flex justify-end">
          <Button onClick={() => setEditing('new')}>Add a material</Button>
        </div>
      )}
      {items.length === 0 ? (
        <EmptyState title="The library is empty" />
      ) : (
        <div className="overflow-x-auto rounded-lg border border-ink/10 bg-white">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Materials with their nominal conductivity and permeability</caption>
            <thead className="bg-lagoon-soft/60 text-xs tracking-wide text-ink-soft">
              <tr>
                <th scope="col" className="px-3 py-2">Material</th>
                <th scope="col" className="px-3 py-2">Conductivity (%IACS)</th>
                <th scope="col" className="px-3 py-2">σ (MS/m)</th>
                <th scope="col" className="px-3 py-2">μr</th>
                <th scope="col" className="px-3 py-2">Source</th>
                {canEdit && <th scope="col" className="px-3 py-2"><span className="sr-only">Actions</span></th>}
              </tr>
            </thead>
            <tbody>
              {items.map((material) => (
                <tr key={material.id} className="border-t border-ink/5 align-top">
                  <td className="px-3 py-2 font-bold">{material.name}</td>
                  <td className="px-3 py-2">{material.conductivityIacs}</td>
                  {/* 100 %IACS = 58.0 MS/m (ASTM E1004). */}
                  <td className="px-3 py-2">{+(material.conductivityIacs * 0.58).toPrecision(3)}</td>
                  <td className="px-3 py-2">{material.relativePermeability}</td>
                  <td className="px-3 py-2 text-xs text-ink-soft">{basisInWords(material.source)}</td>
                  {canEdit && (
                    <td className="px-3 py-2 text-right">
                      <Button variant="ghost" onClick={() => setEditing(material)} aria-label={`Edit ${material.name}`}>
                        Edit
                      </Button>
                    </td>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {editing && (
        <Dialog open title={editing === 'new' ? 'Add a material' : `Edit ${editing.name}`} onClose={() => setEditing(null)}>
          <MaterialForm material={editing === 'new' ? undefined : editing} onDone={() => setEditing(null)} />
        </Dialog>
      )}
    </div>
  );
}
