// The records evidence can be attached to. Each owner type has a loader that
// reads the few fields the role rules need (who owns the record) and a path
// for links. The tables belong to other features; the loaders read them with
// plain SQL so this module depends on no other feature's models.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { AppError } from '../lib/app-error';
import type { EvidenceRecordType } from '../../shared/schemas/evidence';

export interface EvidenceOwnerRecord {
  recordType: EvidenceRecordType;
  recordId: number;
  /** The person the record belongs to (action owner, certificate holder, finding author, lead auditor, technique author). */
  recordOwnerId: number | null;
  /** How people know the record ("CA-2026-0003", "Certificate 1234"). */
  label: string;
  /** The client path of the record page, for links. */
  path: string;
  /** Closed, verified or approved: its evidence can no longer be added to or superseded. */
  frozen?: boolean;
}

type OwnerLoader = (sequelize: Sequelize, id: number, transaction?: Transaction) => Promise<EvidenceOwnerRecord | null>;

function sqlLoader(
  recordType: EvidenceRecordType,
  sql: string,
  describe: (row: Record<string, unknown>, id: number) => { recordOwnerId: number | null; label: string; path: string; frozen?: boolean },
): OwnerLoader {
  return async (sequelize, id, transaction) => {
    const [row] = await sequelize.query<Record<string, unknown>>(sql, { replacements: [id], type: QueryTypes.SELECT, transaction });
    return row ? { recordType, recordId: id, ...describe(row, id) } : null;
  };
}

const loaders = new Map<EvidenceRecordType, OwnerLoader>([
  ['action', sqlLoader('action', 'SELECT owner_id, number, state FROM corrective_actions WHERE id = ?', (row, id) => ({
    recordOwnerId: Number(row.owner_id), label: String(row.number), path: `/actions/${id}`, frozen: row.state === 'verified',
  }))],
  ['finding', sqlLoader('finding', 'SELECT author_id, number, state FROM findings WHERE id = ?', (row, id) => ({
    recordOwnerId: Number(row.author_id), label: String(row.number), path: `/findings/${id}`, frozen: row.state === 'closed' || row.state === 'withdrawn',
  }))],
  ['audit', sqlLoader('audit', 'SELECT lead_auditor_id, title, state FROM audits WHERE id = ?', (row, id) => ({
    recordOwnerId: Number(row.lead_auditor_id), label: String(row.title), path: `/audits/${id}`, frozen: row.state === 'closed' || row.state === 'cancelled',
  }))],
  // A technique's evidence belongs to its open draft; with none open (every revision approved) it is frozen until a new revision starts.
  ['technique', sqlLoader('technique', "SELECT created_by_id, code, EXISTS (SELECT 1 FROM technique_revisions r WHERE r.technique_id = t.id AND r.state = 'draft') AS has_draft, EXISTS (SELECT 1 FROM technique_revisions r WHERE r.technique_id = t.id AND r.approved_at IS NOT NULL) AS has_approved FROM techniques t WHERE t.id = ?", (row, id) => ({
    recordOwnerId: Number(row.created_by_id), label: String(row.code), path: `/techniques/${id}`, frozen: Number(row.has_draft) === 0 && Number(row.has_approved) === 1,
  }))],
  ['certification', sqlLoader('certification', 'SELECT user_id, certificate_number FROM certifications WHERE id = ?', (row) => ({
    recordOwnerId: Number(row.user_id), label: `Certificate ${String(row.certificate_number)}`, path: '/registers',
  }))],
]);

/** Replaces the loader of an owner type (a feature whose table or rules differ registers its own). */
export function registerEvidenceOwner(recordType: EvidenceRecordType, loader: OwnerLoader): void {
  loaders.set(recordType, loader);
}

const RECORD_NAMES: Record<EvidenceRecordType, string> = {
  audit: 'Audit',
  finding: 'Finding',
  action: 'Corrective action',
  technique: 'Technique',
  certification: 'Certification',
};

/** The owning record, or 404 when it does not exist. */
export async function loadEvidenceOwner(
  sequelize: Sequelize,
  recordType: EvidenceRecordType,
  recordId: number,
  transaction?: Transaction,
): Promise<EvidenceOwnerRecord> {
  const loader = loaders.get(recordType);
  let owner: EvidenceOwnerRecord | null = null;
  try {
    owner = loader ? await loader(sequelize, recordId, transaction) : null;
  } catch (error) {
    // A feature whose table is not migrated yet: its records simply do not exist.
    if ((error as { parent?: { errno?: number } }).parent?.errno !== 1146) throw error;
  }
  if (!owner) throw new AppError(`${RECORD_NAMES[recordType]} ${recordId} not found`, { status: 404, code: 'not_found' });
  return owner;
}

/** The fields the Evidence role rules look at (shared/abilities.ts). */
export function evidenceSubjectFields(owner: EvidenceOwnerRecord, uploadedById?: number) {
  return { recordType: owner.recordType, recordId: owner.recordId, recordOwnerId: owner.recordOwnerId, uploadedById, recordFrozen: owner.frozen === true };
}
