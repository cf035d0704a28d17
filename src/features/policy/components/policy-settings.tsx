// Every policy setting with its default, where the default comes from, and the
// organisation's value; an admin edits the values and saves them together.
import { useMemo, useState } from 'react';
import type { PolicyKey } from '../../../../shared/domain/policy';
import type { PolicyView } from '../../../../shared/schemas/technique-register';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { ErrorNotice } from '../../../components/ui/states';
import { basisInWords } from '../../../../shared/labels';
import { useUpdatePolicy } from '../api/policy';

type Drafts = Partial<Record<PolicyKey, string>>;

export function PolicySettings({ view, canEdit }: { view: PolicyView; canEdit: boolean }) {
  const [drafts, setDrafts] = useState<Drafts>({});
  const [confirming, setConfirming] = useState(false);
  const update = useUpdatePolicy();
  const fieldErrors = useMemo(() => {
    const errors: Partial<Record<string, string>> = {};
    if (update.error instanceof ApiError) for (const detail of update.error.fieldErrors) errors[detail.path.replace(/^values\./, '')] = detail.message;
    return errors;
  }, [update.error]);

  const changes = Object.entries(drafts).filter(([key, text]) => {
    const setting = view.settings.find((item) => item.key === key)!;
    return text !== undefined && text.trim() !== '' && Number(text.replace(',', '.')) !== setting.value;
  }) as [PolicyKey, string][];

  const save = (values: Partial<Record<PolicyKey, number | null>>) =>
    update.mutate(
      { version: view.version, values },
      {
        onSuccess: () => {
          setDrafts({});
          setConfirming(false);
        },
        onError: () => setConfirming(false),
      },
    );

  return (
    <div className="flex flex-col gap-3">
      <div className="overflow-x-auto rounded-lg border border-ink/10 bg-white">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Policy settings of the organisation</caption>
          <thead className="bg-lagoon-soft/60 text-xs tracking-wide text-ink-soft">
            <tr>
              <th scope="col" className="px-3 py-2">Setting</th>
              <th scope="col" className="px-3 py-2">Default</th>
              <th scope="col" className="px-3 py-2">Basis of the default</th>
              <th scope="col" className="px-3 py-2">Organisation's value</th>
            </tr>
          </thead>
          <tbody>
            {view.settings.map((setting) => {
              const error = fieldErrors[setting.key];
              const inputId = `policy-${setting.key}`;
              return (
                <tr key={setting.key} className="border-t border-ink/5 align-top" data-setting={setting.key}>
                  <td className="px-3 py-2">
                    <label htmlFor={inputId} className="font-bold text-ink">
                      {setting.label}
                    </label>
                    <span className="block font-mono text-xs text-ink-soft">{setting.key}</span>
                  </td>
                  <td className="px-3 py-2 whitespace-nowrap">
                    {setting.defaultValue} {setting.unit}
                  </td>
                  <td className="px-3 py-2 text-xs text-ink-soft">{basisInWords(setting.basis)}</td>
                  <td className="px-3 py-2">
                    <div className="flex items-center gap-2">
                      <input
                        id={inputId}
                        inputMode="decimal"
                        className="w-24 rounded-md border border-ink/25 bg-white px-2 py-1 text-sm aria-[invalid=true]:border-fail disabled:bg-paper"
                        value={drafts[setting.key] ?? String(setting.value)}
                        disabled={!canEdit}
                        aria-invalid={Boolean(error)}
                        aria-describedby={error ? `${inputId}-error` : undefined}
                        onChange={(event) => setDrafts((current) => ({ ...current, [setting.key]: event.target.value }))}
                      />
                      <span className="text-xs text-ink-soft">{setting.unit}</span>
                    </div>
                    <span className="mt-0.5 block text-xs text-ink-soft">
                      {setting.isDefault ? 'default' : `changed${setting.updatedBy ? ` by ${setting.updatedBy.name}` : ''}${setting.updatedAt ? `, ${new Date(setting.updatedAt).toLocaleDateString()}` : ''}`}
                      {' · '}range {setting.min} to {setting.max}
                    </span>
                    {canEdit && !setting.isDefault && (
                      <button type="button" className="text-xs font-bold text-lagoon underline" onClick={() => save({ [setting.key]: null })}>
                        Back to the default
                      </button>
                    )}
                    {error && (
                      <p id={`${inputId}-error`} className="text-xs font-bold text-fail">
                        {error}
                      </p>
                    )}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {update.error && !(update.error instanceof ApiError && update.error.fieldErrors.length) ? <ErrorNotice error={update.error} title="Not saved" /> : null}
      {canEdit && (
        <div className="flex justify-end gap-2">
          <Button variant="secondary" disabled={changes.length === 0} onClick={() => setDrafts({})}>
            Discard changes
          </Button>
          <Button disabled={changes.length === 0 || update.isPending} onClick={() => setConfirming(true)}>
            Save {changes.length || ''} {changes.length === 1 ? 'change' : 'changes'}
          </Button>
        </div>
      )}
      <ConfirmDialog
        open={confirming}
        title="Change the organisation's policy?"
        confirmLabel="Save the policy"
        pending={update.isPending}
        onCancel={() => setConfirming(false)}
        onConfirm={() => save(Object.fromEntries(changes.map(([key, text]) => [key, Number(text.replace(',', '.'))])))}
      >
        <p>Every technique's checklist is evaluated again with the new values; verdicts in the register may change. The change is on the trail.</p>
        <ul className="mt-2 list-disc pl-5">
          {changes.map(([key, text]) => {
            const setting = view.settings.find((item) => item.key === key)!;
            return (
              <li key={key}>
                {setting.label}: {setting.value} → {text} {setting.unit}
              </li>
            );
          })}
        </ul>
      </ConfirmDialog>
    </div>
  );
}
