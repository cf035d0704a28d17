// The technique editor: a form on the engine's own schema, with the checklist,
// the current-density plot and the current-direction diagram re-evaluated in the
// browser on every change. Nothing is lost on a bad import or a refused save.
import { useEffect, useRef, useState, type ReactNode } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useBlocker } from 'react-router-dom';
import { TechniqueSchema, type Technique, type TechniqueInput } from '../../../../shared/schemas/technique';
import type { Policy, TechniqueIssue } from '../../../../shared/domain/checklist';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { Caution } from '../../../components/ui/caution';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { ErrorNotice, Loading } from '../../../components/ui/states';
import { useAreas, useOrganisationPolicy } from '../api/techniques';
import { useLiveChecklist } from '../hooks/use-live-checklist';
import { TechniqueAnalysis } from './technique-analysis';
import { downloadTechniqueFile, readTechniqueFile, techniqueFileName } from './technique-file';
import { ChoiceField, InputField, Section, useFieldError, type TechniqueFormApi } from './form/form-kit';
import { MaterialFields } from './form/material-fields';
import { PartFields } from './form/part-fields';
import { CoilFields } from './form/coil-fields';
import { ScanFields } from './form/scan-fields';
import { FlawFields } from './form/flaw-fields';
import { ReferenceFields } from './form/reference-fields';

export interface TechniqueEditorProps {
  mode: 'create' | 'edit';
  initial: TechniqueInput;
  initialAreaId: number | null;
  heading: ReactNode;
  saving: boolean;
  saveError: unknown;
  onSave(technique: Technique, areaId: number | null): Promise<unknown>;
  /** After a successful save (navigation from here is not blocked). */
  onSaved?(result: unknown): void;
  /** Extra header actions (approve), told whether unsaved changes exist. */
  renderActions?(state: { dirty: boolean }): ReactNode;
}

/** "technique.coils[0].diameterMm" (server) → "coils.0.diameterMm" (form). */
function formPath(path: string): string {
  return path.replace(/^technique\.?/, '').replace(/\[(\d+)\]/g, '.$1');
}

function IssueList({ issues }: { issues: TechniqueIssue[] }) {
  return (
    <ul className="mt-2 list-disc pl-5 text-sm">
      {issues.map((issue, index) => (
        <li key={`${issue.path}-${index}`}>
          {issue.path && <span className="font-mono text-xs">{issue.path}: </span>}
          {issue.message}
        </li>
      ))}
    </ul>
  );
}

function IdentityFields({ form, mode, areaId, setAreaId }: { form: TechniqueFormApi; mode: 'create' | 'edit'; areaId: number | null; setAreaId(id: number | null): void }) {
  const areas = useAreas();
  const errors = { code: useFieldError(form, 'code'), title: useFieldError(form, 'title'), revision: useFieldError(form, 'revision') };
  return (
    <Section title="Technique">
      <div className="grid grid-cols-2 gap-3">
        <InputField
          label="Technique code"
          {...form.register('code')}
          readOnly={mode === 'edit'}
          error={errors.code}
          hint={mode === 'edit' ? 'A technique keeps its code; its revisions carry the changes.' : 'As written on the technique sheet, e.g. TAC-ET-040'}
        />
        <InputField
          label="Revision"
          {...form.register('revision')}
          readOnly={mode === 'edit'}
          error={errors.revision}
          hint={mode === 'edit' ? 'Set when the revision was started.' : 'Usually A for a new technique'}
        />
      </div>
      <InputField label="Title" {...form.register('title')} error={errors.title} />
      <ChoiceField label="Area" value={areaId ?? ''} onChange={(event) => setAreaId(event.target.value ? Number(event.target.value) : null)}>
        <option value="">No particular area</option>
        {areas.data?.items.map((area) => (
          <option key={area.id} value={area.id}>
            {area.name}
          </option>
        ))}
      </ChoiceField>
    </Section>
  );
}

function LivePanel({ form, policy }: { form: TechniqueFormApi; policy: Policy | undefined }) {
  const values = useWatch({ control: form.control });
  const live = useLiveChecklist(values, policy);
  if (live.kind === 'invalid') {
    return (
      <section className="rounded-lg border border-warn/40 bg-amber-50 p-4" aria-live="polite" data-testid="checklist-incomplete">
        <h2 className="text-lg font-bold text-ink">Checklist waits for a complete technique</h2>
        <p className="text-sm text-ink-soft">The checklist runs as soon as these fields are filled in correctly:</p>
        <IssueList issues={live.issues} />
        <div className="mt-3">
          <Caution compact />
        </div>
      </section>
    );
  }
  return (
    <TechniqueAnalysis
      technique={live.technique}
      output={live.output}
      title="Checklist (live, not saved)"
      note="Evaluated in your browser with the organisation's policy as you type; saving stores the technique, not this result."
    />
  );
}

export function TechniqueEditor({ mode, initial, initialAreaId, heading, saving, saveError, onSave, onSaved, renderActions }: TechniqueEditorProps) {
  const policy = useOrganisationPolicy();
  const form = useForm<TechniqueInput, unknown, Technique>({
    resolver: zodResolver(TechniqueSchema),
    defaultValues: initial,
    mode: 'onChange',
  });
  const [areaId, setAreaId] = useState<number | null>(initialAreaId);
  const [importState, setImportState] = useState<{ message: string; issues: TechniqueIssue[]; ok: boolean } | null>(null);
  const fileInput = useRef<HTMLInputElement>(null);
  const [savedAreaId, setSavedAreaId] = useState<number | null>(initialAreaId);
  const leaving = useRef(false);
  const dirty = form.formState.isDirty || areaId !== savedAreaId;
  const blocker = useBlocker(
    ({ currentLocation, nextLocation }) => dirty && !saving && !leaving.current && currentLocation.pathname !== nextLocation.pathname,
  );

  useEffect(() => {
    if (!dirty) return;
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);

  // Field errors from the server land on the fields they name.
  useEffect(() => {
    if (!(saveError instanceof ApiError)) return;
    for (const detail of saveError.fieldErrors) {
      if (detail.path.startsWith('technique')) form.setError(formPath(detail.path) as never, { type: 'server', message: detail.message });
    }
  }, [saveError, form]);

  const submit = form.handleSubmit(async (technique) => {
    let result: unknown;
    try {
      result = await onSave(technique, areaId);
    } catch {
      return; // the error shows from saveError; the form keeps every change
    }
    leaving.current = true;
    form.reset(technique);
    setSavedAreaId(areaId);
    onSaved?.(result);
    setTimeout(() => {
      leaving.current = false;
    }, 0);
  });

  const exportFile = () => {
    const values = form.getValues();
    const parsed = TechniqueSchema.safeParse(values);
    downloadTechniqueFile(parsed.success ? parsed.data : values, techniqueFileName(String(values.code ?? ''), String(values.revision ?? '')));
  };

  const importFile = async (file: File | undefined) => {
    if (!file) return;
    const result = await readTechniqueFile(file);
    if (!result.ok) {
      setImportState({ message: result.reason, issues: result.issues, ok: false });
      return;
    }
    const current = form.getValues();
    const kept = mode === 'edit' && (result.technique.code !== current.code || result.technique.revision !== current.revision);
    const next = mode === 'edit' ? { ...result.technique, code: current.code, revision: current.revision } : result.technique;
    form.reset(next, { keepDefaultValues: true });
    await form.trigger();
    setImportState({
      message: `Loaded ${file.name}.${kept ? ` Code and revision stay ${current.code} revision ${current.revision}.` : ''} Review it, then save.`,
      issues: [],
      ok: true,
    });
  };

  const serverMessage =
    saveError instanceof ApiError
      ? saveError.status === 409
        ? `${saveError.message}. Your changes are still here: export them as JSON, reload the page, then import them again.`
        : saveError.message
      : saveError
        ? String(saveError)
        : null;

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label="Technique editor">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>{heading}</div>
        <div className="flex flex-wrap gap-2">
          <input
            ref={fileInput}
            type="file"
            accept="application/json,.json"
            className="sr-only"
            aria-label="Technique JSON file to import"
            data-testid="import-file"
            onChange={(event) => {
              void importFile(event.target.files?.[0]);
              event.target.value = '';
            }}
          />
          <Button variant="secondary" onClick={() => fileInput.current?.click()}>
            Import JSON…
          </Button>
          <Button variant="secondary" onClick={exportFile}>
            Export JSON
          </Button>
          <Button type="submit" busy={saving} busyLabel="Saving…">
            {mode === 'create' ? 'Create draft' : dirty ? 'Save draft' : 'Saved'}
          </Button>
          {renderActions?.({ dirty })}
        </div>
      </div>

      <div className="rounded-lg border-2 border-copper/60 bg-copper-soft/40 p-3">
        <Caution />
      </div>

      {importState && (
        <div role={importState.ok ? 'status' : 'alert'} className={`rounded-md border px-3 py-2 text-sm ${importState.ok ? 'border-lagoon/40 bg-lagoon-soft/50 text-ink' : 'border-fail/30 bg-red-50 text-fail'}`}>
          <div className="flex justify-between gap-2">
            <strong className="font-bold">{importState.message}</strong>
            <button type="button" className="text-xs underline" onClick={() => setImportState(null)}>
              Dismiss
            </button>
          </div>
          {importState.issues.length > 0 && <IssueList issues={importState.issues} />}
        </div>
      )}
      {serverMessage && <ErrorNotice error={serverMessage} title="Not saved" />}
      {policy.isError && <ErrorNotice error={policy.error} title="The organisation's policy could not be loaded; the live checklist uses the default settings" />}

      <div className="grid gap-4 lg:grid-cols-2">
        <div className="flex min-w-0 flex-col gap-4">
          <IdentityFields form={form} mode={mode} areaId={areaId} setAreaId={setAreaId} />
          <MaterialFields form={form} />
          <PartFields form={form} />
          <CoilFields form={form} />
          <ScanFields form={form} />
          <FlawFields form={form} />
          <ReferenceFields form={form} />
        </div>
        {/* The live checklist stays in view while the form scrolls; on a narrow screen it follows the form. */}
        <div className="min-w-0 lg:sticky lg:top-2 lg:max-h-[calc(100vh-1rem)] lg:self-start lg:overflow-y-auto" data-testid="live-checklist">
          {policy.isLoading ? <Loading what="Loading the organisation's policy" /> : <LivePanel form={form} policy={policy.data?.policy} />}
        </div>
      </div>

      <ConfirmDialog
        open={blocker.state === 'blocked'}
        title="Leave without saving?"
        confirmLabel="Leave and discard"
        danger
        onCancel={() => blocker.reset?.()}
        onConfirm={() => blocker.proceed?.()}
      >
        Your changes to this technique are not saved. Export them as JSON first if you want to keep them.
      </ConfirmDialog>
    </form>
  );
}
