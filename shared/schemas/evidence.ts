import { z } from 'zod';

/** Records evidence can be attached to (trail recordType of the owner: audit, finding, action, technique, certification). */
export const EVIDENCE_RECORD_TYPES = ['audit', 'finding', 'action', 'technique', 'certification'] as const;
export type EvidenceRecordType = (typeof EVIDENCE_RECORD_TYPES)[number];

/** Content types accepted, decided from the bytes (text types by their UTF-8 content and name). */
export const EVIDENCE_MEDIA_TYPES = ['application/pdf', 'image/png', 'image/jpeg', 'text/csv', 'text/plain'] as const;
export type EvidenceMediaType = (typeof EVIDENCE_MEDIA_TYPES)[number];

/** What the evidence panel tells people before they pick a file. */
export const EVIDENCE_ACCEPT_HINT = 'PDF, PNG, JPEG, CSV (instrument exports) or plain text';
export const EVIDENCE_ACCEPT_ATTRIBUTE = '.pdf,.png,.jpg,.jpeg,.csv,.txt,application/pdf,image/png,image/jpeg,text/csv,text/plain';

export const EvidenceOwnerSchema = z
  .object({
    recordType: z.enum(EVIDENCE_RECORD_TYPES),
    recordId: z.coerce.number().int().positive(),
  })
  .strict();
export type EvidenceOwner = z.infer<typeof EvidenceOwnerSchema>;

export const EvidenceListQuerySchema = EvidenceOwnerSchema.extend({
  includeSuperseded: z.enum(['true', 'false']).default('true'),
}).strict();

export const EvidenceSupersedeSchema = z
  .object({
    reason: z.string().trim().min(3, 'say why this file is superseded (at least 3 characters)').max(1000),
    version: z.number().int().min(0).optional(),
  })
  .strict();
export type EvidenceSupersedeInput = z.infer<typeof EvidenceSupersedeSchema>;

export interface EvidenceView {
  id: number;
  recordType: EvidenceRecordType;
  recordId: number;
  fileName: string;
  mediaType: EvidenceMediaType | string;
  sizeBytes: number;
  sha256: string;
  /** The first 12 hex digits, for showing. */
  shortHash: string;
  uploadedBy: { id: number; displayName: string };
  uploadedAt: string;
  superseded: null | { at: string; by: { id: number; displayName: string } | null; reason: string };
  version: number;
  /** Whether this user may mark it superseded (the uploader or a quality manager, and not yet superseded). */
  canSupersede: boolean;
  /** Images can be previewed inline. */
  previewable: boolean;
}

export function shortHash(sha256: string): string {
  return sha256.slice(0, 12);
}
