// The few fields of workflow records that messages mention, read with plain
// SQL inside the caller's transaction (the tables belong to the workflows).
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';

export interface ActionFacts {
  id: number;
  number: string;
  ownerId: number;
  dueDate: string;
  state: string;
  findingId: number;
  findingNumber: string;
  findingTitle: string;
  findingAuthorId: number;
}

export interface FindingFacts {
  id: number;
  number: string;
  title: string;
  authorId: number;
  state: string;
  leadAuditorId: number | null;
  auditTitle: string | null;
}

export interface AuditFacts {
  id: number;
  title: string;
  leadAuditorId: number;
  areaId: number;
  areaName: string;
  areaLeadId: number | null;
  plannedStart: string;
  plannedEnd: string;
}

const day = (value: unknown) => (value instanceof Date ? value.toISOString().slice(0, 10) : String(value));

async function one<T>(sequelize: Sequelize, sql: string, id: number, transaction?: Transaction): Promise<T | null> {
  const [row] = await sequelize.query<Record<string, unknown>>(sql, { replacements: [id], type: QueryTypes.SELECT, transaction });
  return (row as T | undefined) ?? null;
}

export async function actionFacts(sequelize: Sequelize, id: number, transaction?: Transaction): Promise<ActionFacts | null> {
  const row = await one<Record<string, unknown>>(
    sequelize,
    `SELECT a.id, a.number, a.owner_id, a.due_date, a.state, f.id AS finding_id, f.number AS finding_number, f.title AS finding_title, f.author_id
       FROM corrective_actions a JOIN findings f ON f.id = a.finding_id WHERE a.id = ?`,
    id,
    transaction,
  );
  return row
    ? {
        id: Number(row.id), number: String(row.number), ownerId: Number(row.owner_id), dueDate: day(row.due_date), state: String(row.state),
        findingId: Number(row.finding_id), findingNumber: String(row.finding_number), findingTitle: String(row.finding_title), findingAuthorId: Number(row.author_id),
      }
    : null;
}

export async function findingFacts(sequelize: Sequelize, id: number, transaction?: Transaction): Promise<FindingFacts | null> {
  const row = await one<Record<string, unknown>>(
    sequelize,
    `SELECT f.id, f.number, f.title, f.author_id, f.state, au.lead_auditor_id, au.title AS audit_title
       FROM findings f LEFT JOIN audits au ON au.id = f.audit_id WHERE f.id = ?`,
    id,
    transaction,
  );
  return row
    ? {
        id: Number(row.id), number: String(row.number), title: String(row.title), authorId: Number(row.author_id), state: String(row.state),
        leadAuditorId: row.lead_auditor_id == null ? null : Number(row.lead_auditor_id), auditTitle: row.audit_title == null ? null : String(row.audit_title),
      }
    : null;
}

export async function auditFacts(sequelize: Sequelize, id: number, transaction?: Transaction): Promise<AuditFacts | null> {
  const row = await one<Record<string, unknown>>(
    sequelize,
    `SELECT au.id, au.title, au.lead_auditor_id, au.area_id, ar.name AS area_name, ar.lead_user_id, au.planned_start, au.planned_end
       FROM audits au JOIN areas ar ON ar.id = au.area_id WHERE au.id = ?`,
    id,
    transaction,
  );
  return row
    ? {
        id: Number(row.id), title: String(row.title), leadAuditorId: Number(row.lead_auditor_id), areaId: Number(row.area_id), areaName: String(row.area_name),
        areaLeadId: row.lead_user_id == null ? null : Number(row.lead_user_id), plannedStart: day(row.planned_start), plannedEnd: day(row.planned_end),
      }
    : null;
}

/** Active users holding a role (quality managers, accountable managers). */
export async function usersWithRole(sequelize: Sequelize, role: string, transaction?: Transaction): Promise<number[]> {
  const rows = await sequelize.query<{ id: number }>(
    `SELECT u.id FROM users u JOIN role_assignments r ON r.user_id = u.id WHERE r.role = ? AND u.active = 1 ORDER BY u.id`,
    { replacements: [role], type: QueryTypes.SELECT, transaction },
  );
  return rows.map((row) => Number(row.id));
}

export async function displayNames(sequelize: Sequelize, ids: number[], transaction?: Transaction): Promise<Map<number, string>> {
  if (!ids.length) return new Map();
  const rows = await sequelize.query<{ id: number; display_name: string }>(
    `SELECT id, display_name FROM users WHERE id IN (?)`,
    { replacements: [ids], type: QueryTypes.SELECT, transaction },
  );
  return new Map(rows.map((row) => [Number(row.id), row.display_name]));
}
