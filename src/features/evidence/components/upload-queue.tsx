import { Button } from '../../../components/ui/button';
import { formatBytes } from './format';

export interface QueuedUpload {
  key: string;
  name: string;
  sizeBytes: number;
  progress: number;
  status: 'uploading' | 'stored' | 'refused';
  message?: string;
  shortHash?: string;
}

/** One row per file being sent: a progress bar, then the stored hash or the server's reason for refusing it. */
export function UploadQueue({ uploads, onDismiss }: { uploads: QueuedUpload[]; onDismiss(key: string): void }) {
  if (!uploads.length) return null;
  return (
    <ul className="flex flex-col gap-2" aria-label="Uploads">
      {uploads.map((upload) => {
        const percent = Math.round(upload.progress * 100);
        return (
          <li key={upload.key} className="rounded-md border border-ink/10 bg-white px-3 py-2 text-sm" data-upload-status={upload.status}>
            <div className="flex items-center justify-between gap-3">
              <span className="truncate font-bold" title={upload.name}>
                {upload.name} <span className="font-normal text-ink-soft">({formatBytes(upload.sizeBytes)})</span>
              </span>
              {upload.status !== 'uploading' && (
                <Button variant="ghost" onClick={() => onDismiss(upload.key)} aria-label={`Dismiss ${upload.name}`}>
                  ✕
                </Button>
              )}
            </div>
            <div
              role="progressbar"
              aria-label={`Upload of ${upload.name}`}
              aria-valuemin={0}
              aria-valuemax={100}
              aria-valuenow={percent}
              className="mt-1 h-2 overflow-hidden rounded-full bg-ink/10"
            >
              <div
                className={`h-full transition-[width] ${upload.status === 'refused' ? 'bg-fail' : upload.status === 'stored' ? 'bg-pass' : 'bg-lagoon'}`}
                style={{ width: `${upload.status === 'refused' ? 100 : percent}%` }}
              />
            </div>
            <p className="mt-1 text-xs" aria-live="polite">
              {upload.status === 'uploading' && <span className="text-ink-soft">Uploading… {percent}%</span>}
              {upload.status === 'stored' && (
                <span className="text-pass">
                  Stored · SHA-256 <code className="font-mono">{upload.shortHash}</code>
                </span>
              )}
              {upload.status === 'refused' && (
                <span role="alert" className="font-bold text-fail">
                  Not stored: {upload.message}
                </span>
              )}
            </p>
          </li>
        );
      })}
    </ul>
  );
}
