import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { auditWithFailedRun, expectOk, makeCast, person, planAudit, raiseFromRun, send } from '../helpers/workflow';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterAll(() => context.close());

describe('workflow requests: identity, input and existence', () => {
  it('when signed out, then every workflow route is 401', async () => {
    const anonymous = request(context.app);
    for (const url of ['/api/audits', '/api/audits/1', '/api/findings', '/api/findings/1', '/api/actions', '/api/actions/1', '/api/home']) {
      expect((await anonymous.get(url)).status, url).toBe(401);
    }
    expect((await anonymous.post('/api/findings/1/events').send({ type: 'SUBMIT', version: 0 })).status).toBe(401);
  });

  it('when a record does not exist, then reading it or sending it an event is 404', async () => {
    const quality = await person(context, ['quality_manager']);
    expect((await quality.agent.get('/api/findings/999999')).status).toBe(404);
    expect((await quality.agent.get('/api/audits/999999')).status).toBe(404);
    expect((await quality.agent.get('/api/actions/999999')).status).toBe(404);
    expect((await quality.post('/api/findings/999999/events').send({ type: 'WITHDRAW', version: 0, reason: 'x' })).status).toBe(404);
  });

  it('when a body is invalid, then it is 400 naming the field, and nothing is written', async () => {
    const cast = await makeCast(context);
    const badAudit = await cast.auditor.post('/api/audits').send({ title: '', criteria: 'c', areaId: cast.areaId, leadAuditorId: cast.auditor.user.id, plannedStart: '2026-13-01', plannedEnd: '2026-12-01', techniques: [] });
    expect(badAudit.status).toBe(400);
    const paths = badAudit.body.error.details.map((detail: { path: string }) => detail.path);
    expect(paths).toEqual(expect.arrayContaining(['title', 'plannedStart', 'techniques']));

    const badTechnique = await cast.auditor.post('/api/audits').send({
      title: 'T', criteria: 'c', areaId: cast.areaId, leadAuditorId: cast.auditor.user.id, plannedStart: '2026-12-01', plannedEnd: '2026-12-02',
      techniques: [{ technique: { code: 'X' } }],
    });
    expect(badTechnique.status).toBe(400);
    expect(badTechnique.body.error.details[0].path).toMatch(/^techniques\.0\.technique\./);

    const audit = await planAudit(cast);
    expect((await send(cast.quality, 'audits', audit.id, { type: 'CANCEL', reason: '   ' })).body.error.details[0]).toMatchObject({ path: 'reason' });
    expect((await cast.quality.post(`/api/audits/${audit.id}/events`).send({ type: 'START_FIELDWORK' })).body.error.details[0]).toMatchObject({ path: 'version' });
    expect((await cast.quality.post(`/api/audits/${audit.id}/events`).send({ type: 'FLY', version: 0 })).status).toBe(400);
    const again = await expectOk(await cast.auditor.agent.get(`/api/audits/${audit.id}`));
    expect(again).toMatchObject({ state: 'planned', version: 0 });
  });

  it('when a finding is raised by hand with the POST /api/findings form, then the audit comes from the body', async () => {
    const cast = await makeCast(context);
    const { audit, run, resultIndex } = await auditWithFailedRun(cast);
    const manual = await cast.auditor.post('/api/findings').send({
      auditId: audit.id, title: 'Probe serial not recorded', rule: 'QP-ET-01 clause 9.2', requirement: 'Reports record the probe serial',
      objectiveEvidence: 'Two reports sampled have no probe serial', techniqueCode: 'TAC-ET-023',
    });
    expect(manual.status).toBe(201);
    expect(manual.body).toMatchObject({ auditId: audit.id, rule: 'QP-ET-01 clause 9.2', state: 'raised', checklistRunId: null });
    const incomplete = await cast.auditor.post('/api/findings').send({ auditId: audit.id, title: 'Only a title' });
    expect(incomplete.status).toBe(400);
    expect((await cast.auditor.post('/api/findings').send({ checklistRunId: run.id, resultIndex })).status).toBe(400);
    const fromRun = await raiseFromRun(cast.auditor, audit.id, run.id, resultIndex);
    expect(Number(fromRun.number.split('-')[2])).toBe(Number(manual.body.number.split('-')[2]) + 1);
  });

  it('when each list is sorted by each of its sortable fields, either way, then it answers 200', async () => {
    const quality = await person(context, ['quality_manager']);
    const sortable = {
      audits: ['title', 'plannedStart', 'state', 'createdAt'],
      findings: ['number', 'dueDate', 'state', 'class', 'createdAt', 'title'],
      actions: ['number', 'dueDate', 'state', 'createdAt'],
    };
    for (const [path, fields] of Object.entries(sortable)) {
      for (const field of fields) {
        for (const sort of [field, `-${field}`]) {
          const response = await quality.agent.get(`/api/${path}?sort=${sort}&state=raised,in_review,assigned,planned&q=a`);
          expect(response.status, `${path} ${sort}`).toBe(200);
        }
      }
    }
  });
});
