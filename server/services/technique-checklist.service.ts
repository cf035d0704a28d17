// The checklist of a stored revision under the organisation's policy, with the
// facts of the personnel and equipment registers when those are available.
import type { AppDeps } from '../app-deps';
import { RegisterFactsSchema, safeEvaluateTechnique, type ChecklistOutput } from '../../shared/domain/checklist';
import type { TechniqueChecklistView } from '../../shared/schemas/technique-register';
import { Technique, TechniqueRevision, User } from '../models';
import { AppError, notFound } from '../lib/app-error';
import { loadOrganisationPolicy } from './policy.service';
import { evaluateContent, parseTechniqueContent } from './technique-evaluation';
import { registerFactsForTechnique } from './register-facts';
import { acceptedDemonstrationFacts } from './pod-demonstrations.service';
import { currentRevisionOf } from '../presenters/technique.presenter';

export async function techniqueChecklist(deps: AppDeps, id: number, revisionId?: string): Promise<TechniqueChecklistView> {
  const technique = await Technique.findByPk(id, {
    include: [{ model: TechniqueRevision, as: 'revisions', include: [{ model: User, as: 'approvedBy', attributes: ['id', 'displayName'] }] }],
  });
  if (!technique) throw notFound('Technique');
  const revisions = technique.revisions ?? [];
  const revision = revisionId ? revisions.find((candidate) => candidate.revision === revisionId) : currentRevisionOf(revisions);
  if (!revision) throw notFound(revisionId ? `Revision ${revisionId} of ${technique.code}` : `A revision of ${technique.code}`);

  const content = parseTechniqueContent(revision.content, 'content');
  const policy = await loadOrganisationPolicy();
  const facts = await registerFactsForTechnique(deps, {
    techniqueId: technique.id,
    revisionId: revision.id,
    approvedById: revision.approvedById,
    approvedAt: revision.approvedAt,
  });
  const registers = facts === undefined ? undefined : RegisterFactsSchema.parse(facts);
  const now = deps.clock.now();
  const demonstrations = await acceptedDemonstrationFacts(revision.id);
  const output = evaluateContent(content, policy, { registers, now, demonstrations });
  return {
    techniqueId: technique.id,
    code: technique.code,
    revision: {
      id: revision.id,
      revision: revision.revision,
      state: revision.state,
      approvedBy: revision.approvedBy ? { id: revision.approvedBy.id, name: revision.approvedBy.displayName } : null,
      approvedAt: revision.approvedAt?.toISOString() ?? null,
    },
    registersIncluded: registers !== undefined,
    evaluatedAt: now.toISOString(),
    output,
  };
}

/** Any technique JSON under the organisation's policy: 400 with the engine's issues, field by field, when invalid. */
export async function evaluateAnyTechnique(deps: AppDeps, body: unknown): Promise<ChecklistOutput> {
  const policy = await loadOrganisationPolicy();
  const result = safeEvaluateTechnique(body, { policy, now: deps.clock.now() });
  if (!result.success) {
    throw new AppError('The technique is not valid: see the fields listed', { status: 400, code: 'invalid_input', details: result.issues });
  }
  return result.output;
}
