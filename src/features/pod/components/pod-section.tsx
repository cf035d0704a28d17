// The capability demonstrations of a technique revision: each one's POD curve and a90/95 with
// the basis in plain words, the signal and noise plots for signal-response data, and who accepted it.
import { Panel } from '../../../components/ui/panel';
import { EmptyState, ErrorNotice, Loading } from '../../../components/ui/states';
import { POD_MODEL_LABELS, POD_STATE_LABELS } from '../../../../shared/schemas/pod';
import { usePodDemonstrations, type PodDemonstrationView } from '../api/pod-demonstrations';
import { PodCurvePlot } from './pod-curve-plot';
import { SignalPlot } from './signal-plot';
import { NoisePlot } from './noise-plot';

const mm = (value: number | null) => (value === null ? 'not bounded by these data' : `${Number(value.toFixed(3))} mm`);

function Basis({ demonstration }: { demonstration: PodDemonstrationView }) {
  const analysis = demonstration.analysis;
  if (!analysis?.ok) return null;
  if (analysis.model === 'hit-miss')
    return (
      <p className="text-xs text-ink-soft">
        Hit/miss calls fitted by maximum likelihood ({analysis.link === 'logit' ? 'logistic' : 'normal'} curve on the logarithm of size, {analysis.n} calls).
        a90/95 is the upper end of the 95 % one-sided likelihood-ratio interval of a90 (MIL-HDBK-1823A); the simpler Wald bound, {mm(analysis.a9095WaldMm)}, is shown for comparison.
      </p>
    );
  return (
    <p className="text-xs text-ink-soft">
      Signal against size fitted by maximum likelihood on logarithms, with signals below the recording threshold and at saturation treated as censored ({analysis.n} calls).
      a90/95 is the 95 % one-sided bound on a90 by the delta method (MIL-HDBK-1823A).
    </p>
  );
}

function Demonstration({ demonstration }: { demonstration: PodDemonstrationView }) {
  const analysis = demonstration.analysis;
  const units = demonstration.data.signalUnits ?? 'units';
  return (
    <article className="flex flex-col gap-2 border-t border-ink/10 pt-3 first:border-t-0 first:pt-0" aria-label={demonstration.title}>
      <h3 className="font-bold">
        {demonstration.title} <span className="text-sm font-normal text-ink-soft">· {POD_MODEL_LABELS[demonstration.model]} · flaw {demonstration.sizeDimension} · {POD_STATE_LABELS[demonstration.state]}</span>
      </h3>
      {demonstration.signature && (
        <p className="text-sm">
          Accepted by {demonstration.signature.printedName} on {new Date(demonstration.signature.signedAt).toLocaleString()}: “{demonstration.signature.meaning}”.
        </p>
      )}
      {!analysis && <p className="text-sm text-ink-soft">Not analysed yet.</p>}
      {analysis && !analysis.ok && <p className="text-sm text-fail">No POD curve: {analysis.reason}</p>}
      {analysis?.ok && (
        <>
          <dl className="grid grid-cols-3 gap-2 text-sm">
            <div>
              <dt className="text-ink-soft">a50</dt>
              <dd className="font-bold">{mm(analysis.a50Mm)}</dd>
            </div>
            <div>
              <dt className="text-ink-soft">a90</dt>
              <dd className="font-bold">{mm(analysis.a90Mm)}</dd>
            </div>
            <div>
              <dt className="text-ink-soft">a90/95</dt>
              <dd className="font-bold">{mm(analysis.a9095Mm)}</dd>
            </div>
          </dl>
          <Basis demonstration={demonstration} />
          {analysis.warnings.length > 0 && (
            <ul className="list-disc pl-5 text-sm text-warn">
              {analysis.warnings.map((warning) => (
                <li key={warning.code}>{warning.message}</li>
              ))}
            </ul>
          )}
          <PodCurvePlot curve={analysis.curve} marks={analysis} dimension={demonstration.sizeDimension} />
          {analysis.model === 'signal-response' && <SignalPlot analysis={analysis} units={units} dimension={demonstration.sizeDimension} />}
          {analysis.model === 'signal-response' && analysis.falseCalls && <NoisePlot noise={demonstration.data.noise} falseCalls={analysis.falseCalls} units={units} />}
        </>
      )}
    </article>
  );
}

export function PodSection({ revisionId }: { revisionId: number }) {
  const demonstrations = usePodDemonstrations(revisionId);
  return (
    <Panel title="Capability demonstrations">
      {demonstrations.isLoading && <Loading what="Loading the demonstrations" />}
      {demonstrations.error ? <ErrorNotice error={demonstrations.error} title="The demonstrations could not be loaded" /> : null}
      {demonstrations.data && demonstrations.data.items.length === 0 && (
        <EmptyState title="No capability demonstration for this revision">A Level 3 records one from a specimen set with known flaws.</EmptyState>
      )}
      <div className="flex flex-col gap-4">
        {demonstrations.data?.items.map((demonstration) => (
          <Demonstration key={demonstration.id} demonstration={demonstration} />
        ))}
      </div>
    </Panel>
  );
}
