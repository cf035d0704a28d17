import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/states';
import type { TrailVerificationView } from '../../../../shared/schemas/trail';
import { useTrailVerification } from '../api/trail';

const CAUGHT_BY: Record<NonNullable<TrailVerificationView['caughtBy']>, string> = {
  chain: 'Found by recomputing the keyed hashes.',
  head: 'Found by comparing the end of the chain with its head record.',
  anchor: 'Found by comparing the trail with a copy of its head kept outside the database.',
  'anchor-log': 'Found in the log of copies kept outside the database.',
};

const REASONS: Record<string, string> = {
  signature: 'after a signature',
  scheduled: 'by the daily check',
  start: 'when the server started',
};

const utc = (iso: string) => `${iso.slice(0, 16).replace('T', ' ')} UTC`;

function AnchorSummary({ result }: { result: TrailVerificationView }) {
  const latest = result.anchors.latest;
  if (!latest) {
    return <p className="mt-1">No copy of the trail's head has been kept outside the database yet; one is written at every signature and every day.</p>;
  }
  return (
    <p className="mt-1">
      Compared with {result.anchors.checked.toLocaleString()} {result.anchors.checked === 1 ? 'copy' : 'copies'} of the head kept outside the
      database, the latest at entry {latest.seq.toLocaleString()} ({utc(latest.at)}).
    </p>
  );
}

export function TrailVerification() {
  const verification = useTrailVerification();
  const result = verification.data;
  return (
    <section aria-labelledby="verify-heading" className="rounded-lg border border-ink/10 bg-white p-5">
      <h2 id="verify-heading" className="text-lg font-bold">
        Check the chain
      </h2>
      <p className="mt-1 max-w-3xl text-sm text-ink-soft">
        Every sign-in, change, transition, upload and signature is an entry whose hash covers the entry before it, computed with a key that
        is kept outside the database. The head of the chain is also copied outside the database at every signature and every day. Checking
        recomputes every hash from the first entry and compares the trail with those copies: an entry changed, removed or re-chained, or a
        trail cut short or emptied, shows up here with the first entry affected.
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
            <>
              <p>
                <strong className="font-bold">
                  {result.firstBrokenSeq !== null ? `Not intact from entry ${result.firstBrokenSeq.toLocaleString()}.` : 'Not intact.'}
                </strong>{' '}
                {result.problem}
              </p>
              {result.caughtBy && <p className="mt-1">{CAUGHT_BY[result.caughtBy]}</p>}
              {result.anchor && (
                <p className="mt-1">
                  The copy that shows it was written {REASONS[result.anchor.reason] ?? ''} on {utc(result.anchor.at)} at entry{' '}
                  {result.anchor.seq.toLocaleString()}.
                </p>
              )}
              <p className="mt-1">Keep the database and the data folder as they are and involve whoever administers them.</p>
            </>
          )}
          <AnchorSummary result={result} />
          <p className="mt-1 text-xs opacity-80">
            Checked {new Date(result.checkedAt).toLocaleString()} in {result.durationMs} ms.
          </p>
        </div>
      )}
    </section>
  );
}
