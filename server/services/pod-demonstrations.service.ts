// Capability demonstrations: record (draft), correct, analyse, and accept with a Level 3's
// electronic signature bound to the data and the analysis. Every write runs in one transaction
// with its trail entry; an accepted demonstration is never changed (the service refuses, and a
// database trigger backs it), and accepting one supersedes the earlier accepted ones of the same
// technique revision and size dimension.
import { Op, type Transaction } from 'sequelize';
import { ForbiddenError, subject } from '@casl/ability';
import type { AppDeps } from '../app-deps';
import type { AppAbility } from '../../shared/abilities';
import { Equipment, PodDemonstration, Signature, TechniqueRevision, User } from '../models';
import { appendTrail, recordTrail } from './trail.service';
import { recordSignature, presentSignature } from './signatures.service';
import { AppError, notAllowedNow, notFound, staleVersion } from '../lib/app-error';
import { verifyPassword } from '../auth/passwords';
import { accountLockPolicy, registerFailure } from '../auth/sign-in.service';
import { writeTrailAnchor } from './trail-anchors';
import { analyseDemonstration } from '../../shared/domain/pod/demonstration';
import { POD_ENGINE_VERSION } from '../../shared/domain/pod/types';
import type { PodDemonstrationData, PodDemonstrationFieldsInput } from '../../shared/schemas/pod';

const TRAIL_TYPE = 'pod_demonstration';
export const ACCEPT_MEANING = 'Accepted as the capability demonstration of this technique revision';

function invalid(path: string, message: string) {
  return new AppError('Some body fields are not valid', { status: 400, code: 'invalid_input', details: [{ path, message }] });
}

function splitFields(input: PodDemonstrationFieldsInput) {
  const { techniqueRevisionId, title, model, sizeDimension, ...data } = input;
  return { columns: { techniqueRevisionId, title, model, sizeDimension }, data: data as PodDemonstrationData };
}

/** The revision, the inspectors and the equipment must exist in the registers. */
async function checkReferences(input: PodDemonstrationFieldsInput, transaction: Transaction) {
  if (!(await TechniqueRevision.findByPk(input.techniqueRevisionId, { attributes: ['id'], transaction })))
    throw invalid('techniqueRevisionId', 'no technique revision has this id');
  const inspectorIds = [...new Set(input.inspections.map((i) => i.inspectorId))];
  const users = await User.findAll({ where: { id: inspectorIds }, attributes: ['id'], transaction });
  const known = new Set(users.map((u) => u.id));
  input.inspections.forEach((inspection, i) => {
    if (!known.has(inspection.inspectorId)) throw invalid(`inspections.${i}.inspectorId`, 'no person has this id');
  });
  const equipmentIds = [...new Set(input.inspections.flatMap((i) => i.equipmentIds))];
  const items = await Equipment.findAll({ where: { id: equipmentIds }, attributes: ['id'], transaction });
  const knownItems = new Set(items.map((e) => e.id));
  input.inspections.forEach((inspection, i) =>
    inspection.equipmentIds.forEach((id, j) => {
      if (!knownItems.has(id)) throw invalid(`inspections.${i}.equipmentIds.${j}`, 'no item in the equipment register has this id');
    }),
  );
}

async function lockDraft(id: number, version: number, transaction: Transaction): Promise<PodDemonstration> {
  const row = await PodDemonstration.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
  if (!row) throw notFound('Demonstration');
  if (row.state !== 'draft') throw notAllowedNow('An accepted demonstration cannot be changed; record a new one to supersede it');
  if (row.version !== version) throw staleVersion();
  return row;
}

export async function presentDemonstration(row: PodDemonstration) {
  const signature = row.signatureId ? await Signature.findByPk(row.signatureId) : null;
  return {
    id: row.id,
    techniqueRevisionId: row.techniqueRevisionId,
    title: row.title,
    model: row.model,
    sizeDimension: row.sizeDimension,
    data: row.data,
    analysis: row.analysis,
    engineVersion: row.engineVersion,
    analysedAt: row.analysedAt?.toISOString() ?? null,
    state: row.state,
    acceptedById: row.acceptedById,
    acceptedAt: row.acceptedAt?.toISOString() ?? null,
    signature: signature ? presentSignature(signature) : null,
    supersededById: row.supersededById,
    createdById: row.createdById,
    version: row.version,
  };
}

export async function createDemonstration(deps: AppDeps, actorId: number, input: PodDemonstrationFieldsInput) {
  const row = await deps.sequelize.transaction(async (transaction) => {
    await checkReferences(input, transaction);
    const { columns, data } = splitFields(input);
    const created = await PodDemonstration.create({ ...columns, data, state: 'draft', createdById: actorId }, { transaction });
    await appendTrail(deps.sequelize, transaction, {
      userId: actorId,
      recordType: TRAIL_TYPE,
      recordId: created.id,
      event: 'POD_DEMONSTRATION_RECORDED',
      changes: { ...columns, flaws: data.specimens.length, inspections: data.inspections.length, noise: data.noise.length },
    });
    return created;
  });
  return presentDemonstration(row);
}

export async function updateDemonstration(deps: AppDeps, actorId: number, id: number, input: PodDemonstrationFieldsInput & { version: number }) {
  const row = await deps.sequelize.transaction(async (transaction) => {
    const { version, ...fields } = input;
    const current = await lockDraft(id, version, transaction);
    await checkReferences(fields, transaction);
    const { columns, data } = splitFields(fields);
    // New data invalidate the analysis: it must be run again before acceptance.
    current.set({ ...columns, data, analysis: null, engineVersion: null, analysedAt: null, version: current.version + 1 });
    await current.save({ transaction });
    await appendTrail(deps.sequelize, transaction, {
      userId: actorId,
      recordType: TRAIL_TYPE,
      recordId: id,
      event: 'POD_DEMONSTRATION_CORRECTED',
      changes: { ...columns, flaws: data.specimens.length, inspections: data.inspections.length, noise: data.noise.length },
    });
    return current;
  });
  return presentDemonstration(row);
}

export async function analyseStoredDemonstration(deps: AppDeps, actorId: number, id: number, version: number) {
  const row = await deps.sequelize.transaction(async (transaction) => {
    const current = await lockDraft(id, version, transaction);
    const analysis = analyseDemonstration(current.model, current.data);
    current.set({ analysis: analysis as unknown as Record<string, unknown>, engineVersion: POD_ENGINE_VERSION, analysedAt: deps.clock.now(), version: current.version + 1 });
    await current.save({ transaction });
    await appendTrail(deps.sequelize, transaction, {
      userId: actorId,
      recordType: TRAIL_TYPE,
      recordId: id,
      event: 'POD_ANALYSED',
      changes: analysis.ok
        ? { engineVersion: POD_ENGINE_VERSION, model: analysis.model, n: analysis.n, a50Mm: analysis.a50Mm, a90Mm: analysis.a90Mm, a9095Mm: analysis.a9095Mm }
        : { engineVersion: POD_ENGINE_VERSION, refused: analysis.code, reason: analysis.reason },
    });
    return current;
  });
  return presentDemonstration(row);
}

/** What the signature's hash covers: the demonstration's data and its analysis with the engine version. */
function signedContent(row: PodDemonstration) {
  return {
    demonstrationId: row.id,
    techniqueRevisionId: row.techniqueRevisionId,
    title: row.title,
    model: row.model,
    sizeDimension: row.sizeDimension,
    data: row.data,
    analysis: row.analysis,
    engineVersion: row.engineVersion,
    meaning: ACCEPT_MEANING,
  };
}

class SigningPasswordRefused extends Error {}

export async function acceptDemonstration(
  deps: AppDeps,
  ability: AppAbility,
  actor: { id: number; displayName: string },
  id: number,
  input: { version: number; password: string },
) {
  const now = deps.clock.now();
  try {
    const row = await deps.sequelize.transaction(async (transaction) => {
      const current = await lockDraft(id, input.version, transaction);
      ForbiddenError.from(ability).throwUnlessCan('approve', subject('Demonstration', current.get({ plain: true })));
      const analysis = current.analysis as { ok?: boolean } | null;
      if (!analysis) throw notAllowedNow('Analyse the demonstration before accepting it');
      if (!analysis.ok) throw notAllowedNow('The analysis gave no POD curve; a demonstration without one cannot be accepted');
      if (current.engineVersion !== POD_ENGINE_VERSION) throw notAllowedNow('The analysis was made by an earlier version of the POD engine; analyse it again');
      const signer = await User.findByPk(actor.id, { attributes: ['id', 'passwordHash', 'failedSignIns'], transaction });
      if (!(await verifyPassword(signer?.passwordHash ?? null, input.password))) throw new SigningPasswordRefused();
      if (signer!.failedSignIns > 0) await User.update({ failedSignIns: 0 }, { where: { id: actor.id }, transaction });
      const signature = await recordSignature(transaction, {
        recordType: 'demonstration',
        recordId: current.id,
        event: 'ACCEPT',
        signer: actor,
        role: 'level3',
        meaning: ACCEPT_MEANING,
        signedAt: now,
        content: signedContent(current),
      });
      const earlier = await PodDemonstration.findAll({
        where: { techniqueRevisionId: current.techniqueRevisionId, sizeDimension: current.sizeDimension, state: 'accepted', id: { [Op.ne]: current.id } },
        transaction,
        lock: transaction.LOCK.UPDATE,
      });
      for (const old of earlier) {
        old.set({ state: 'superseded', supersededById: current.id, version: old.version + 1 });
        await old.save({ transaction });
        await appendTrail(deps.sequelize, transaction, { userId: actor.id, recordType: TRAIL_TYPE, recordId: old.id, event: 'POD_DEMONSTRATION_SUPERSEDED', changes: { supersededById: current.id } });
      }
      current.set({ state: 'accepted', acceptedById: actor.id, acceptedAt: now, signatureId: signature.id, version: current.version + 1 });
      await current.save({ transaction });
      await appendTrail(deps.sequelize, transaction, {
        userId: actor.id,
        recordType: TRAIL_TYPE,
        recordId: id,
        event: 'POD_DEMONSTRATION_ACCEPTED',
        changes: { signature: { id: signature.id, meaning: ACCEPT_MEANING, role: 'level3', contentHash: signature.contentHash }, superseded: earlier.map((e) => e.id) },
      });
      return current;
    });
    // Every signature anchors the trail outside the database; a failed anchor never undoes the signature.
    await writeTrailAnchor(deps.sequelize, 'signature').catch((error) => deps.logger.error('Could not write the trail anchor after a signature', error));
    return presentDemonstration(row);
  } catch (error) {
    if (error instanceof SigningPasswordRefused) {
      await registerFailure(deps.sequelize, actor.id, accountLockPolicy(deps.config), 'signature', deps.clock.now());
      await recordTrail(deps.sequelize, { userId: actor.id, recordType: TRAIL_TYPE, recordId: id, event: 'SIGNATURE_REFUSED', changes: { attempted: 'ACCEPT', reason: 'wrong password; nothing was changed' } });
      throw new AppError('The password is not right; nothing was signed or changed', { status: 401, code: 'signature_password_invalid' });
    }
    throw error;
  }
}

export async function getDemonstration(id: number) {
  const row = await PodDemonstration.findByPk(id);
  if (!row) throw notFound('Demonstration');
  return presentDemonstration(row);
}

export async function listDemonstrations(query: { techniqueRevisionId?: number }) {
  const rows = await PodDemonstration.findAll({
    where: query.techniqueRevisionId ? { techniqueRevisionId: query.techniqueRevisionId } : {},
    order: [['id', 'DESC']],
    limit: 200,
  });
  return { items: await Promise.all(rows.map(presentDemonstration)) };
}

/** The accepted demonstrations of a revision: the facts the `demonstrated-capability` rule reads (`options.demonstrations`). */
export async function acceptedDemonstrationFacts(techniqueRevisionId: number) {
  const rows = await PodDemonstration.findAll({ where: { techniqueRevisionId, state: 'accepted' }, order: [['acceptedAt', 'DESC']] });
  return rows.map((row) => {
    const analysis = row.analysis as { a9095Mm?: number | null } | null;
    return { id: row.id, title: row.title, sizeDimension: row.sizeDimension, a9095Mm: analysis?.a9095Mm ?? null, acceptedAt: row.acceptedAt!.toISOString() };
  });
}
