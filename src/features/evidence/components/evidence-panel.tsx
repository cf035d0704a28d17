// Evidence of one record: pick or drop several files, watch each upload, see
// what was refused and why, and the list of stored files with their hashes.
import { useCallback, useRef, useState, type DragEvent } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { subject } from '@casl/ability';
import { EVIDENCE_ACCEPT_ATTRIBUTE, EVIDENCE_ACCEPT_HINT, type EvidenceRecordType, type EvidenceView } from '../../../../shared/schemas/evidence';
import { Button } from '../../../components/ui/button';
import { EmptyState, ErrorNotice, Loading } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';
import { useAbility } from '../../../lib/ability';
import { evidenceQueryKey, uploadEvidenceFile, useEvidence, useSupersedeEvidence } from '../api/evidence';
import { EvidenceList } from './evidence-list';
import { SupersedeDialog } from './supersede-dialog';
import { UploadQueue, type QueuedUpload } from './upload-queue';

export interface EvidencePanelProps {
  recordType: EvidenceRecordType;
  recordId: number;
  /** The record's owner (action owner, certificate holder): the role rules for adding evidence look at it. */
  recordOwnerId?: number | null;
  /** Hide the upload area (e.g. the record no longer takes evidence). */
  readOnly?: boolean;
  title?: string;
  /** Called after a file was stored or superseded (the record page refreshes its evidence count). */
  onChange?: () => void;
}

let uploadCounter = 0;

export function EvidencePanel({ recordType, recordId, recordOwnerId = null, readOnly = false, title = 'Evidence', onChange }: EvidencePanelProps) {
  const ability = useAbility();
  const queryClient = useQueryClient();
  const canRead = ability.can('read', subject('Evidence', { recordType, recordId, recordOwnerId }));
  const evidence = useEvidence(recordType, recordId, { enabled: canRead });
  const supersede = useSupersedeEvidence(recordType, recordId);
  const [uploads, setUploads] = useState<QueuedUpload[]>([]);
  const [dragging, setDragging] = useState(false);
  const [superseding, setSuperseding] = useState<EvidenceView | null>(null);
  const input = useRef<HTMLInputElement>(null);
  const canAdd = !readOnly && ability.can('create', subject('Evidence', { recordType, recordId, recordOwnerId }));

  const patch = (key: string, change: Partial<QueuedUpload>) =>
    setUploads((current) => current.map((upload) => (upload.key === key ? { ...upload, ...change } : upload)));

  const send = useCallback(
    (files: File[]) => {
      for (const file of files) {
        const key = `upload-${(uploadCounter += 1)}`;
        setUploads((current) => [...current, { key, name: file.name, sizeBytes: file.size, progress: 0, status: 'uploading' }]);
        uploadEvidenceFile({ recordType, recordId, file, onProgress: (progress) => patch(key, { progress }) })
          .then(([stored]) => {
            patch(key, { status: 'stored', progress: 1, shortHash: stored?.shortHash });
            void queryClient.invalidateQueries({ queryKey: evidenceQueryKey(recordType, recordId) });
            onChange?.();
          })
          .catch((error: unknown) => {
            const message = error instanceof ApiError ? error.message : 'The upload failed; try again.';
            patch(key, { status: 'refused', message });
          });
      }
    },
    [queryClient, recordId, recordType, onChange],
  );

  const onDrop = (event: DragEvent) => {
    event.preventDefault();
    setDragging(false);
    if (!canAdd) return;
    const files = [...event.dataTransfer.files];
    if (files.length) send(files);
  };

  if (!canRead) {
    return (
      <section className="rounded-lg border border-ink/10 bg-white px-4 py-3 text-sm text-ink-soft">
        <h2 className="mb-1 text-lg font-bold text-ink">{title}</h2>
        Evidence files are open to the people who work the quality records (and certificates to their holder).
      </section>
    );
  }

  const files = evidence.data?.items ?? [];
  const current = files.filter((file) => !file.superseded).length;

  return (
    <section id="evidence" aria-labelledby={`evidence-${recordType}-${recordId}`} className="scroll-mt-4 flex flex-col gap-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id={`evidence-${recordType}-${recordId}`} className="text-lg font-bold text-ink">
          {title}
        </h2>
        {evidence.data && (
          <span className="text-sm text-ink-soft">
            {current} current {current === 1 ? 'file' : 'files'}
            {files.length > current ? `, ${files.length - current} superseded` : ''}
          </span>
        )}
      </div>

      {canAdd && (
        <div
          onDragOver={(event) => {
            event.preventDefault();
            setDragging(true);
          }}
          onDragLeave={() => setDragging(false)}
          onDrop={onDrop}
          className={`flex flex-col items-center gap-2 rounded-lg border-2 border-dashed px-4 py-5 text-center text-sm ${dragging ? 'border-lagoon bg-lagoon-soft/40' : 'border-ink/20 bg-white'}`}
        >
          <p className="font-bold text-ink">Drop files here, or</p>
          <Button variant="secondary" onClick={() => input.current?.click()}>
            Choose files…
          </Button>
          <input
            ref={input}
            type="file"
            multiple
            accept={EVIDENCE_ACCEPT_ATTRIBUTE}
            className="sr-only"
            aria-label="Evidence files to upload"
            onChange={(event) => {
              const chosen = [...(event.target.files ?? [])];
              event.target.value = '';
              if (chosen.length) send(chosen);
            }}
          />
          <p className="text-xs text-ink-soft">
            {EVIDENCE_ACCEPT_HINT}. The type is checked from the content; files are kept for good under their SHA-256 and can only be marked superseded.
          </p>
        </div>
      )}

      <UploadQueue uploads={uploads} onDismiss={(key) => setUploads((current) => current.filter((upload) => upload.key !== key))} />

      {evidence.isLoading && <Loading what="Loading evidence" />}
      {evidence.error ? <ErrorNotice error={evidence.error} title="The evidence could not be loaded" /> : null}
      {evidence.data && files.length === 0 && (
        <EmptyState title="No evidence yet">{canAdd ? 'Upload calibration records, scan exports or photographs of indications.' : undefined}</EmptyState>
      )}
      {files.length > 0 && <EvidenceList files={files} onSupersede={(file) => { supersede.reset(); setSuperseding(file); }} />}

      {superseding && (
        <SupersedeDialog
          file={superseding}
          pending={supersede.isPending}
          error={supersede.error}
          onCancel={() => setSuperseding(null)}
          onConfirm={(reason) =>
            supersede.mutate({ id: superseding.id, reason, version: superseding.version }, { onSuccess: () => { setSuperseding(null); onChange?.(); } })
          }
        />
      )}
    </section>
  );
}
