// Evidence: append-only files attached to records. The request path is
// upload to a temporary file (hashed while written) → type checked from the
// bytes → owning record and role rule checked → row + trail entry committed →
// file copied to its content-addressed key → temporary file removed.
// Nothing is ever overwritten or deleted; a file can only be marked superseded.
import { CURRENT_EVIDENCE } from './evidence-count';
import { createHash, randomUUID } from 'node:crypto';
import { mkdir, readdir, stat, unlink, writeFile } from 'node:fs/promises';
import path from 'node:path';
import type { Readable } from 'node:stream';
import { subject } from '@casl/ability';
import { ForbiddenError } from '@casl/ability';
import { Op, type Transaction } from 'sequelize';
import type { AppDeps } from '../app-deps';
import type { AppAbility } from '../../shared/abilities';
import type { SessionUser } from '../../shared/types/session';
import { EvidenceFile, User } from '../models';
import { AppError, notAllowedNow, notFound } from '../lib/app-error';
import { appendTrail, recordTrail } from './trail.service';
import { detectEvidenceType, safeFileName } from './evidence-content';
import { evidenceSubjectFields, loadEvidenceOwner, type EvidenceOwnerRecord } from './evidence-owners';
import { contentKey, storageFor, uploadTempDir } from '../storage';
import type { HashedUpload } from '../storage/hashing-disk-engine';
import type { EvidenceOwner, EvidenceRecordType, EvidenceSupersedeInput, EvidenceView } from '../../shared/schemas/evidence';
import { presentEvidence } from '../presenters/evidence.presenter';

export interface Actor {
  user: SessionUser;
  ability: AppAbility;
}

const withPeople = [
  { model: User, as: 'uploadedBy', attributes: ['id', 'displayName'] },
  { model: User, as: 'supersededBy', attributes: ['id', 'displayName'] },
];

/**
 * Current evidence files of a record (not superseded, bytes in storage),
 * counted inside the caller's transaction: the corrective action's SUBMIT
 * sets facts.evidenceCount from this.
 */
export async function countEvidence(recordType: EvidenceRecordType, recordId: number, transaction?: Transaction): Promise<number> {
  return EvidenceFile.count({ where: { recordType, recordId, ...CURRENT_EVIDENCE }, transaction });
}

/** Evidence of a closed, verified or approved record no longer changes (also a rule in shared/abilities.ts). */
function refuseFrozen(owner: EvidenceOwnerRecord, verb: string) {
  if (!owner.frozen) return;
  throw notAllowedNow(
    `${owner.label} is closed, verified or approved: its evidence is frozen and cannot be ${verb}. Record what changed as a new record or event (a new finding, a new technique revision).`,
  );
}

function ownerSubject(owner: EvidenceOwnerRecord, uploadedById?: number) {
  return subject('Evidence', evidenceSubjectFields(owner, uploadedById));
}

export async function addEvidence(deps: AppDeps, actor: Actor, input: EvidenceOwner, files: HashedUpload[]): Promise<EvidenceView[]> {
  const { sequelize, logger } = deps;
  if (files.length === 0) {
    throw new AppError('Choose a file to upload', { status: 400, code: 'invalid_input', details: [{ path: 'file', message: 'no file was sent' }] });
  }
  const prepared: { file: HashedUpload; fileName: string; mediaType: string }[] = [];
  for (const file of files) {
    const fileName = safeFileName(file.originalname);
    const mediaType = await detectEvidenceType(file.path, fileName, file.size);
    prepared.push({ file, fileName, mediaType });
  }
  const ids = await sequelize.transaction(async (transaction) => {
    const owner = await loadEvidenceOwner(sequelize, input.recordType, input.recordId, transaction);
    refuseFrozen(owner, 'added to');
    ForbiddenError.from(actor.ability)
      .setMessage(`You may not add evidence to this ${input.recordType}`)
      .throwUnlessCan('create', ownerSubject(owner));
    const created: number[] = [];
    for (const { file, fileName, mediaType } of prepared) {
      const row = await EvidenceFile.create(
        {
          recordType: input.recordType,
          recordId: input.recordId,
          originalName: fileName,
          mediaType,
          sizeBytes: file.size,
          sha256: file.sha256,
          storageKey: contentKey(file.sha256),
          tempName: file.tempName,
          storedAt: null,
          uploadedById: actor.user.id,
        },
        { transaction },
      );
      await appendTrail(sequelize, transaction, {
        userId: actor.user.id,
        recordType: 'evidence',
        recordId: row.id,
        event: 'EVIDENCE_UPLOADED',
        changes: { owner: { recordType: owner.recordType, recordId: owner.recordId, label: owner.label }, fileName, mediaType, sizeBytes: file.size, sha256: file.sha256 },
      });
      created.push(row.id);
    }
    return created;
  });
  // Committed: now move the bytes. A failure here loses nothing: the temporary
  // file stays and the sweep (or the first download) finishes the move.
  for (const id of ids) {
    await finishStoring(deps, id).catch((error) => logger.error(`Evidence ${id}: moving the upload to storage failed; the sweep will retry`, error));
  }
  return presentRows(deps, actor, ids);
}

async function presentRows(deps: AppDeps, actor: Actor, ids: number[]): Promise<EvidenceView[]> {
  const rows = await EvidenceFile.findAll({ where: { id: ids }, include: withPeople, order: [['id', 'ASC']] });
  const views = [];
  for (const row of rows) views.push(presentEvidence(row, await loadEvidenceOwner(deps.sequelize, row.recordType, row.recordId), actor.ability));
  return views;
}

/** Copies a committed upload from the temporary folder to its content-addressed key (idempotent). */
export async function finishStoring(deps: AppDeps, id: number): Promise<void> {
  const row = await EvidenceFile.findByPk(id);
  if (!row || row.storedAt || !row.tempName) return;
  const storage = storageFor(deps.config);
  const tempPath = path.join(uploadTempDir(deps.config), row.tempName);
  if (!(await storage.exists(row.storageKey))) {
    await storage.putFile(row.storageKey, tempPath, row.mediaType);
  }
  await EvidenceFile.update({ storedAt: deps.clock.now(), tempName: null }, { where: { id, storedAt: null } });
  await unlink(tempPath).catch(() => undefined);
}

export async function listEvidence(deps: AppDeps, actor: Actor, input: EvidenceOwner & { includeSuperseded: 'true' | 'false' }) {
  const owner = await loadEvidenceOwner(deps.sequelize, input.recordType, input.recordId);
  ForbiddenError.from(actor.ability).setMessage('You may not see the evidence of this record').throwUnlessCan('read', ownerSubject(owner));
  const rows = await EvidenceFile.findAll({
    where: {
      recordType: input.recordType,
      recordId: input.recordId,
      ...(input.includeSuperseded === 'false' ? { supersededAt: null } : {}),
    },
    include: withPeople,
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
  });
  return { items: rows.map((row) => presentEvidence(row, owner, actor.ability)), total: rows.length };
}

async function hashOf(stream: Readable): Promise<string> {
  const hash = createHash('sha256');
  for await (const chunk of stream) hash.update(chunk as Buffer);
  return hash.digest('hex');
}

export interface OpenedEvidence {
  file: EvidenceFile;
  stream: Readable;
}

/**
 * Checks the role rule on the owning record, re-computes the stored bytes'
 * SHA-256 and, only when it matches the row, returns a fresh stream of them.
 * A mismatch or a missing object is refused and written to the trail.
 */
export async function openEvidence(deps: AppDeps, actor: Actor, id: number, { inline }: { inline: boolean }): Promise<OpenedEvidence> {
  const file = await EvidenceFile.findByPk(id);
  if (!file) throw notFound('Evidence file');
  const owner = await loadEvidenceOwner(deps.sequelize, file.recordType, file.recordId);
  ForbiddenError.from(actor.ability).setMessage('You may not open the evidence of this record').throwUnlessCan('read', ownerSubject(owner, file.uploadedById));
  if (inline && file.mediaType !== 'image/png' && file.mediaType !== 'image/jpeg') {
    throw new AppError('Only images can be previewed; download the file instead', { status: 415, code: 'not_previewable' });
  }
  if (!file.storedAt) await finishStoring(deps, id);
  const storage = storageFor(deps.config);
  const first = await storage.read(file.storageKey);
  const actual = first ? await hashOf(first) : null;
  const ownerRef = { recordType: owner.recordType, recordId: owner.recordId, label: owner.label };
  if (actual !== file.sha256) {
    await recordTrail(deps.sequelize, {
      userId: actor.user.id,
      recordType: 'evidence',
      recordId: file.id,
      event: 'EVIDENCE_INTEGRITY_FAILED',
      changes: { owner: ownerRef, expectedSha256: file.sha256, actualSha256: actual, storageKey: file.storageKey },
    });
    deps.logger.error(`Evidence ${file.id}: stored bytes ${actual ? 'do not match their SHA-256' : 'are missing'} (${file.storageKey})`);
    throw new AppError(
      actual
        ? 'This file has changed in storage since it was uploaded, so it is not sent. The integrity failure is on the trail; tell the quality manager.'
        : 'This file is missing from storage, so it cannot be sent. The failure is on the trail; tell the quality manager.',
      { status: 500, code: actual ? 'evidence_integrity_failed' : 'evidence_missing', expose: true },
    );
  }
  const stream = await storage.read(file.storageKey);
  if (!stream) throw new AppError('This file is missing from storage', { status: 500, code: 'evidence_missing', expose: true });
  await recordTrail(deps.sequelize, {
    userId: actor.user.id,
    recordType: 'evidence',
    recordId: file.id,
    event: inline ? 'EVIDENCE_PREVIEWED' : 'EVIDENCE_DOWNLOADED',
    changes: { owner: ownerRef, fileName: file.originalName, sha256: file.sha256 },
  });
  return { file, stream };
}

export async function supersedeEvidence(deps: AppDeps, actor: Actor, id: number, input: EvidenceSupersedeInput): Promise<EvidenceView> {
  const { sequelize } = deps;
  await sequelize.transaction(async (transaction) => {
    const file = await EvidenceFile.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!file) throw notFound('Evidence file');
    const owner = await loadEvidenceOwner(sequelize, file.recordType, file.recordId, transaction);
    refuseFrozen(owner, 'superseded');
    ForbiddenError.from(actor.ability)
      .setMessage('Only the uploader or a quality manager may mark this file superseded')
      .throwUnlessCan('supersede', ownerSubject(owner, file.uploadedById));
    if (file.supersededAt) throw notAllowedNow('This file is already superseded');
    if (input.version !== undefined && input.version !== file.version) {
      throw new AppError('This file was changed by someone else; reload it and try again', { status: 409, code: 'stale_version' });
    }
    file.supersededAt = deps.clock.now();
    file.supersededById = actor.user.id;
    file.supersedeReason = input.reason;
    await file.save({ transaction });
    await appendTrail(sequelize, transaction, {
      userId: actor.user.id,
      recordType: 'evidence',
      recordId: file.id,
      event: 'EVIDENCE_SUPERSEDED',
      changes: {
        owner: { recordType: owner.recordType, recordId: owner.recordId, label: owner.label },
        fileName: file.originalName,
        sha256: file.sha256,
        superseded: { before: false, after: true },
        reason: input.reason,
      },
    });
  });
  const [view] = await presentRows(deps, actor, [id]);
  return view;
}

/**
 * Adds evidence from bytes held in memory (demo data, imports): the same
 * checks and trail entry as an upload, without a request. The bytes go through
 * the temporary folder and reach storage once the row has committed.
 */
export async function addEvidenceFromBytes(
  deps: AppDeps,
  actor: Actor,
  input: EvidenceOwner & { fileName: string; bytes: Buffer },
): Promise<EvidenceView> {
  const tempName = `${randomUUID()}.upload`;
  const dir = uploadTempDir(deps.config);
  const filePath = path.join(dir, tempName);
  await mkdir(dir, { recursive: true });
  await writeFile(filePath, input.bytes, { flag: 'wx', mode: 0o600 });
  const file = {
    originalname: input.fileName,
    path: filePath,
    tempName,
    size: input.bytes.length,
    sha256: createHash('sha256').update(input.bytes).digest('hex'),
  } as HashedUpload;
  try {
    const [view] = await addEvidence(deps, actor, { recordType: input.recordType, recordId: input.recordId }, [file]);
    return view;
  } catch (error) {
    await removeTempFiles([file]);
    throw error;
  }
}

/** Removes temporary files of failed requests. */
export async function removeTempFiles(files: { path?: string }[]): Promise<void> {
  await Promise.all(files.map((file) => (file.path ? unlink(file.path).catch(() => undefined) : undefined)));
}

/**
 * The orphan sweep: finishes moves a crash interrupted (a row whose temp file
 * is still there) and deletes temporary files no row claims once they are
 * older than `minAgeMs` (younger ones may be uploads in flight).
 */
export async function sweepEvidenceTemp(deps: AppDeps, { minAgeMs = 60 * 60_000 }: { minAgeMs?: number } = {}) {
  const dir = uploadTempDir(deps.config);
  let names: string[];
  try {
    names = await readdir(dir);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return { finished: 0, removed: 0 };
    throw error;
  }
  let finished = 0;
  let removed = 0;
  const pending = await EvidenceFile.findAll({ where: { storedAt: null, tempName: { [Op.in]: names.length ? names : [''] } }, attributes: ['id', 'tempName'] });
  const claimed = new Map(pending.map((row) => [row.tempName!, row.id]));
  for (const name of names) {
    const id = claimed.get(name);
    if (id !== undefined) {
      await finishStoring(deps, id).then(
        () => (finished += 1),
        (error) => deps.logger.error(`Evidence ${id}: sweep could not move the upload yet`, error),
      );
      continue;
    }
    const full = path.join(dir, name);
    const info = await stat(full).catch(() => null);
    // Real time, not deps.clock: a file's age on disk is measured by the file system's clock.
    if (info && Date.now() - info.mtimeMs >= minAgeMs) {
      await unlink(full).catch(() => undefined);
      removed += 1;
    }
  }
  return { finished, removed };
}
