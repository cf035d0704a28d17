// Segregation of duties over HTTP: each rule of shared/abilities.ts enforced on
// the loaded record, refused for the person it protects against and allowed
// for the person it is meant for.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CorrectiveAction, EvidenceFile, Inspection, User } from '../../server/models';
import { createTestContext, makeUser, signedInAs, type SignedIn, type TestContext } from '../helpers/test-app';
import { auditWithFailedRun, expectOk, inDays, makeCast, raiseFromRun, send } from '../helpers/workflow';
import { makeActionRow, makeFindingRow } from '../helpers/evidence-owners';
import { inspectionBody, makeInspectionFixture } from '../helpers/inspections';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterAll(() => context.close());

/** An action owned by someone who is also a quality manager. */
async function actionOwnedByQuality(state: string) {
  const qualityOwner = await signedInAs(context, ['quality_manager', 'technician']);
  const author = await makeUser({ roles: ['auditor'] });
  const action = await makeActionRow(context.deps.sequelize, { ownerId: qualityOwner.user.id, createdById: author.id, state });
  return { qualityOwner, action };
}

const upload = (session: SignedIn, recordType: string, recordId: number, name = 'probe-check.txt') =>
  session
    .post('/api/evidence')
    .field('recordType', recordType)
    .field('recordId', String(recordId))
    .attach('file', Buffer.from(`calibration check ${Math.random()}`), { filename: name, contentType: 'text/plain' });

describe('no self-approval', () => {
  it('when a quality manager who owns the action approves its plan, then 403; another quality manager, 200', async () => {
    const { qualityOwner, action } = await actionOwnedByQuality('investigating');
    await expectOk(
      await send(qualityOwner, 'actions', action.id, {
        type: 'SUBMIT_PLAN',
        method: 'five_whys',
        rootCause: 'Probe check interval too long',
        plan: [{ description: 'Shorten the interval', dueDate: inDays(20) }],
      }),
    );
    const own = await send(qualityOwner, 'actions', action.id, { type: 'APPROVE_PLAN' });
    expect(own.status).toBe(403);
    expect((await CorrectiveAction.findByPk(action.id))!.state).toBe('plan_review');
    const other = await signedInAs(context, ['quality_manager']);
    expect((await send(other, 'actions', action.id, { type: 'APPROVE_PLAN' })).status).toBe(200);
  });

  it('when a quality manager who owns the action decides its extension, then 403 either way; another quality manager, 200', async () => {
    const { qualityOwner, action } = await actionOwnedByQuality('in_progress');
    await expectOk(await send(qualityOwner, 'actions', action.id, { type: 'REQUEST_EXTENSION', dueDate: '2027-03-31', reason: 'Parts arrive late' }));
    expect((await send(qualityOwner, 'actions', action.id, { type: 'APPROVE_EXTENSION' })).status).toBe(403);
    expect((await send(qualityOwner, 'actions', action.id, { type: 'REJECT_EXTENSION', reason: 'no' })).status).toBe(403);
    const other = await signedInAs(context, ['quality_manager']);
    expect((await send(other, 'actions', action.id, { type: 'APPROVE_EXTENSION' })).status).toBe(200);
  });
});

describe('area independence', () => {
  it('when the lead auditor is moved into the audited area, then checklists, findings and audit events are refused; before the move they worked', async () => {
    const cast = await makeCast(context);
    const { audit, run, resultIndex } = await auditWithFailedRun(cast);
    await raiseFromRun(cast.auditor, audit.id, run.id, resultIndex);

    await User.update({ areaId: cast.areaId }, { where: { id: cast.auditor.user.id } });
    const checklist = await cast.auditor.post(`/api/audits/${audit.id}/checklist-runs`).send({ techniqueCode: 'TAC-ET-023' });
    expect(checklist.status).toBe(403);
    const finding = await cast.auditor.post(`/api/audits/${audit.id}/findings`).send({ checklistRunId: run.id, resultIndex });
    expect(finding.status).toBe(403);
    expect((await send(cast.auditor, 'audits', audit.id, { type: 'FINISH_FIELDWORK' })).status).toBe(403);
  });
});

describe('frozen evidence', () => {
  it('when the action is verified, then its owner can neither upload nor supersede (422); while open, both work', async () => {
    const owner = await signedInAs(context, ['technician']);
    const author = await makeUser({ roles: ['auditor'] });
    const action = await makeActionRow(context.deps.sequelize, { ownerId: owner.user.id, createdById: author.id, state: 'in_progress' });
    const first = await upload(owner, 'action', action.id);
    expect(first.status).toBe(201);
    const second = await upload(owner, 'action', action.id, 'second.txt');
    expect((await owner.post(`/api/evidence/${second.body.items[0].id}/supersede`).send({ reason: 'wrong file' })).status).toBe(200);

    await CorrectiveAction.update({ state: 'verified' }, { where: { id: action.id } });
    const late = await upload(owner, 'action', action.id, 'late.txt');
    expect(late.status).toBe(422);
    expect(late.body.error.message).toContain('frozen');
    const quality = await signedInAs(context, ['quality_manager']);
    const supersede = await quality.post(`/api/evidence/${first.body.items[0].id}/supersede`).send({ reason: 'after verification' });
    expect(supersede.status).toBe(422);
    expect((await EvidenceFile.findByPk(first.body.items[0].id))!.supersededAt).toBeNull();
  });

  it('when the finding is closed, then nothing is added to it', async () => {
    const author = await signedInAs(context, ['auditor']);
    const finding = await makeFindingRow(context.deps.sequelize, { authorId: author.user.id, state: 'closed' });
    expect((await upload(author, 'finding', finding.id)).status).toBe(422);
  });
});

describe('timelines', () => {
  it('when someone reads a person’s timeline, then only that person and administrators may', async () => {
    const person = await signedInAs(context, ['technician']);
    const other = await signedInAs(context, ['quality_manager']);
    const admin = await signedInAs(context, ['admin']);
    expect((await person.agent.get(`/api/trail?record=user:${person.user.id}`)).status).toBe(200);
    expect((await admin.agent.get(`/api/trail?record=user:${person.user.id}`)).status).toBe(200);
    const refused = await other.agent.get(`/api/trail?record=user:${person.user.id}`);
    expect(refused.status).toBe(403);
    expect(refused.body.items).toBeUndefined();
  });

  it('when someone reads an evidence file’s timeline, then only readers of the file may', async () => {
    const owner = await signedInAs(context, ['technician']);
    // An action's file: every quality reader may open it; an administrator-only account may not.
    const author = await makeUser({ roles: ['auditor'] });
    const action = await makeActionRow(context.deps.sequelize, { ownerId: owner.user.id, createdById: author.id });
    const file = await upload(owner, 'action', action.id);
    expect(file.status).toBe(201);
    const id = file.body.items[0].id;
    expect((await owner.agent.get(`/api/trail?record=evidence:${id}`)).status).toBe(200);
    expect((await (await signedInAs(context, ['quality_manager'])).agent.get(`/api/trail?record=evidence:${id}`)).status).toBe(200);
    const admin = await signedInAs(context, ['admin']);
    expect((await admin.agent.get(`/api/trail?record=evidence:${id}`)).status).toBe(403);
  });
});

describe('inspections', () => {
  it('when a technician records an inspection naming someone else, then 403; naming themself, 201; a quality manager records for anyone', async () => {
    const technician = await signedInAs(context, ['technician']);
    const colleague = await makeUser({ roles: ['technician'] });
    const fixture = await makeInspectionFixture(technician.user);
    const forged = await technician.post('/api/inspections').send(inspectionBody(fixture, colleague));
    expect(forged.status).toBe(403);
    expect((await technician.post('/api/inspections').send(inspectionBody(fixture, technician.user, { serialNumber: `SN-${fixture.tag}-002` }))).status).toBe(201);
    const quality = await signedInAs(context, ['quality_manager']);
    expect((await quality.post('/api/inspections').send(inspectionBody(fixture, colleague, { serialNumber: `SN-${fixture.tag}-003` }))).status).toBe(201);
  });

  it('when a Level 3 corrects a result that has a containment decision, then 409 pointing to the worksheet; without one, 200', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const fixture = await makeInspectionFixture(level3.user);
    const decided = await expectOk(await level3.post('/api/inspections').send(inspectionBody(fixture, level3.user, { serialNumber: `SN-${fixture.tag}-010` })), 201);
    const open = await expectOk(await level3.post('/api/inspections').send(inspectionBody(fixture, level3.user, { serialNumber: `SN-${fixture.tag}-011` })), 201);
    const finding = await makeFindingRow(context.deps.sequelize, { authorId: level3.user.id, state: 'containment' });
    const now = new Date();
    await context.deps.sequelize.query(
      'INSERT INTO containment_decisions (finding_id, inspection_id, decision, reason, decided_by_id, decided_at, version, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?, 0, ?, ?)',
      { replacements: [finding.id, decided.id, 'reinspect', 'in doubt', level3.user.id, now, now, now] },
    );
    const refused = await level3.patch(`/api/inspections/${decided.id}`).send({ ...inspectionBody(fixture, level3.user, { serialNumber: `SN-${fixture.tag}-010` }), result: 'reject', version: decided.version });
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toContain('impact worksheet');
    expect((await Inspection.findByPk(decided.id))!.result).toBe('accept');
    const corrected = await level3.patch(`/api/inspections/${open.id}`).send({ ...inspectionBody(fixture, level3.user, { serialNumber: `SN-${fixture.tag}-011` }), result: 'reject', version: open.version });
    expect(corrected.status).toBe(200);
  });
});
