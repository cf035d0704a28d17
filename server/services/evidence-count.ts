// How many current (not superseded) evidence files a record has:
// the `evidenceCount` fact a corrective action's SUBMIT needs. Counted inside
// the caller's transaction so the fact and the transition agree.
import { Op, type Transaction } from 'sequelize';
import { EvidenceFile } from '../models';

/** Current evidence: not superseded, and its bytes are in storage (the move after commit has happened). */
export const CURRENT_EVIDENCE = { supersededAt: null, storedAt: { [Op.ne]: null } };

export async function countCurrentEvidence(
  transaction: Transaction | undefined,
  recordType: 'audit' | 'finding' | 'action',
  recordIds: number[],
): Promise<Map<number, number>> {
  const counts = new Map<number, number>(recordIds.map((id) => [id, 0]));
  if (!recordIds.length) return counts;
  const rows = (await EvidenceFile.count({
    where: { recordType, recordId: { [Op.in]: recordIds }, ...CURRENT_EVIDENCE },
    group: ['recordId'],
    transaction,
  })) as unknown as Array<{ recordId: number; count: number }>;
  for (const row of rows) counts.set(Number(row.recordId), Number(row.count));
  return counts;
}
