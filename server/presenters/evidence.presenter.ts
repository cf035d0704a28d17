import { subject } from '@casl/ability';
import type { AppAbility } from '../../shared/abilities';
import { shortHash, type EvidenceView } from '../../shared/schemas/evidence';
import type { EvidenceFile } from '../models';
import type { EvidenceOwnerRecord } from '../services/evidence-owners';
import { evidenceSubjectFields } from '../services/evidence-owners';

const PREVIEWABLE = new Set(['image/png', 'image/jpeg']);

export function presentEvidence(file: EvidenceFile, owner: EvidenceOwnerRecord, ability: AppAbility): EvidenceView {
  const superseded = file.supersededAt
    ? {
        at: file.supersededAt.toISOString(),
        by: file.supersededBy ? { id: file.supersededBy.id, displayName: file.supersededBy.displayName } : null,
        reason: file.supersedeReason ?? '',
      }
    : null;
  return {
    id: file.id,
    recordType: file.recordType,
    recordId: file.recordId,
    fileName: file.originalName,
    mediaType: file.mediaType,
    sizeBytes: file.sizeBytes,
    sha256: file.sha256,
    shortHash: shortHash(file.sha256),
    uploadedBy: { id: file.uploadedById, displayName: file.uploadedBy?.displayName ?? `User ${file.uploadedById}` },
    uploadedAt: file.createdAt.toISOString(),
    superseded,
    version: file.version,
    canSupersede: !superseded && ability.can('supersede', subject('Evidence', evidenceSubjectFields(owner, file.uploadedById))),
    previewable: PREVIEWABLE.has(file.mediaType),
  };
}
