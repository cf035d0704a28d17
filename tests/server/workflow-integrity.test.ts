import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { createInitialSnapshot, findingMachine, persistSnapshot, FINDING_MACHINE_VERSION } from '../../machines';
import { Finding, TrailEntry } from '../../server/models';
import { createTestContext, databaseName, rootSql, type TestContext } from '../helpers/test-app';
import { auditWithFailedRun, expectOk, makeCast, person, raiseByHand, raiseByHandBody, raiseFromRun, send } from '../helpers/workflow';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterAll(() => context.close());

async function trailSeqs(): Promise<{ count: number; min: number; max: number }> {
  const [row] = await context.deps.sequelize.query<{ count: number; min: number; max: number }>(
    'SELECT COUNT(*) AS count, MIN(seq) AS min, MAX(seq) AS max FROM trail_entries',
    { type: QueryTypes.SELECT },
  );
  return { count: Number(row.count), min: Number(row.min), max: Number(row.max) };
}

describe('workflow integrity under concurrency and tampering', () => {
  it('when 50 requests send the same transition at once, then exactly one succeeds, it is on the trail once and the sequence has no gaps', async () => {
    const cast = await makeCast(context);
    const { audit, run, resultIndex } = await auditWithFailedRun(cast);
    const finding = await raiseFromRun(cast.auditor, audit.id, run.id, resultIndex);
    const responses = await Promise.all(
      Array.from({ length: 50 }, () => cast.auditor.post(`/api/findings/${finding.id}/events`).send({ type: 'SUBMIT', version: finding.version })),
    );
    const statuses = responses.map((response) => response.status);
    expect(statuses.filter((status) => status === 200)).toHaveLength(1);
    // The losers waited for the row lock, then found the finding already in review.
    expect(statuses.filter((status) => status !== 200).every((status) => status === 422 || status === 409)).toBe(true);
    expect(await TrailEntry.count({ where: { recordType: 'finding', recordId: String(finding.id), event: 'SUBMIT' } })).toBe(1);
    const stored = await Finding.findByPk(finding.id);
    expect({ state: stored!.state, version: stored!.version }).toEqual({ state: 'in_review', version: 1 });
    const seqs = await trailSeqs();
    expect(seqs.max - seqs.min + 1).toBe(seqs.count);
    const verify = await cast.quality.agent.get('/api/trail/verify');
    expect(verify.body).toMatchObject({ ok: true, firstBrokenSeq: null });
  });

  it('when 20 findings are raised at once, then their numbers are consecutive with no gaps or duplicates', async () => {
    const cast = await makeCast(context);
    const { audit } = await auditWithFailedRun(cast);
    const responses = await Promise.all(
      Array.from({ length: 20 }, (_, index) =>
        cast.auditor.post(`/api/audits/${audit.id}/findings`).send(raiseByHandBody(`Observation ${index + 1}`)),
      ),
    );
    expect(responses.map((response) => response.status)).toEqual(Array(20).fill(201));
    const numbers = responses.map((response) => Number(String(response.body.number).split('-')[2])).sort((a, b) => a - b);
    expect(new Set(numbers).size).toBe(20);
    expect(numbers[19] - numbers[0]).toBe(19);
  });

  it('when the same failed check is raised 10 times at once (a double click and more), then one finding is created and the others point to it', async () => {
    const cast = await makeCast(context);
    const { audit, run, resultIndex } = await auditWithFailedRun(cast);
    const responses = await Promise.all(
      Array.from({ length: 10 }, () => cast.auditor.post(`/api/audits/${audit.id}/findings`).send({ checklistRunId: run.id, resultIndex })),
    );
    const created = responses.filter((response) => response.status === 201);
    expect(created).toHaveLength(1);
    const refused = responses.filter((response) => response.status !== 201);
    expect(refused.map((response) => response.status)).toEqual(Array(9).fill(409));
    for (const response of refused) {
      expect(response.body.error).toMatchObject({ code: 'duplicate_finding', details: { findingId: created[0].body.id, number: created[0].body.number } });
      expect(response.body.error.message).toContain(created[0].body.number);
    }
    expect(await Finding.count({ where: { auditId: audit.id } })).toBe(1);

    // Once that finding is withdrawn, the check may be raised again.
    await expectOk(await send(cast.auditor, 'findings', created[0].body.id, { type: 'WITHDRAW', reason: 'Raised on the wrong audit' }));
    await expectOk(await cast.auditor.post(`/api/audits/${audit.id}/findings`).send({ checklistRunId: run.id, resultIndex }), 201);
  });

  it('when a trail row is changed directly in the database, then /api/trail/verify reports that entry', async () => {
    const cast = await makeCast(context);
    const { audit } = await auditWithFailedRun(cast);
    const entry = await TrailEntry.findOne({ where: { recordType: 'audit', recordId: String(audit.id), event: 'START_FIELDWORK' } });
    const db = databaseName();
    const recreate = `CREATE TRIGGER \`${db}\`.trail_entries_no_update BEFORE UPDATE ON \`${db}\`.trail_entries FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'trail entries are append-only'`;
    const original = rootSql(`SELECT user_id FROM \`${db}\`.trail_entries WHERE seq = ${entry!.seq}`).trim();
    // The trigger refuses updates even to root: drop it, tamper, put it back.
    rootSql(`DROP TRIGGER \`${db}\`.trail_entries_no_update; UPDATE \`${db}\`.trail_entries SET user_id = ${cast.quality.user.id} WHERE seq = ${entry!.seq}; ${recreate}`);
    try {
      const verify = await cast.quality.agent.get('/api/trail/verify');
      expect(verify.status).toBe(200);
      expect(verify.body).toMatchObject({ ok: false, firstBrokenSeq: Number(entry!.seq) });
      expect(() => rootSql(`UPDATE \`${db}\`.trail_entries SET user_id = NULL WHERE seq = ${entry!.seq}`)).toThrow(/append-only/);
    } finally {
      // Undo the tampering so later test files see an intact chain.
      rootSql(`DROP TRIGGER \`${db}\`.trail_entries_no_update; UPDATE \`${db}\`.trail_entries SET user_id = ${original} WHERE seq = ${entry!.seq}; ${recreate}`);
    }
    expect((await cast.quality.agent.get('/api/trail/verify')).body.ok).toBe(true);
  });

  it('when the findings list is read with page size 5 and 50, then it takes the same number of SQL queries', async () => {
    const cast = await makeCast(context);
    const { audit } = await auditWithFailedRun(cast);
    const { snapshot } = createInitialSnapshot(findingMachine);
    const tag = `Q${Date.now()}`;
    await Finding.bulkCreate(
      Array.from({ length: 55 }, (_, index) => ({
        number: `${tag.slice(-8)}-${index}`,
        auditId: audit.id,
        techniqueId: null,
        techniqueCode: 'TAC-ET-023',
        checklistRunId: null,
        resultIndex: null,
        title: `${tag} finding ${index}`,
        rule: 'clause 4.2',
        requirement: 'Requirement',
        objectiveEvidence: 'Evidence',
        resultValues: null,
        class: null, classificationNote: null, containment: null, containmentDueDate: null, dueDate: null,
        effectivenessNote: null, notEffectiveReason: null, closureNote: null, withdrawReason: null, closedAt: null,
        authorId: cast.auditor.user.id,
        areaId: cast.areaId,
        state: 'raised' as const,
        snapshot: persistSnapshot(findingMachine, snapshot),
        machineVersion: FINDING_MACHINE_VERSION,
      })),
    );
    const { sequelize } = context.deps;
    const original = sequelize.query.bind(sequelize);
    let count = 0;
    (sequelize as unknown as { query: typeof original }).query = ((...args: Parameters<typeof original>) => {
      count += 1;
      return original(...args);
    }) as typeof original;
    const countFor = async (pageSize: number) => {
      count = 0;
      const response = await cast.quality.agent.get(`/api/findings?q=${tag}&pageSize=${pageSize}&sort=-dueDate`);
      expect(response.status).toBe(200);
      expect(response.body.items).toHaveLength(pageSize);
      expect(response.body.total).toBe(55);
      return count;
    };
    try {
      const small = await countFor(5);
      const large = await countFor(50);
      expect(large).toBe(small);
      const actions = async (pageSize: number) => {
        count = 0;
        expect((await cast.quality.agent.get(`/api/actions?pageSize=${pageSize}`)).status).toBe(200);
        return count;
      };
      expect(await actions(50)).toBe(await actions(5));
      const audits = async (pageSize: number) => {
        count = 0;
        expect((await cast.quality.agent.get(`/api/audits?pageSize=${pageSize}`)).status).toBe(200);
        return count;
      };
      expect(await audits(50)).toBe(await audits(5));
    } finally {
      (sequelize as unknown as { query: typeof original }).query = original;
    }
  });

  it('when lists are filtered by state, class, area, owner, overdue and text, then only matching records come back', async () => {
    const cast = await makeCast(context);
    const { audit, run, resultIndex } = await auditWithFailedRun(cast);
    const first = await raiseFromRun(cast.auditor, audit.id, run.id, resultIndex);
    const second = await raiseByHand(cast.auditor, audit.id, 'Second observation');
    await expectOk(await send(cast.auditor, 'findings', second.id, { type: 'SUBMIT' }));
    await expectOk(await send(cast.quality, 'findings', second.id, { type: 'CLASSIFY', class: 'minor' }));
    const action = await expectOk(await cast.quality.post('/api/actions').send({ findingId: second.id, ownerId: cast.owner.user.id, dueDate: new Date().toISOString().slice(0, 10) }), 201);

    const ids = async (url: string) => ((await cast.quality.agent.get(url)).body.items as { id: number }[]).map((item) => item.id);
    expect(await ids(`/api/findings?areaId=${cast.areaId}&state=raised`)).toEqual([first.id]);
    expect(await ids(`/api/findings?areaId=${cast.areaId}&class=minor`)).toEqual([second.id]);
    expect(await ids(`/api/findings?owner=${cast.owner.user.id}`)).toEqual([second.id]);
    expect(await ids(`/api/findings?q=${encodeURIComponent(first.number)}`)).toEqual([first.id]);
    expect(await ids(`/api/actions?owner=${cast.owner.user.id}`)).toEqual([action.id]);
    expect(await ids(`/api/actions?areaId=${cast.areaId}&overdue=true`)).toEqual([]);

    // Move the clock past the due date: the action and the finding become overdue.
    context.clock.set(new Date(Date.now() + 3 * 86_400_000));
    try {
      expect(await ids(`/api/actions?areaId=${cast.areaId}&overdue=true`)).toEqual([action.id]);
      const home = await cast.owner.agent.get('/api/home');
      expect(home.body.items).toEqual([expect.objectContaining({ recordType: 'action', id: action.id, overdue: true, todo: 'Start the investigation' })]);
    } finally {
      context.clock.set(null);
    }
    const qmHome = await cast.quality.agent.get('/api/home');
    expect(qmHome.status).toBe(200);
    const auditorHome = await cast.auditor.agent.get('/api/home');
    expect(auditorHome.body.items).toEqual(expect.arrayContaining([expect.objectContaining({ recordType: 'finding', id: first.id, todo: 'Submit your finding for review' })]));
    const outsider = await person(context, ['technician']);
    expect((await outsider.agent.get('/api/home')).body.items).toEqual([]);
  });
});
