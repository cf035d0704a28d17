import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/states';
import { useTrailVerification } from '../api/trail';

export function TrailVerification() {
  const verification = useTrailVerification();
  const result = verification.data;
  return (
    <section aria-labelledby="verify-heading" className="rounded-lg border border-ink/10 bg-white p-5">
      <h2 id="verify-heading" className="text-lg font-bold">
        Check the chain
      </h2>
      <p className="mt-1 max-w-3xl text-sm text-ink-soft">
        Every sign-in, change, transition, upload and signature is an entry whose SHA-256 hash covers the entry before it. Checking
        recomputes every hash from the first entry; an entry changed or removed directly in the database breaks the chain from there on.
      </p>
      <Button className="mt-4" onClick={() => verification.refetch()} disabled={verification.isFetching}>
        {verification.isFetching ? 'Checking every entry…' : result ? 'Check again' : 'Check the whole trail'}
      </Button>
      {verification.error && (
        <div className="mt-4">
          <ErrorNotice error={verification.error} title="The check could not run" />
        </div>
      )}
      {result && !verification.isFetching && (
        <div
          role="status"
          className={`mt-4 rounded-md border px-4 py-3 text-sm ${result.ok ? 'border-pass/30 bg-green-50 text-pass' : 'border-fail/30 bg-red-50 text-fail'}`}
        >
          {result.ok ? (
            <p>
              <strong className="font-bold">Intact.</strong> All {result.entries.toLocaleString()} entries verify, up to sequence number{' '}
              {result.headSeq.toLocaleString()}.
            </p>
          ) : (
            <p>
              <strong className="font-bold">Broken at entry {result.firstBrokenSeq?.toLocaleString()}.</strong> That entry, or the one before
              it, no longer matches its hash: it was changed or removed outside Whorl. Keep the database as it is and involve whoever
              administers it; earlier entries are unaffected.
            </p>
          )}
          <p className="mt-1 text-xs opacity-80">
            Checked {new Date(result.checkedAt).toLocaleString()} in {result.durationMs} ms.
          </p>
        </div>
      )}
    </section>
  );
}
