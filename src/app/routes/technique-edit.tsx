import { Link, useNavigate, useParams } from 'react-router-dom';
import { EmptyState, ErrorNotice, Loading } from '../../components/ui/states';
import { useTechnique, useUpdateRevision } from '../../features/techniques/api/techniques';
import { TechniqueEditor } from '../../features/techniques/components/technique-editor';
import { ApproveButton } from '../../features/techniques/components/approve-button';
import { StateBadge } from '../../features/techniques/components/badges';

export function Component() {
  const id = Number(useParams().id);
  const navigate = useNavigate();
  const technique = useTechnique(id);
  const update = useUpdateRevision(id);

  if (technique.isLoading) return <Loading what="Loading the technique" />;
  if (technique.error || !technique.data) return <ErrorNotice error={technique.error ?? 'not found'} title="The technique could not be loaded" />;
  const view = technique.data;
  const draft = view.revisions.find((revision) => revision.state === 'draft');
  if (!draft || !draft.allowedEvents.includes('EDIT')) {
    return (
      <EmptyState title={draft ? 'You may not edit this draft' : `${view.code} has no draft revision`}>
        {draft ? 'Only an ET Level 3 edits techniques.' : 'Approved revisions are read-only; start a new revision from the technique page.'}{' '}
        <Link to={`/techniques/${view.id}`} className="font-bold text-lagoon underline">
          Back to {view.code}
        </Link>
      </EmptyState>
    );
  }

  return (
    <TechniqueEditor
      key={draft.id}
      mode="edit"
      initial={draft.content}
      initialAreaId={view.areaId}
      heading={
        <div>
          <p className="text-sm">
            <Link to={`/techniques/${view.id}`} className="font-bold text-lagoon underline-offset-2 hover:underline">
              ← {view.code}
            </Link>
          </p>
          <h1 className="flex items-center gap-2 text-2xl font-bold text-ink">
            Editing {view.code} revision {draft.revision} <StateBadge state={draft.state} />
          </h1>
        </div>
      }
      saving={update.isPending}
      saveError={update.error}
      onSave={(content, areaId) => update.mutateAsync({ revision: draft.revision, version: draft.version, technique: content, areaId })}
      renderActions={({ dirty }) => (
        <ApproveButton
          technique={view}
          revision={draft}
          disabledReason={dirty ? 'Save your changes before approving' : undefined}
          onApproved={() => navigate(`/techniques/${view.id}`)}
        />
      )}
    />
  );
}
