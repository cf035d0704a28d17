import type { EvidenceView } from '../../../../shared/schemas/evidence';
import { Button } from '../../../components/ui/button';
import { evidenceDownloadUrl, evidencePreviewUrl } from '../api/evidence';
import { formatBytes, formatTime, typeLabel } from './format';

/** The files of a record, newest first; superseded files stay visible, marked and struck through. */
export function EvidenceList({ files, onSupersede }: { files: EvidenceView[]; onSupersede(file: EvidenceView): void }) {
  return (
    <div className="overflow-x-auto rounded-lg border border-ink/10 bg-white">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Evidence files</caption>
        <thead className="bg-lagoon-soft/60 text-xs uppercase tracking-wide text-ink-soft">
          <tr>
            <th scope="col" className="px-3 py-2">File</th>
            <th scope="col" className="px-3 py-2">Size</th>
            <th scope="col" className="px-3 py-2">Type</th>
            <th scope="col" className="px-3 py-2">Uploaded by</th>
            <th scope="col" className="px-3 py-2">Time</th>
            <th scope="col" className="px-3 py-2">SHA-256</th>
            <th scope="col" className="px-3 py-2"><span className="sr-only">Actions</span></th>
          </tr>
        </thead>
        <tbody>
          {files.map((file) => (
            <tr key={file.id} className={`border-t border-ink/5 align-top ${file.superseded ? 'text-ink-soft' : ''}`} data-evidence-id={file.id}>
              <td className="px-3 py-2">
                <div className="flex items-start gap-2">
                  {file.previewable && (
                    <a href={evidencePreviewUrl(file.id)} target="_blank" rel="noreferrer" className="shrink-0" aria-label={`Open a preview of ${file.fileName}`}>
                      <img src={evidencePreviewUrl(file.id)} alt={`Preview of ${file.fileName}`} loading="lazy" className="h-12 w-12 rounded border border-ink/10 object-cover" />
                    </a>
                  )}
                  <div>
                    <a href={evidenceDownloadUrl(file.id)} className={`font-bold text-lagoon underline-offset-2 hover:underline ${file.superseded ? 'line-through' : ''}`} download>
                      {file.fileName}
                    </a>
                    {file.superseded && (
                      <p className="text-xs">
                        Superseded {formatTime(file.superseded.at)}
                        {file.superseded.by ? ` by ${file.superseded.by.displayName}` : ''}: {file.superseded.reason}
                      </p>
                    )}
                  </div>
                </div>
              </td>
              <td className="whitespace-nowrap px-3 py-2">{formatBytes(file.sizeBytes)}</td>
              <td className="whitespace-nowrap px-3 py-2">{typeLabel(file.mediaType)}</td>
              <td className="px-3 py-2">{file.uploadedBy.displayName}</td>
              <td className="whitespace-nowrap px-3 py-2">{formatTime(file.uploadedAt)}</td>
              <td className="px-3 py-2">
                <code className="font-mono text-xs" title={file.sha256} data-testid="evidence-hash">
                  {file.shortHash}
                </code>
              </td>
              <td className="px-3 py-2 text-right">
                {file.canSupersede && (
                  <Button variant="ghost" onClick={() => onSupersede(file)} aria-label={`Mark ${file.fileName} superseded`}>
                    Supersede…
                  </Button>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
