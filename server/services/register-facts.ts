// The seam between the technique register and the personnel/equipment registers.
// The checklist's `personnel` and `equipment` rules run only when this returns
// facts; until the registers fill it in, they are not evaluated and the
// checklist response says so (registersIncluded: false).
//
// Owner of the body: the registers contributor. Keep the signature: the
// technique checklist route calls it with the technique and the revision evaluated.
import type { Transaction } from 'sequelize';
import type { AppDeps } from '../app-deps';
import type { RegisterFactsInput } from '../../shared/domain/checklist';

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
  _request: RegisterFactsRequest,
): Promise<RegisterFactsInput | undefined> {
  return undefined;
}
