import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { randomBytes } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { createTestContext, makeArea, makeUser, signedInAs, type TestContext } from '../helpers/test-app';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterAll(() => context.close());

const sql = (query: string, replacements: unknown[] = []) => context.deps.sequelize.query(query, { replacements });
const count = async (query: string, replacements: unknown[]) =>
  Number(((await context.deps.sequelize.query<{ n: number }>(query, { replacements, type: QueryTypes.SELECT }))[0] as { n: number }).n);

async function insertFinding(areaId: number, authorId: number, f: { state: string; class: string | null; createdAt: string; closedAt?: string }) {
  const number = `T-${randomBytes(4).toString('hex')}`;
  await sql(
    `INSERT INTO findings (number, title, rule, requirement, objective_evidence, class, closed_at, author_id, area_id, state, snapshot, machine_version, version, created_at, updated_at)
     VALUES (?, 'Dashboard test finding', 'orientation-coverage', 'requirement', 'evidence', ?, ?, ?, ?, ?, '{}', 1, 0, ?, ?)`,
    [number, f.class, f.closedAt ?? null, authorId, areaId, f.state, f.createdAt, f.createdAt],
  );
  return count('SELECT id AS n FROM findings WHERE number = ?', [number]);
}

async function insertAction(findingId: number, ownerId: number, a: { state: string; dueDate: string; verifiedAt?: string }) {
  await sql(
    `INSERT INTO corrective_actions (number, finding_id, owner_id, due_date, plan, verified_at, created_by_id, state, snapshot, machine_version, version, created_at, updated_at)
     VALUES (?, ?, ?, ?, '[]', ?, ?, ?, '{}', 1, 0, NOW(3), NOW(3))`,
    [`CA-${randomBytes(4).toString('hex')}`, findingId, ownerId, a.dueDate, a.verifiedAt ?? null, ownerId, a.state],
  );
}

async function insertRun(auditId: number, userId: number, code: string, runAt: string, results: { rule: string; status: string }[]) {
  await sql(
    `INSERT INTO checklist_runs (audit_id, technique_code, technique_revision, technique, output, verdict, notes, run_by_id, run_at, version, created_at, updated_at)
     VALUES (?, ?, 'A', '{}', ?, 'does-not-conform', '{}', ?, ?, 0, NOW(3), NOW(3))`,
    [auditId, code, JSON.stringify({ results }), userId, runAt],
  );
}

describe('dashboard', () => {
  it('when signed out, then 401; when the range is backwards, then 400 names the field', async () => {
    expect((await request(context.app).get('/api/dashboard')).status).toBe(401);
    const session = await signedInAs(context, ['technician']);
    const backwards = await session.agent.get('/api/dashboard').query({ from: '2026-12-01', to: '2026-01-01' });
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.details).toContainEqual(expect.objectContaining({ path: 'from', message: 'the start date must not be after the end date' }));
    expect((await session.agent.get('/api/dashboard').query({ areaId: 'x' })).status).toBe(400);
  });

  it('when records exist in an area, then every chart agrees with hand counts and with direct SQL counts', async () => {
    const area = await makeArea();
    const otherArea = await makeArea();
    const author = await makeUser({ roles: ['auditor'] });
    const owner = await makeUser({ roles: ['technician'] });
    // Today is 2026-12-01 for this test.
    context.clock.set(new Date('2026-12-01T12:00:00Z'));
    try {
      const f1 = await insertFinding(area.id, author.id, { state: 'action_open', class: 'major', createdAt: '2026-11-20 09:00:00' }); // 11 days old
      const f2 = await insertFinding(area.id, author.id, { state: 'action_open', class: 'minor', createdAt: '2026-09-15 09:00:00' }); // 77 days
      await insertFinding(area.id, author.id, { state: 'raised', class: null, createdAt: '2026-11-30 09:00:00' }); // 1 day
      await insertFinding(area.id, author.id, { state: 'closed', class: 'observation', createdAt: '2026-10-01 08:00:00', closedAt: '2026-10-03 08:00:00' });
      const f5 = await insertFinding(area.id, author.id, { state: 'closed', class: 'major', createdAt: '2026-08-01 00:00:00', closedAt: '2026-09-10 00:00:00' });
      await insertFinding(area.id, author.id, { state: 'withdrawn', class: null, createdAt: '2026-10-10 10:00:00' });
      const f8 = await insertFinding(area.id, author.id, { state: 'closed', class: 'minor', createdAt: '2026-07-01 00:00:00', closedAt: '2026-08-31 00:00:00' });
      await insertFinding(area.id, author.id, { state: 'action_open', class: 'minor', createdAt: '2025-06-01 00:00:00' }); // before the range
      await insertFinding(otherArea.id, author.id, { state: 'action_open', class: 'major', createdAt: '2026-11-01 00:00:00' }); // other area

      await insertAction(f1, owner.id, { state: 'in_progress', dueDate: '2026-11-25' }); // overdue
      await insertAction(f5, owner.id, { state: 'verified', dueDate: '2026-09-15', verifiedAt: '2026-09-05 10:00:00' }); // on time
      await insertAction(f2, owner.id, { state: 'investigating', dueDate: '2026-12-15' }); // not yet due
      await insertAction(f8, owner.id, { state: 'verified', dueDate: '2026-08-01', verifiedAt: '2026-08-20 10:00:00' }); // late

      await sql(
        `INSERT INTO audits (title, criteria, area_id, lead_auditor_id, planned_start, planned_end, scope, created_by_id, state, snapshot, machine_version, version, created_at, updated_at)
         VALUES ('Dashboard audit', 'criteria', ?, ?, '2026-10-01', '2026-10-05', '[]', ?, 'fieldwork', '{}', 1, 0, NOW(3), NOW(3))`,
        [area.id, author.id, author.id],
      );
      const auditId = await count('SELECT MAX(id) AS n FROM audits WHERE area_id = ?', [area.id]);
      await insertRun(auditId, author.id, 'T-A', '2026-10-02 10:00:00', [
        { rule: 'orientation-coverage', status: 'fail' },
        { rule: 'orientation-coverage', status: 'fail' },
        { rule: 'edge-effect', status: 'fail' },
        { rule: 'fill-factor', status: 'pass' },
      ]);
      await insertRun(auditId, author.id, 'T-B', '2026-10-03 10:00:00', [
        { rule: 'orientation-coverage', status: 'fail' },
        { rule: 'equipment', status: 'pass' },
      ]);

      const session = await signedInAs(context, ['quality_manager']);
      const response = await session.agent.get('/api/dashboard').query({ from: '2026-01-01', to: '2026-12-31', areaId: area.id });
      expect(response.status).toBe(200);
      const body = response.body;

      expect(body.totals).toEqual({ openFindings: 3, closedFindings: 3, overdueActions: 1, checklistRuns: 2 });
      expect(body.openFindingsByClassAge).toEqual([
        { class: 'major', band: '0–30 days', count: 1 },
        { class: 'minor', band: '61–90 days', count: 1 },
        { class: 'unclassified', band: '0–30 days', count: 1 },
      ]);
      expect(body.actionsByMonth).toEqual([
        { month: '2026-08', due: 1, closedOnTime: 0, closedLate: 1, overdue: 0, openNotDue: 0 },
        { month: '2026-09', due: 1, closedOnTime: 1, closedLate: 0, overdue: 0, openNotDue: 0 },
        { month: '2026-11', due: 1, closedOnTime: 0, closedLate: 0, overdue: 1, openNotDue: 0 },
        { month: '2026-12', due: 1, closedOnTime: 0, closedLate: 0, overdue: 0, openNotDue: 1 },
      ]);
      expect(body.meanDaysToClose).toEqual([
        { class: 'major', closed: 1, meanDays: 40 },
        { class: 'minor', closed: 1, meanDays: 61 },
        { class: 'observation', closed: 1, meanDays: 2 },
      ]);
      expect(body.failingRules).toEqual([
        { rule: 'orientation-coverage', techniques: 2, runs: 2, failures: 3 },
        { rule: 'edge-effect', techniques: 1, runs: 1, failures: 1 },
      ]);
      expect(body.techniquesAudited).toBe(2);
      expect(body.findingsByArea).toEqual([{ areaId: area.id, areaName: area.name, open: 3, closed: 3, withdrawn: 1 }]);

      // The same numbers straight from the tables.
      const inRange = "created_at >= '2026-01-01' AND created_at < '2027-01-01'";
      expect(body.totals.openFindings).toBe(await count(`SELECT COUNT(*) AS n FROM findings WHERE area_id = ? AND state NOT IN ('closed','withdrawn') AND ${inRange}`, [area.id]));
      expect(body.totals.closedFindings).toBe(await count(`SELECT COUNT(*) AS n FROM findings WHERE area_id = ? AND state = 'closed' AND ${inRange}`, [area.id]));
      expect(body.totals.overdueActions).toBe(
        await count(`SELECT COUNT(*) AS n FROM corrective_actions a JOIN findings f ON f.id = a.finding_id WHERE f.area_id = ? AND a.state <> 'verified' AND a.due_date < '2026-12-01'`, [area.id]),
      );
      const dueInRange = await count(`SELECT COUNT(*) AS n FROM corrective_actions a JOIN findings f ON f.id = a.finding_id WHERE f.area_id = ? AND a.due_date BETWEEN '2026-01-01' AND '2026-12-31'`, [area.id]);
      expect(body.actionsByMonth.reduce((sum: number, m: { due: number }) => sum + m.due, 0)).toBe(dueInRange);

      // Without the area filter the other area's finding shows up too; a narrower range drops the older ones.
      const narrow = await session.agent.get('/api/dashboard').query({ from: '2026-11-01', to: '2026-12-01', areaId: area.id });
      expect(narrow.body.totals.openFindings).toBe(2);
      const all = await session.agent.get('/api/dashboard').query({ from: '2026-01-01', to: '2026-12-31' });
      const other = all.body.findingsByArea.find((row: { areaId: number }) => row.areaId === otherArea.id);
      expect(other).toMatchObject({ open: 1, closed: 0, withdrawn: 0 });
    } finally {
      context.clock.set(null);
    }
  });
});
