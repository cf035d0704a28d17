// The seam between the technique register and the personnel/equipment registers.
// The checklist's `personnel` and `equipment` rules run on the facts returned
// here: the approver's certificates, the people linked to the technique as
// performers, and the instruments, probes and reference standards linked to it
// (tables technique_performers and technique_equipment; see technique-links.service.ts).
//
// Keep the signature: the technique checklist route calls it with the technique and the revision evaluated.
import type { Transaction } from 'sequelize';
import type { AppDeps } from '../app-deps';
import type { RegisterFactsInput } from '../../shared/domain/checklist';
import { buildRegisterFacts } from './technique-links.service';

export interface RegisterFactsRequest {
  techniqueId: number;
  revisionId: number;
  /** The Level 3 who approved the revision, or null for a draft. */
  approvedById: number | null;
  approvedAt: Date | null;
  transaction?: Transaction;
}

export async function registerFactsForTechnique(
  _deps: AppDeps,
  request: RegisterFactsRequest,
): Promise<RegisterFactsInput | undefined> {
  return buildRegisterFacts({
    techniqueId: request.techniqueId,
    approvedById: request.approvedById,
    approvedAt: request.approvedAt,
    transaction: request.transaction,
  });
}
