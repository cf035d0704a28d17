import type { SignatureView } from '../../../../shared/schemas/workflow';
import { ROLE_LABELS, type Role } from '../../../../shared/roles';
import { useFormatDates } from '../../../lib/organisation';

/** Electronic signatures on the record: who, in what role, meaning what, when (UTC) and the hash of what they signed. */
export function SignatureBlock({ signatures }: { signatures: SignatureView[] }) {
  const dates = useFormatDates();
  if (!signatures.length) return null;
  return (
    <section aria-labelledby="signatures" className="rounded-lg border-2 border-ink/20 bg-white p-4">
      <h2 id="signatures" className="mb-2 text-sm font-bold uppercase tracking-wide text-ink-soft">
        Electronic signatures
      </h2>
      <ul className="flex flex-col gap-3">
        {signatures.map((signature) => (
          <li key={signature.id} className="text-sm" data-testid="signature">
            <p className="text-base font-bold text-ink">{signature.printedName}</p>
            <p>
              {ROLE_LABELS[signature.role as Role] ?? signature.role} · <em>{signature.meaning}</em>
            </p>
            <p className="text-ink-soft">
              Signed <time dateTime={signature.signedAt}>{dates.signature(signature.signedAt)}</time>
            </p>
            <p className="break-all font-mono text-xs text-ink-soft" title="SHA-256 of the record's content when signed">
              SHA-256 {signature.contentHash}
            </p>
          </li>
        ))}
      </ul>
    </section>
  );
}
