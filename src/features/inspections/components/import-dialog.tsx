import { useState } from 'react';
import {
  INSPECTION_IMPORT_COLUMNS,
  INSPECTION_IMPORT_MAX_BYTES,
  INSPECTION_IMPORT_MAX_ROWS,
  INSPECTION_RESULT_LABELS,
  type InspectionImportError,
  type InspectionImportPreview,
  type InspectionImportRow,
} from '../../../../shared/schemas/inspection';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { ErrorNotice, Loading } from '../../../components/ui/states';
import { useImportInspections, usePreviewInspectionImport } from '../api/inspections';

const TEMPLATE_HREF = `data:text/csv;charset=utf-8,${encodeURIComponent(`${INSPECTION_IMPORT_COLUMNS.map((c) => c.header).join(',')}\r\n`)}`;
const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

function ColumnGuide() {
  return (
    <details className="rounded-md border border-ink/10 bg-white px-3 py-2 text-sm">
      <summary className="cursor-pointer font-bold">Columns the file needs</summary>
      <p className="mt-2 text-ink-soft">
        A CSV file saved as UTF-8, the first row holding these headers (any order, any case). Up to {INSPECTION_IMPORT_MAX_ROWS} rows and{' '}
        {INSPECTION_IMPORT_MAX_BYTES / (1024 * 1024)} MB per file. Quote a cell that holds a comma or a line break. Nothing is written until every row is
        valid.
      </p>
      <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1">
        {INSPECTION_IMPORT_COLUMNS.map((column) => (
          <div key={column.header} className="contents">
            <dt className="font-mono text-xs font-bold">
              {column.header}
              {column.required ? '' : ' (optional)'}
            </dt>
            <dd className="text-xs text-ink-soft">{column.description}</dd>
          </div>
        ))}
      </dl>
      <a href={TEMPLATE_HREF} download="inspections-template.csv" className="mt-2 inline-block text-sm font-bold text-lagoon underline">
        Download an empty template
      </a>
    </details>
  );
}

const equipmentText = (row: InspectionImportRow) =>
  [row.instrument, row.probe, row.referenceStandard]
    .filter((item): item is NonNullable<typeof item> => item !== null)
    .map((item) => item.serialNumber)
    .join(', ') || '—';

/** The column a problem names; a problem of the whole row ("(row)") names none. */
const columnOf = (item: InspectionImportError) => (/^\(.*\)$/.test(item.field) ? null : item.field);

/** Rows drawn at most; rows with problems always show. */
const PREVIEW_ROWS = 200;

function byRow(items: InspectionImportError[]) {
  const map = new Map<number, InspectionImportError[]>();
  for (const item of items) map.set(item.row, [...(map.get(item.row) ?? []), item]);
  return map;
}

function PreviewTable({ preview }: { preview: InspectionImportPreview }) {
  const errorsByRow = byRow(preview.errors);
  const warningsByRow = byRow(preview.warnings);
  if (preview.rows.length === 0) return null;
  const shown = preview.rows.filter((row, index) => index < PREVIEW_ROWS || errorsByRow.has(row.row) || warningsByRow.has(row.row));
  return (
    <div className="max-h-80 overflow-auto rounded-md border border-ink/10 bg-white">
      {shown.length < preview.rows.length && (
        <p className="px-2 py-1 text-xs text-ink-soft">
          Showing {shown.length} of {preview.rows.length} rows: the first {PREVIEW_ROWS} and every row with a problem or a warning.
        </p>
      )}
      <table className="w-full text-left text-xs">
        <caption className="sr-only">Import preview</caption>
        <thead className="sticky top-0 bg-paper">
          <tr>
            {['Row', 'Inspection', 'Inspector and result', 'Equipment', 'Check'].map((header) => (
              <th key={header} scope="col" className="px-2 py-1 font-bold whitespace-nowrap">
                {header}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {shown.map((row) => {
            const errors = errorsByRow.get(row.row) ?? [];
            const warnings = warningsByRow.get(row.row) ?? [];
            return (
              <tr key={row.row} className={`border-t border-ink/10 align-top ${errors.length ? 'bg-red-50' : ''}`} data-invalid={errors.length > 0 || undefined}>
                <td className="px-2 py-1 font-bold">{row.row}</td>
                <td className="px-2 py-1">
                  <div className="font-bold whitespace-nowrap">
                    {row.performedOn} · {row.technique.code} rev {row.technique.revision}
                  </div>
                  <div>
                    {row.partNumber} S/N {row.serialNumber}
                  </div>
                  <div className="text-ink-soft">
                    {row.workOrder} · {row.customer}
                  </div>
                </td>
                <td className="px-2 py-1">
                  <div>{row.inspector.name ?? row.inspector.email}</div>
                  <div className="font-bold">{row.result ? INSPECTION_RESULT_LABELS[row.result] : '—'}</div>
                </td>
                <td className="px-2 py-1">{equipmentText(row)}</td>
                <td className="px-2 py-1 text-fail">
                  {errors.length === 0 && warnings.length === 0 ? (
                    <span className="font-bold text-pass">OK</span>
                  ) : (
                    <ul>
                      {errors.map((error, index) => (
                        <li key={`e${index}`}>
                          {columnOf(error) ? <><strong>{columnOf(error)}</strong>: </> : null}
                          {error.message}
                        </li>
                      ))}
                      {warnings.map((warning, index) => (
                        <li key={`w${index}`} className="text-warn">
                          <strong>Warning{columnOf(warning) ? `, ${columnOf(warning)}` : ''}</strong>: {warning.message}
                        </li>
                      ))}
                    </ul>
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

function ErrorList({ errors }: { errors: InspectionImportError[] }) {
  if (errors.length === 0) return null;
  return (
    <div role="alert" className="rounded-md border border-fail/30 bg-red-50 px-3 py-2 text-sm text-fail">
      <p className="font-bold">
        {plural(errors.length, 'problem')} found; nothing will be written until the file is corrected and chosen again.
      </p>
      <ul className="mt-1 max-h-40 list-disc overflow-auto pl-5">
        {errors.map((error, index) => (
          <li key={index}>
            Row {error.row}
            {columnOf(error) ? `, ${columnOf(error)}` : ''}: {error.message}
          </li>
        ))}
      </ul>
    </div>
  );
}

type Step = 'choose' | 'confirm' | 'done';

export function ImportDialog({ open, onClose }: { open: boolean; onClose(): void }) {
  const [file, setFile] = useState<File | null>(null);
  const [step, setStep] = useState<Step>('choose');
  const [tooLarge, setTooLarge] = useState<string | null>(null);
  const preview = usePreviewInspectionImport();
  const importer = useImportInspections();

  const close = () => {
    setTooLarge(null);
    setFile(null);
    setStep('choose');
    preview.reset();
    importer.reset();
    onClose();
  };
  const choose = (chosen: File | null) => {
    setFile(chosen);
    setStep('choose');
    importer.reset();
    preview.reset();
    setTooLarge(null);
    if (!chosen) return;
    // The server refuses it too (413); saying so here saves uploading it.
    if (chosen.size > INSPECTION_IMPORT_MAX_BYTES) {
      setTooLarge(`“${chosen.name}” is larger than the ${INSPECTION_IMPORT_MAX_BYTES / (1024 * 1024)} MB limit; split it into files of at most ${INSPECTION_IMPORT_MAX_ROWS} rows.`);
      return;
    }
    preview.mutate(chosen);
  };
  const result = preview.data;
  const rowCount = result?.rows.length ?? 0;
  // A 400 from the import itself carries the same per-row errors as a preview.
  const importErrors = importer.error instanceof ApiError && importer.error.code === 'invalid_import' ? (importer.error.details as InspectionImportError[]) : null;
  // The whole file is in the register already (sent twice): nothing to correct, nothing lost.
  const alreadyImported = importer.error instanceof ApiError && importer.error.code === 'already_imported' ? importer.error : null;

  return (
    <Dialog open={open} title="Import inspections from CSV" onClose={close}>
      {step === 'done' && importer.data ? (
        <div className="flex flex-col gap-4">
          <p role="status" className="rounded-md border border-pass/30 bg-green-50 px-3 py-2 text-sm font-bold text-pass">
            {plural(importer.data.written, 'inspection')} imported into the register.
          </p>
          <div className="flex justify-end">
            <Button onClick={close}>Close</Button>
          </div>
        </div>
      ) : step === 'confirm' ? (
        <div className="flex flex-col gap-4">
          <p className="text-sm">
            Write <strong>{plural(rowCount, 'inspection')}</strong> from “{file?.name}” to the register? Each becomes a record with its own trail entry; a
            wrong row is then corrected one by one.
          </p>
          {result && result.warnings.length > 0 && (
            <p className="rounded-md border border-warn/30 bg-amber-50 px-3 py-2 text-sm text-warn">
              {plural(result.warnings.length, 'warning')} in this file (equipment past its calibration due date or out of service): the rows are
              written as they stand. Review them with the quality manager.
            </p>
          )}
          {importErrors ? (
            <ErrorList errors={importErrors} />
          ) : alreadyImported ? (
            <p role="status" className="rounded-md border border-ink/20 bg-paper px-3 py-2 text-sm">
              {alreadyImported.message}
            </p>
          ) : importer.error ? (
            <ErrorNotice error={importer.error} title="Nothing was imported" />
          ) : null}
          <div className="flex justify-end gap-2">
            <Button variant="secondary" onClick={() => setStep('choose')} disabled={importer.isPending}>
              Back
            </Button>
            <Button
              onClick={() => file && importer.mutate(file, { onSuccess: () => setStep('done') })}
              busy={importer.isPending}
              busyLabel="Importing…"
              disabled={Boolean(importErrors)}
            >
              {`Import ${plural(rowCount, 'inspection')}`}
            </Button>
          </div>
        </div>
      ) : (
        <div className="flex flex-col gap-3">
          <ColumnGuide />
          <div className="flex flex-col gap-1">
            <label htmlFor="inspection-import-file" className="text-sm font-bold">
              CSV file
            </label>
            <input
              id="inspection-import-file"
              type="file"
              accept=".csv,text/csv"
              className="text-sm"
              onChange={(e) => choose(e.target.files?.[0] ?? null)}
            />
          </div>
          {tooLarge && (
            <p role="alert" className="rounded-md border border-fail/30 bg-red-50 px-3 py-2 text-sm text-fail">
              {tooLarge}
            </p>
          )}
          {preview.isPending && <Loading what="Reading the file" />}
          {preview.error ? <ErrorNotice error={preview.error} title="The file could not be read" /> : null}
          {result && (
            <>
              <p role="status" className={`text-sm font-bold ${result.valid ? 'text-pass' : 'text-fail'}`}>
                {result.valid
                  ? `${plural(rowCount, 'inspection')} read, all valid${result.warnings.length ? ` (${plural(result.warnings.length, 'warning')})` : ''}.`
                  : `${plural(rowCount, 'row')} read; ${plural(result.errors.length, 'problem')} to correct.`}
              </p>
              <ErrorList errors={result.errors} />
              <PreviewTable preview={result} />
            </>
          )}
          <div className="flex justify-end gap-2">
            <Button variant="secondary" onClick={close}>
              Cancel
            </Button>
            <Button onClick={() => setStep('confirm')} disabled={!result?.valid || preview.isPending}>
              {result?.valid ? `Import ${plural(rowCount, 'inspection')}…` : 'Import'}
            </Button>
          </div>
        </div>
      )}
    </Dialog>
  );
}
