// The technique register: create a technique (its first revision is a draft),
// edit a draft, approve it (superseding the revision it replaces), start a new
// revision from the latest, and list with the latest revision's state and verdict.
// Every change runs in one transaction with its trail entry.
import { ForbiddenError } from '@casl/ability';
import { Op, literal, type Order, type WhereOptions } from 'sequelize';
import type { AppDeps } from '../app-deps';
import type { AppAbility } from '../../shared/abilities';
import { parseSort, type ListResponse } from '../../shared/schemas/common';
import type { Technique as TechniqueContent } from '../../shared/schemas/technique';
import type {
  TechniqueListItem,
  TechniqueListQuery,
  TechniqueView,
} from '../../shared/schemas/technique-register';
import { Area, Technique, TechniqueRevision, User } from '../models';
import { AppError, notAllowedNow, notFound, staleVersion } from '../lib/app-error';
import { appendTrail } from './trail.service';
import { loadOrganisationPolicy } from './policy.service';
import { evaluateContent, parseTechniqueContent, summariseVerdict } from './technique-evaluation';
import { presentTechnique, presentTechniqueListItem, techniqueSubject } from '../presenters/technique.presenter';
import { nextRevision, REVISION_PATTERN } from '../../shared/domain/revision-letters';

const personAttributes = ['id', 'displayName'];

export const techniqueIncludes = [
  { model: Area, as: 'area', attributes: ['id', 'name'] },
  {
    model: TechniqueRevision,
    as: 'revisions',
    include: [
      { model: User, as: 'approvedBy', attributes: personAttributes },
      { model: User, as: 'createdBy', attributes: personAttributes },
      { model: User, as: 'updatedBy', attributes: personAttributes },
    ],
  },
];

const invalid = (path: string, message: string) =>
  new AppError('Some body fields are not valid', { status: 400, code: 'invalid_input', details: [{ path, message }] });

async function requireArea(areaId: number | null | undefined) {
  if (areaId == null) return;
  if (!(await Area.findByPk(areaId))) throw invalid('areaId', 'no such area');
}

export async function loadTechniqueView(ability: AppAbility, id: number): Promise<TechniqueView> {
  const technique = await Technique.findByPk(id, { include: techniqueIncludes });
  if (!technique) throw notFound('Technique');
  return presentTechnique(ability, technique);
}

const TECHNIQUE_SORTS = ['code', 'title'] as const;
// "Changed" is the latest revision's last change (edits and approvals touch the revision, not always the technique row).
const REVISION_SORTS = ['revision', 'state', 'verdict', 'updatedAt'] as const;
type SortField = (typeof TECHNIQUE_SORTS)[number] | (typeof REVISION_SORTS)[number];

export async function listTechniques(query: TechniqueListQuery): Promise<ListResponse<TechniqueListItem>> {
  const where: WhereOptions = {};
  const and: WhereOptions[] = [];
  if (query.q) {
    const like = `%${query.q}%`;
    and.push({ [Op.or]: [{ code: { [Op.like]: like } }, { title: { [Op.like]: like } }] });
  }
  if (query.areaId) and.push({ areaId: query.areaId });
  if (and.length) Object.assign(where, { [Op.and]: and });

  const revisionWhere: WhereOptions = {
    seq: { [Op.eq]: literal('(SELECT MAX(latest.seq) FROM technique_revisions AS latest WHERE latest.technique_id = `Technique`.`id`)') },
  };
  if (query.state) Object.assign(revisionWhere, { state: query.state });
  if (query.verdict) Object.assign(revisionWhere, { verdict: query.verdict });

  const sort = parseSort<SortField>(query.sort, [...TECHNIQUE_SORTS, ...REVISION_SORTS], 'code');
  const order: Order = (REVISION_SORTS as readonly string[]).includes(sort.field)
    ? [[{ model: TechniqueRevision, as: 'latestRevision' }, sort.field, sort.direction], ['code', 'ASC']]
    : [[sort.field, sort.direction], ['id', 'ASC']];

  const { rows, count } = await Technique.findAndCountAll({
    where,
    include: [
      { model: TechniqueRevision, as: 'latestRevision', required: true, where: revisionWhere },
      { model: Area, as: 'area', attributes: ['id', 'name'] },
    ],
    order,
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
    distinct: true,
  });
  const approved = rows.length
    ? await TechniqueRevision.findAll({
        attributes: ['techniqueId', 'revision'],
        where: { techniqueId: rows.map((row) => row.id), state: 'approved' },
      })
    : [];
  const approvedBy = new Map(approved.map((revision) => [revision.techniqueId, revision.revision]));
  return {
    items: rows.map((row) => presentTechniqueListItem(row as Technique & { latestRevision: TechniqueRevision }, approvedBy.get(row.id) ?? null)),
    total: count,
  };
}

export async function createTechnique(
  { sequelize }: AppDeps,
  actorId: number,
  ability: AppAbility,
  input: { technique: unknown; areaId?: number | null },
): Promise<TechniqueView> {
  const content = parseTechniqueContent(input.technique);
  if (!REVISION_PATTERN.test(content.revision)) {
    throw invalid('technique.revision', 'revision must be letters or digits (such as A, B or 3), at most 20 characters');
  }
  await requireArea(input.areaId);
  const policy = await loadOrganisationPolicy();
  const stored = summariseVerdict(evaluateContent(content, policy));
  const id = await sequelize.transaction(async (transaction) => {
    if (await Technique.findOne({ where: { code: content.code }, transaction })) {
      throw new AppError(`A technique with code ${content.code} is already in the register; start a new revision of it instead`, {
        status: 409,
        code: 'duplicate',
        details: [{ path: 'technique.code', message: `code ${content.code} is already used` }],
      });
    }
    const technique = await Technique.create(
      { code: content.code, title: content.title, areaId: input.areaId ?? null, createdById: actorId },
      { transaction },
    );
    await TechniqueRevision.create(
      {
        techniqueId: technique.id,
        seq: 1,
        revision: content.revision,
        state: 'draft',
        content,
        ...stored,
        createdById: actorId,
        updatedById: actorId,
        approvedById: null,
        approvedAt: null,
        supersededAt: null,
      },
      { transaction },
    );
    await appendTrail(sequelize, transaction, {
      userId: actorId,
      recordType: 'technique',
      recordId: technique.id,
      event: 'TECHNIQUE_CREATED',
      changes: { code: content.code, title: content.title, areaId: input.areaId ?? null, revision: content.revision, verdict: stored.verdict },
    });
    return technique.id;
  });
  return loadTechniqueView(ability, id);
}

async function lockRevision(id: number, rev: string, transaction: import('sequelize').Transaction) {
  const technique = await Technique.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
  if (!technique) throw notFound('Technique');
  const revision = await TechniqueRevision.findOne({ where: { techniqueId: id, revision: rev }, transaction, lock: transaction.LOCK.UPDATE });
  if (!revision) throw notFound(`Revision ${rev} of ${technique.code}`);
  return { technique, revision };
}

function readOnly(technique: Technique, revision: TechniqueRevision) {
  return notAllowedNow(
    `Revision ${revision.revision} of ${technique.code} is ${revision.state} and read-only; start a new revision to change the technique`,
    { state: revision.state },
  );
}

/** Top-level sections of the content that differ, with before and after (for the trail). */
function changedSections(before: TechniqueContent, after: TechniqueContent) {
  const changes: Record<string, { before: unknown; after: unknown }> = {};
  const keys = new Set([...Object.keys(before), ...Object.keys(after)]) as Set<keyof TechniqueContent>;
  for (const key of keys) {
    if (JSON.stringify(before[key]) !== JSON.stringify(after[key])) changes[key] = { before: before[key] ?? null, after: after[key] ?? null };
  }
  return changes;
}

export async function updateRevision(
  { sequelize }: AppDeps,
  actorId: number,
  ability: AppAbility,
  params: { id: number; rev: string },
  input: { version: number; technique: unknown; areaId?: number | null },
): Promise<TechniqueView> {
  await sequelize.transaction(async (transaction) => {
    const { technique, revision } = await lockRevision(params.id, params.rev, transaction);
    if (revision.state !== 'draft') throw readOnly(technique, revision);
    ForbiddenError.from(ability).throwUnlessCan('update', techniqueSubject(technique, revision));
    if (revision.version !== input.version) throw staleVersion();
    const content = parseTechniqueContent(input.technique);
    if (content.code !== technique.code) {
      throw invalid('technique.code', `code must stay ${technique.code}: a technique's code cannot change (create a new technique instead)`);
    }
    if (content.revision !== revision.revision) {
      throw invalid('technique.revision', `revision must stay ${revision.revision}: this edit is to revision ${revision.revision}`);
    }
    await requireArea(input.areaId);

    const changes: Record<string, unknown> = changedSections(revision.content, content);
    if (input.areaId !== undefined && input.areaId !== technique.areaId) {
      changes.areaId = { before: technique.areaId, after: input.areaId };
      technique.areaId = input.areaId;
    }
    if (Object.keys(changes).length === 0) return;

    const policy = await loadOrganisationPolicy(transaction);
    const stored = summariseVerdict(evaluateContent(content, policy));
    revision.content = content;
    revision.verdict = stored.verdict;
    revision.failedRules = stored.failedRules;
    revision.updatedById = actorId;
    revision.changed('content', true);
    await revision.save({ transaction });
    technique.title = content.title;
    await technique.save({ transaction });
    await appendTrail(sequelize, transaction, {
      userId: actorId,
      recordType: 'technique',
      recordId: technique.id,
      event: 'REVISION_EDITED',
      changes: { revision: revision.revision, verdict: stored.verdict, ...changes },
    });
  });
  return loadTechniqueView(ability, params.id);
}

export async function approveRevision(
  { sequelize, clock }: AppDeps,
  actorId: number,
  ability: AppAbility,
  params: { id: number; rev: string },
  input: { version: number },
): Promise<TechniqueView> {
  await sequelize.transaction(async (transaction) => {
    const { technique, revision } = await lockRevision(params.id, params.rev, transaction);
    if (revision.state !== 'draft') throw readOnly(technique, revision);
    ForbiddenError.from(ability).throwUnlessCan('approve', techniqueSubject(technique, revision));
    if (revision.version !== input.version) throw staleVersion();
    const now = clock.now();

    const previous = await TechniqueRevision.findOne({
      where: { techniqueId: technique.id, state: 'approved' },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (previous) {
      previous.state = 'superseded';
      previous.supersededAt = now;
      await previous.save({ transaction });
      await appendTrail(sequelize, transaction, {
        userId: actorId,
        recordType: 'technique',
        recordId: technique.id,
        event: 'REVISION_SUPERSEDED',
        changes: { revision: previous.revision, state: { before: 'approved', after: 'superseded' }, supersededBy: revision.revision },
      });
    }
    revision.state = 'approved';
    revision.approvedById = actorId;
    revision.approvedAt = now;
    await revision.save({ transaction });
    await appendTrail(sequelize, transaction, {
      userId: actorId,
      recordType: 'technique',
      recordId: technique.id,
      event: 'REVISION_APPROVED',
      changes: {
        revision: revision.revision,
        state: { before: 'draft', after: 'approved' },
        verdict: revision.verdict,
        failedRules: revision.failedRules,
        supersedes: previous?.revision ?? null,
      },
    });
  });
  return loadTechniqueView(ability, params.id);
}

export async function startNewRevision(
  { sequelize }: AppDeps,
  actorId: number,
  ability: AppAbility,
  id: number,
): Promise<TechniqueView> {
  await sequelize.transaction(async (transaction) => {
    const technique = await Technique.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!technique) throw notFound('Technique');
    const revisions = await TechniqueRevision.findAll({ where: { techniqueId: id }, order: [['seq', 'DESC']], transaction, lock: transaction.LOCK.UPDATE });
    const draft = revisions.find((revision) => revision.state === 'draft');
    if (draft) throw notAllowedNow(`Revision ${draft.revision} of ${technique.code} is still a draft: edit or approve it first`, { draft: draft.revision });
    const latest = revisions[0];
    const letter = nextRevision(latest.revision, new Set(revisions.map((revision) => revision.revision)));
    const content: TechniqueContent = { ...latest.content, revision: letter };
    await TechniqueRevision.create(
      {
        techniqueId: id,
        seq: latest.seq + 1,
        revision: letter,
        state: 'draft',
        content,
        verdict: latest.verdict,
        failedRules: latest.failedRules,
        createdById: actorId,
        updatedById: actorId,
        approvedById: null,
        approvedAt: null,
        supersededAt: null,
      },
      { transaction },
    );
    await appendTrail(sequelize, transaction, {
      userId: actorId,
      recordType: 'technique',
      recordId: id,
      event: 'REVISION_CREATED',
      changes: { revision: letter, copiedFrom: latest.revision },
    });
  });
  return loadTechniqueView(ability, id);
}
