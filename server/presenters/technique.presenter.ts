import { subject } from '@casl/ability';
import type { AppAbility } from '../../shared/abilities';
import type { Technique, TechniqueRevision, User } from '../models';
import type {
  PersonRef,
  RevisionEvent,
  TechniqueListItem,
  TechniqueRevisionView,
  TechniqueView,
} from '../../shared/schemas/technique-register';

const person = (user: User | null | undefined): PersonRef | null => (user ? { id: user.id, name: user.displayName } : null);

/** The plain object the role rules are written against. */
export function techniqueSubject(technique: Technique, revision: TechniqueRevision) {
  return subject('Technique', {
    id: technique.id,
    areaId: technique.areaId,
    state: revision.state,
    revisionId: revision.id,
    createdById: revision.createdById,
    // The last editor is an author too: neither approves the revision (shared/abilities.ts).
    updatedById: revision.updatedById,
  });
}

export function revisionEvents(ability: AppAbility, technique: Technique, revision: TechniqueRevision): RevisionEvent[] {
  if (revision.state !== 'draft') return [];
  const events: RevisionEvent[] = [];
  if (ability.can('update', techniqueSubject(technique, revision))) events.push('EDIT');
  if (ability.can('approve', techniqueSubject(technique, revision))) events.push('APPROVE');
  return events;
}

export function presentRevision(ability: AppAbility, technique: Technique, revision: TechniqueRevision): TechniqueRevisionView {
  return {
    id: revision.id,
    revision: revision.revision,
    state: revision.state,
    content: revision.content,
    verdict: revision.verdict,
    failedRules: revision.failedRules,
    createdBy: person(revision.createdBy),
    createdAt: revision.createdAt.toISOString(),
    updatedBy: person(revision.updatedBy),
    updatedAt: revision.updatedAt.toISOString(),
    approvedBy: person(revision.approvedBy),
    approvedAt: revision.approvedAt?.toISOString() ?? null,
    supersededAt: revision.supersededAt?.toISOString() ?? null,
    version: revision.version,
    allowedEvents: revisionEvents(ability, technique, revision),
  };
}

/** The revision the checklist evaluates: the approved one in force, else the latest. */
export function currentRevisionOf(revisions: readonly TechniqueRevision[]): TechniqueRevision | undefined {
  return revisions.find((revision) => revision.state === 'approved') ?? [...revisions].sort((a, b) => b.seq - a.seq)[0];
}

export function presentTechnique(ability: AppAbility, technique: Technique): TechniqueView {
  const revisions = [...(technique.revisions ?? [])].sort((a, b) => b.seq - a.seq);
  const hasDraft = revisions.some((revision) => revision.state === 'draft');
  return {
    id: technique.id,
    code: technique.code,
    title: technique.title,
    areaId: technique.areaId,
    areaName: technique.area?.name ?? null,
    createdAt: technique.createdAt.toISOString(),
    currentRevision: currentRevisionOf(revisions)?.revision ?? '',
    revisions: revisions.map((revision) => presentRevision(ability, technique, revision)),
    allowedEvents: !hasDraft && ability.can('create', 'Technique') ? ['NEW_REVISION'] : [],
  };
}

export function presentTechniqueListItem(
  technique: Technique & { latestRevision?: TechniqueRevision },
  approvedRevision: string | null,
): TechniqueListItem {
  const latest = technique.latestRevision!;
  return {
    id: technique.id,
    code: technique.code,
    title: technique.title,
    areaId: technique.areaId,
    areaName: technique.area?.name ?? null,
    revision: latest.revision,
    state: latest.state,
    verdict: latest.verdict,
    failedRules: latest.failedRules,
    approvedRevision: approvedRevision && approvedRevision !== latest.revision ? approvedRevision : null,
    updatedAt: (latest.updatedAt > technique.updatedAt ? latest.updatedAt : technique.updatedAt).toISOString(),
  };
}
