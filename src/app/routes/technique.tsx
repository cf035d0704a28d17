// One technique: its revisions, the revision shown, and the checklist the server
// computes for it with the organisation's policy.
import { Link, useNavigate, useParams, useSearchParams } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { Caution } from '../../components/ui/caution';
import { ErrorNotice, Loading, PageHeader } from '../../components/ui/states';
import { RecordExportLinks } from '../../components/ui/export-links';
import { useStartNewRevision, useTechnique, useTechniqueChecklist } from '../../features/techniques/api/techniques';
import { StateBadge } from '../../features/techniques/components/badges';
import { RevisionHistory } from '../../features/techniques/components/revision-history';
import { TechniqueSummary } from '../../features/techniques/components/technique-summary';
import { TechniqueAnalysis } from '../../features/techniques/components/technique-analysis';
import { ApproveButton } from '../../features/techniques/components/approve-button';
import { downloadTechniqueFile, techniqueFileName } from '../../features/techniques/components/technique-file';
import { TechniqueTimeline } from '../../features/techniques/components/technique-timeline';
import { EvidencePanel } from '../../features/evidence/components/evidence-panel';
import { PodSection } from '../../features/pod/components/pod-section';

export function Component() {
  const id = Number(useParams().id);
  const [params, setParams] = useSearchParams();
  const navigate = useNavigate();
  const technique = useTechnique(id);
  const selected = params.get('revision') ?? technique.data?.currentRevision ?? '';
  const checklist = useTechniqueChecklist(id, selected || undefined);
  const newRevision = useStartNewRevision(id);

  if (technique.isLoading) return <Loading what="Loading the technique" />;
  if (technique.error || !technique.data) return <ErrorNotice error={technique.error ?? 'not found'} title="The technique could not be loaded" />;
  const view = technique.data;
  const revision = view.revisions.find((candidate) => candidate.revision === selected) ?? view.revisions[0];
  const draft = view.revisions.find((candidate) => candidate.state === 'draft');

  return (
    <div className="flex flex-col gap-4">
      <PageHeader title={`${view.code}: ${view.title}`}>
        {draft?.allowedEvents.includes('EDIT') && (
          <Link to={`/techniques/${view.id}/edit`} className="rounded-md bg-ink px-3 py-1.5 text-sm font-bold text-white hover:bg-lagoon">
            Edit draft revision {draft.revision}
          </Link>
        )}
        {draft && <ApproveButton technique={view} revision={draft} onApproved={() => setParams({}, { replace: true })} />}
        {view.allowedEvents.includes('NEW_REVISION') && (
          <Button
            variant="secondary"
            disabled={newRevision.isPending}
            onClick={() => newRevision.mutate(undefined, { onSuccess: () => navigate(`/techniques/${view.id}/edit`) })}
          >
            {newRevision.isPending ? 'Starting…' : 'Start a new revision'}
          </Button>
        )}
        <Button variant="secondary" onClick={() => downloadTechniqueFile(revision.content, techniqueFileName(view.code, revision.revision))}>
          Export revision {revision.revision} as JSON
        </Button>
        <RecordExportLinks kind="technique" id={view.id} />
      </PageHeader>
      <p className="-mt-3 flex flex-wrap items-center gap-2 text-sm text-ink-soft">
        {view.areaName ?? 'No particular area'} · revision {revision.revision} shown <StateBadge state={revision.state} />
        {revision.state === 'approved' && revision.approvedBy && (
          <span>
            approved by {revision.approvedBy.name} on {new Date(revision.approvedAt!).toLocaleString()}
          </span>
        )}
        <span>
          ·{' '}
          <Link className="text-lagoon underline" to={`/registers/inspections?techniqueId=${view.id}`}>
            Inspections made to this technique
          </Link>
        </span>
      </p>
      {newRevision.error ? <ErrorNotice error={newRevision.error} title="No new revision was started" /> : null}
      <div className="rounded-lg border-2 border-copper/60 bg-copper-soft/40 p-3">
        <Caution />
      </div>
      <RevisionHistory revisions={view.revisions} selected={revision.revision} onSelect={(next) => setParams({ revision: next }, { replace: true })} />
      <div className="grid gap-4 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
        <div className="flex min-w-0 flex-col gap-4">
          <TechniqueSummary technique={revision.content} />
          <EvidencePanel recordType="technique" recordId={view.id} />
          <PodSection revisionId={revision.id} />
          <TechniqueTimeline id={view.id} />
        </div>
        <div className="min-w-0">
          {checklist.isLoading && <Loading what="Evaluating the checklist" />}
          {checklist.error ? <ErrorNotice error={checklist.error} title="The checklist could not be evaluated" /> : null}
          {checklist.data && (
            <TechniqueAnalysis
              technique={revision.content}
              output={checklist.data.output}
              title={`Checklist, revision ${checklist.data.revision.revision}`}
              note={
                <>
                  Evaluated by the server on {new Date(checklist.data.evaluatedAt).toLocaleString()} with the organisation's policy.{' '}
                  {checklist.data.registersIncluded
                    ? 'People and equipment are checked against the registers.'
                    : 'People and equipment are not checked here: no register facts are available for this technique.'}
                </>
              }
            />
          )}
        </div>
      </div>
    </div>
  );
}
