// When an audit's report is issued, its findings are copied as they stand
// (number, title, class, state, due date) into `audits.issued_findings`, in the
// issuing transaction: the printed report shows them as they were at issue.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';

export interface IssuedFinding {
  number: string;
  title: string;
  class: string | null;
  state: string;
  dueDate: string | null;
}

export interface IssuedFindingsSnapshot {
  takenAt: string;
  findings: IssuedFinding[];
}

export async function snapshotIssuedFindings(sequelize: Sequelize, transaction: Transaction, auditId: number, now: Date): Promise<void> {
  const findings = await sequelize.query<IssuedFinding>(
    "SELECT number, title, class, state, DATE_FORMAT(due_date, '%Y-%m-%d') AS dueDate FROM findings WHERE audit_id = :auditId ORDER BY number",
    { replacements: { auditId }, type: QueryTypes.SELECT, transaction },
  );
  const snapshot: IssuedFindingsSnapshot = { takenAt: now.toISOString(), findings };
  await sequelize.query('UPDATE audits SET issued_findings = :snapshot WHERE id = :auditId', {
    replacements: { snapshot: JSON.stringify(snapshot), auditId },
    transaction,
  });
}

/** The snapshot taken at issue; null for an audit not issued, or issued before snapshots were kept. */
export async function loadIssuedFindings(sequelize: Sequelize, auditId: number): Promise<IssuedFindingsSnapshot | null> {
  const rows = await sequelize.query<{ issued: string | IssuedFindingsSnapshot | null }>('SELECT issued_findings AS issued FROM audits WHERE id = :auditId', {
    replacements: { auditId },
    type: QueryTypes.SELECT,
  });
  const value = rows[0]?.issued ?? null;
  if (value === null) return null;
  return typeof value === 'string' ? (JSON.parse(value) as IssuedFindingsSnapshot) : value;
}
