// Records that own evidence, written straight to their tables for API tests
// of evidence and mail (the way makeUser writes users). Snapshots come from the
// real machines so the rows are what the workflow services would have written.
import { randomBytes } from 'node:crypto';
import { QueryTypes, type Sequelize } from 'sequelize';
import {
  CORRECTIVE_ACTION_MACHINE_VERSION,
  FINDING_MACHINE_VERSION,
  correctiveActionMachine,
  createInitialSnapshot,
  findingMachine,
  persistSnapshot,
} from '../../machines';
import { makeArea } from './test-app';

const tag = () => randomBytes(3).toString('hex').toUpperCase();

async function insert(sequelize: Sequelize, table: string, row: Record<string, unknown>): Promise<number> {
  const columns = Object.keys(row);
  const [id] = await sequelize.query(
    `INSERT INTO ${table} (${columns.join(', ')}) VALUES (${columns.map(() => '?').join(', ')})`,
    { replacements: columns.map((column) => row[column]), type: QueryTypes.INSERT },
  );
  return Number(id);
}

export async function makeFindingRow(sequelize: Sequelize, { authorId, state = 'action_open' }: { authorId: number; state?: string }) {
  const area = await makeArea();
  const { snapshot } = createInitialSnapshot(findingMachine);
  const persisted = { ...persistSnapshot(findingMachine, snapshot), value: state };
  const now = new Date();
  const number = `F-T-${tag()}`;
  const id = await insert(sequelize, 'findings', {
    number,
    title: 'Orientation gap in bore scan',
    rule: 'orientation-coverage',
    requirement: 'Cover axial and circumferential flaws',
    objective_evidence: 'Rotating probe sees axial flaws only',
    author_id: authorId,
    area_id: area.id,
    state,
    snapshot: JSON.stringify(persisted),
    machine_version: FINDING_MACHINE_VERSION,
    version: 0,
    created_at: now,
    updated_at: now,
  });
  return { id, number, areaId: area.id };
}

export async function makeActionRow(
  sequelize: Sequelize,
  { ownerId, createdById, dueDate = '2027-01-31', state = 'in_progress' }: { ownerId: number; createdById: number; dueDate?: string; state?: string },
) {
  const finding = await makeFindingRow(sequelize, { authorId: createdById });
  const { snapshot } = createInitialSnapshot(correctiveActionMachine, { dueDate });
  const persisted = { ...persistSnapshot(correctiveActionMachine, snapshot), value: state };
  const now = new Date();
  const number = `CA-T-${tag()}`;
  const id = await insert(sequelize, 'corrective_actions', {
    number,
    finding_id: finding.id,
    owner_id: ownerId,
    due_date: dueDate,
    plan: '[]',
    created_by_id: createdById,
    state,
    snapshot: JSON.stringify(persisted),
    machine_version: CORRECTIVE_ACTION_MACHINE_VERSION,
    version: 0,
    created_at: now,
    updated_at: now,
  });
  return { id, number, findingId: finding.id };
}
