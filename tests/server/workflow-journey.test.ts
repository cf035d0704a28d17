import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ChecklistRun, CorrectiveAction, Finding, Signature, TrailEntry, User } from '../../server/models';
import { createTestContext, TEST_PASSWORD, type TestContext } from '../helpers/test-app';
import {
  auditWithFailedRun,
  expectOk,
  findingWithAction,
  inDays,
  makeCast,
  person,
  planAudit,
  raiseFromRun,
  send,
  stubEvidenceRow,
  today,
} from '../helpers/workflow';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterAll(() => context.close());

const trailEvents = async (recordType: string, recordId: number) =>
  (await TrailEntry.findAll({ where: { recordType, recordId: String(recordId) }, order: [['seq', 'ASC']] })).map((entry) => entry.event);

describe('the audit → finding → corrective action journey', () => {
  it('when every role does its step in turn, then the finding closes with a signature and the audit closes; wrong role, state and version are refused at each step', async () => {
    const cast = await makeCast(context);
    const { auditor, quality, accountable, owner, technician } = cast;

    // Plan: only an auditor plans an audit they lead.
    expect((await technician.post('/api/audits').send({})).status).toBe(403);
    const planned = await planAudit(cast);
    expect(planned).toMatchObject({ state: 'planned', version: 0, allowedEvents: ['START_FIELDWORK'], scope: [{ code: 'TAC-ET-023' }] });

    // Start fieldwork: 403 for someone else's audit, 422 for an event of another state, 409 for a stale version.
    expect((await send(quality, 'audits', planned.id, { type: 'START_FIELDWORK' })).status).toBe(403);
    const wrongState = await send(auditor, 'audits', planned.id, { type: 'FINISH_FIELDWORK' });
    expect(wrongState.status).toBe(422);
    expect(wrongState.body.error.message).toContain('not possible while the audit is planned');
    expect((await send(auditor, 'audits', planned.id, { type: 'START_FIELDWORK', version: 7 })).status).toBe(409);
    const fieldwork = await expectOk(await send(auditor, 'audits', planned.id, { type: 'START_FIELDWORK' }));
    expect(fieldwork).toMatchObject({ state: 'fieldwork', version: 1, canRunChecklist: true });

    // Checklist: the bobbin coil misses circumferential cracks.
    expect((await technician.post(`/api/audits/${planned.id}/checklist-runs`).send({ techniqueCode: 'TAC-ET-023' })).status).toBe(403);
    const run = await expectOk(await auditor.post(`/api/audits/${planned.id}/checklist-runs`).send({ techniqueCode: 'TAC-ET-023' }), 201);
    expect(run.verdict).toBe('does-not-conform');
    const resultIndex = run.output.results.findIndex((result: { rule: string; status: string }) => result.rule === 'orientation-coverage' && result.status === 'fail');
    expect(run.output.results[resultIndex].flaw).toBe('circ-crack');
    const noted = await expectOk(await auditor.patch(`/api/audits/${planned.id}/checklist-runs/${run.id}`).send({ version: run.version, notes: { [resultIndex]: 'Procedure section 6 names only the bobbin coil' } }));
    expect(noted.notes[resultIndex]).toBe('Procedure section 6 names only the bobbin coil');
    expect((await auditor.patch(`/api/audits/${planned.id}/checklist-runs/${run.id}`).send({ version: run.version, notes: { 0: 'x' } })).status).toBe(409);

    // Raise a finding from the failed result in one step.
    expect((await quality.post(`/api/audits/${planned.id}/findings`).send({ checklistRunId: run.id, resultIndex })).status).toBe(403);
    const passIndex = run.output.results.findIndex((result: { status: string }) => result.status === 'pass');
    expect((await auditor.post(`/api/audits/${planned.id}/findings`).send({ checklistRunId: run.id, resultIndex: passIndex })).status).toBe(422);
    const raised = await raiseFromRun(auditor, planned.id, run.id, resultIndex);
    expect(raised.number).toMatch(new RegExp(`^F-${new Date().getUTCFullYear()}-\\d{4}$`));
    expect(raised).toMatchObject({ state: 'raised', rule: 'checklist rule orientation-coverage', techniqueCode: 'TAC-ET-023', areaId: cast.areaId, resultValues: { sensitivity: 0 } });
    expect(raised.objectiveEvidence).toContain('circ-crack');
    expect(raised.allowedEvents).toEqual(['SUBMIT', 'WITHDRAW']);

    // Submit → classify (major) → containment.
    expect((await send(quality, 'findings', raised.id, { type: 'CLASSIFY', class: 'major' })).status).toBe(422);
    expect((await send(technician, 'findings', raised.id, { type: 'SUBMIT' })).status).toBe(403);
    await expectOk(await send(auditor, 'findings', raised.id, { type: 'SUBMIT' }));
    expect((await send(auditor, 'findings', raised.id, { type: 'CLASSIFY', class: 'major' })).status).toBe(403);
    expect((await send(quality, 'findings', raised.id, { type: 'CLASSIFY', class: 'major', version: 0 })).status).toBe(409);
    const classified = await expectOk(await send(quality, 'findings', raised.id, { type: 'CLASSIFY', class: 'major', note: 'A crack orientation the procedure cannot detect' }));
    expect(classified).toMatchObject({ state: 'containment', class: 'major', dueDate: inDays(30), containmentDueDate: inDays(1) });
    expect((await send(technician, 'findings', raised.id, { type: 'RECORD_CONTAINMENT', description: 'Tubes quarantined' })).status).toBe(403);
    expect((await send(quality, 'findings', raised.id, { type: 'CONFIRM_EFFECTIVE', note: 'too early' })).status).toBe(422);
    const contained = await expectOk(await send(quality, 'findings', raised.id, { type: 'RECORD_CONTAINMENT', description: 'Tube bundle quarantined; technique suspended' }));
    expect(contained).toMatchObject({ state: 'action_open', containment: 'Tube bundle quarantined; technique suspended', canAssignAction: true });

    // Assign the corrective action.
    const actionBody = { findingId: raised.id, ownerId: owner.user.id, dueDate: inDays(30) };
    expect((await auditor.post('/api/actions').send(actionBody)).status).toBe(403);
    const assigned = await expectOk(await quality.post('/api/actions').send(actionBody), 201);
    expect(assigned).toMatchObject({ state: 'assigned', number: expect.stringMatching(/^CA-\d{4}-\d{4}$/), owner: { id: owner.user.id }, dueDate: inDays(30) });
    expect((await quality.post('/api/actions').send(actionBody)).status).toBe(422);

    // Owner investigates, plans; the quality manager approves.
    expect((await send(quality, 'actions', assigned.id, { type: 'START' })).status).toBe(403);
    expect((await send(owner, 'actions', assigned.id, { type: 'APPROVE_PLAN' })).status).toBe(403);
    expect((await send(owner, 'actions', assigned.id, { type: 'SUBMIT', summary: 'early' })).status).toBe(422);
    expect((await send(owner, 'actions', assigned.id, { type: 'START', version: 3 })).status).toBe(409);
    await expectOk(await send(owner, 'actions', assigned.id, { type: 'START' }));
    const plan = { type: 'SUBMIT_PLAN', method: 'five_whys', rootCause: 'Why 1: the procedure lists one coil. Why 2: it was copied from a tube-mill procedure.', plan: [{ description: 'Add a rotating-probe pass for circumferential cracks', dueDate: inDays(20) }] };
    const planned2 = await expectOk(await send(owner, 'actions', assigned.id, plan));
    expect(planned2).toMatchObject({ state: 'plan_review', method: 'five_whys', plan: plan.plan });
    expect((await send(technician, 'actions', assigned.id, { type: 'APPROVE_PLAN' })).status).toBe(403);
    expect((await send(quality, 'actions', assigned.id, { type: 'APPROVE_PLAN', version: 1 })).status).toBe(409);
    await expectOk(await send(quality, 'actions', assigned.id, { type: 'APPROVE_PLAN' }));

    // Submit: refused without evidence, accepted with one current file.
    const noEvidence = await send(owner, 'actions', assigned.id, { type: 'SUBMIT', summary: 'Technique revised' });
    expect(noEvidence.status).toBe(422);
    expect(noEvidence.body.error.message).toContain('evidence');
    await stubEvidenceRow(assigned.id, owner.user); // stub evidence row (metadata only); uploads are tested by the evidence tests
    expect((await send(technician, 'actions', assigned.id, { type: 'SUBMIT', summary: 'x' })).status).toBe(403);
    const submitted = await expectOk(await send(owner, 'actions', assigned.id, { type: 'SUBMIT', summary: 'Technique revised to rev B with a rotating probe; tubes re-inspected' }));
    expect(submitted).toMatchObject({ state: 'submitted', evidenceCount: 1 });

    // Verify (signed): wrong password is 401, counted, on the trail, and changes nothing.
    expect((await send(owner, 'actions', assigned.id, { type: 'VERIFY', password: TEST_PASSWORD })).status).toBe(403);
    const before = await CorrectiveAction.findByPk(assigned.id);
    const wrong = await send(quality, 'actions', assigned.id, { type: 'VERIFY', password: 'not my password' });
    expect(wrong.status).toBe(401);
    const after = await CorrectiveAction.findByPk(assigned.id);
    expect({ state: after!.state, version: after!.version }).toEqual({ state: before!.state, version: before!.version });
    expect((await User.findByPk(quality.user.id))!.failedSignIns).toBe(1);
    expect(await trailEvents('user', quality.user.id)).toContain('SIGNATURE_PASSWORD_FAILED');
    expect(await trailEvents('action', assigned.id)).toContain('SIGNATURE_REFUSED');
    expect(await Signature.count({ where: { recordType: 'action', recordId: assigned.id } })).toBe(0);
    expect((await send(quality, 'actions', assigned.id, { type: 'VERIFY', password: TEST_PASSWORD, version: 2 })).status).toBe(409);
    const verified = await expectOk(await send(quality, 'actions', assigned.id, { type: 'VERIFY', password: TEST_PASSWORD }));
    expect(verified.state).toBe('verified');
    expect(verified.signatures[0]).toMatchObject({ printedName: quality.user.displayName, role: 'quality_manager', meaning: 'corrective action verified', contentHash: expect.stringMatching(/^[0-9a-f]{64}$/) });
    expect((await User.findByPk(quality.user.id))!.failedSignIns).toBe(0);

    // The finding followed: ACTION_VERIFIED was sent by the server in the same transaction.
    const checking = await expectOk(await auditor.agent.get(`/api/findings/${raised.id}`));
    expect(checking.state).toBe('effectiveness_check');
    expect(await trailEvents('finding', raised.id)).toContain('ACTION_VERIFIED');

    // The audit goes on to reporting and is issued (signed) while the finding is still open; it cannot close yet.
    await expectOk(await send(auditor, 'audits', planned.id, { type: 'FINISH_FIELDWORK' }));
    expect((await send(auditor, 'audits', planned.id, { type: 'ISSUE', password: TEST_PASSWORD })).status).toBe(403);
    await expectOk(await send(quality, 'audits', planned.id, { type: 'ISSUE', password: TEST_PASSWORD }));
    const notYet = await send(quality, 'audits', planned.id, { type: 'CLOSE' });
    expect(notYet.status).toBe(422);
    expect(notYet.body.error.message).toContain('1 finding(s)');

    // Effectiveness, then closure by the accountable manager with a signature.
    expect((await send(owner, 'findings', raised.id, { type: 'CONFIRM_EFFECTIVE', note: 'mine' })).status).toBe(403);
    expect((await send(accountable, 'findings', raised.id, { type: 'CLOSE', password: TEST_PASSWORD })).status).toBe(422);
    await expectOk(await send(auditor, 'findings', raised.id, { type: 'CONFIRM_EFFECTIVE', note: 'Re-audit: circumferential notches detected on the reference tube' }));
    expect((await send(quality, 'findings', raised.id, { type: 'CLOSE', password: TEST_PASSWORD })).status).toBe(403);
    expect((await send(accountable, 'findings', raised.id, { type: 'CLOSE', password: TEST_PASSWORD, version: 1 })).status).toBe(409);
    const closed = await expectOk(await send(accountable, 'findings', raised.id, { type: 'CLOSE', password: TEST_PASSWORD }));
    expect(closed).toMatchObject({ state: 'closed', allowedEvents: [] });
    expect(closed.signatures).toEqual([
      expect.objectContaining({ printedName: accountable.user.displayName, role: 'accountable_manager', meaning: 'closure approved', contentHash: expect.stringMatching(/^[0-9a-f]{64}$/) }),
    ]);

    const auditClosed = await expectOk(await send(quality, 'audits', planned.id, { type: 'CLOSE' }));
    expect(auditClosed).toMatchObject({ state: 'closed', openFindingCount: 0 });

    // Each transition is on the trail once, with its before/after.
    expect(await trailEvents('finding', raised.id)).toEqual([
      'FINDING_RAISED', 'SUBMIT', 'CLASSIFY', 'RECORD_CONTAINMENT', 'ACTION_ASSIGNED', 'ACTION_VERIFIED', 'CONFIRM_EFFECTIVE', 'CLOSE',
    ]);
    const classifyEntry = await TrailEntry.findOne({ where: { recordType: 'finding', recordId: String(raised.id), event: 'CLASSIFY' } });
    expect(classifyEntry!.changes).toMatchObject({ state: { before: 'in_review', after: 'containment' }, class: { before: null, after: 'major' } });
    expect(await trailEvents('action', assigned.id)).toEqual(['ACTION_ASSIGNED', 'START', 'SUBMIT_PLAN', 'APPROVE_PLAN', 'SUBMIT', 'SIGNATURE_REFUSED', 'VERIFY']);
    const stored = await Finding.findByPk(raised.id);
    expect(stored!.snapshot).toMatchObject({ value: 'closed', context: { class: 'major' } });
    expect(stored!.machineVersion).toBe(1);
  });

  it('when a plan item falls due after the corrective action itself, then the plan is refused with the item named and nothing changes', async () => {
    const cast = await makeCast(context);
    const { action } = await findingWithAction(cast); // due in 30 days
    await expectOk(await send(cast.owner, 'actions', action.id, { type: 'START' }));
    const late = await send(cast.owner, 'actions', action.id, {
      type: 'SUBMIT_PLAN',
      method: 'other',
      rootCause: 'Procedure gap',
      plan: [
        { description: 'Revise', dueDate: inDays(10) },
        { description: 'Brief the shift', dueDate: inDays(31) },
      ],
    });
    expect(late.status).toBe(422);
    expect(late.body.error.message).toBe(`Plan item 2 (${inDays(31)}) falls due after the corrective action itself (${inDays(30)}): bring it forward, or request an extension first`);
    expect((await cast.owner.agent.get(`/api/actions/${action.id}`)).body).toMatchObject({ state: 'investigating', plan: [] });
    await expectOk(await send(cast.owner, 'actions', action.id, { type: 'SUBMIT_PLAN', method: 'other', rootCause: 'Procedure gap', plan: [{ description: 'Brief the shift', dueDate: inDays(30) }] }));
  });

  it('when an effectiveness check fails, then the finding goes back to action_open and the server reopens its action', async () => {
    const cast = await makeCast(context);
    const { finding, action } = await findingWithAction(cast);
    await expectOk(await send(cast.owner, 'actions', action.id, { type: 'START' }));
    await expectOk(await send(cast.owner, 'actions', action.id, { type: 'SUBMIT_PLAN', method: 'other', rootCause: 'Procedure gap', plan: [{ description: 'Revise', dueDate: inDays(10) }] }));
    await expectOk(await send(cast.quality, 'actions', action.id, { type: 'APPROVE_PLAN' }));
    await stubEvidenceRow(action.id, cast.owner.user);
    await expectOk(await send(cast.owner, 'actions', action.id, { type: 'SUBMIT', summary: 'Done' }));
    await expectOk(await send(cast.quality, 'actions', action.id, { type: 'VERIFY', password: TEST_PASSWORD }));
    const reopened = await expectOk(await send(cast.auditor, 'findings', finding.id, { type: 'NOT_EFFECTIVE', reason: 'Circumferential notch still missed' }));
    expect(reopened).toMatchObject({ state: 'action_open', notEffectiveReason: 'Circumferential notch still missed', action: { state: 'in_progress' } });
    const actionNow = await expectOk(await cast.owner.agent.get(`/api/actions/${action.id}`));
    expect(actionNow).toMatchObject({ state: 'in_progress', reopenReason: 'Circumferential notch still missed', verifiedAt: null });
    expect(await trailEvents('action', action.id)).toContain('REOPEN');
  });

  it('when the owner asks for an extension, then the due date changes only when the quality manager approves', async () => {
    const cast = await makeCast(context);
    const { action } = await findingWithAction(cast);
    await expectOk(await send(cast.owner, 'actions', action.id, { type: 'START' }));
    expect((await send(cast.owner, 'actions', action.id, { type: 'REQUEST_EXTENSION', dueDate: today(), reason: 'earlier' })).status).toBe(422);
    const requested = await expectOk(await send(cast.owner, 'actions', action.id, { type: 'REQUEST_EXTENSION', dueDate: inDays(45), reason: 'Probe on order' }));
    expect(requested).toMatchObject({ dueDate: inDays(30), pendingExtension: { dueDate: inDays(45), reason: 'Probe on order' } });
    expect((await send(cast.owner, 'actions', action.id, { type: 'APPROVE_EXTENSION' })).status).toBe(403);
    const approved = await expectOk(await send(cast.quality, 'actions', action.id, { type: 'APPROVE_EXTENSION' }));
    expect(approved).toMatchObject({ dueDate: inDays(45), pendingExtension: null });
    expect((await CorrectiveAction.findByPk(action.id))!.dueDate).toBe(inDays(45));
  });

  it('when an observation is classified with a note, then it closes at once; without a note it is refused', async () => {
    const cast = await makeCast(context);
    const { audit, run, resultIndex } = await auditWithFailedRun(cast);
    const finding = await raiseFromRun(cast.auditor, audit.id, run.id, resultIndex);
    await expectOk(await send(cast.auditor, 'findings', finding.id, { type: 'SUBMIT' }));
    const noNote = await send(cast.quality, 'findings', finding.id, { type: 'CLASSIFY', class: 'observation' });
    expect(noNote.status).toBe(422);
    expect(noNote.body.error.message).toContain('note');
    const closed = await expectOk(await send(cast.quality, 'findings', finding.id, { type: 'CLASSIFY', class: 'observation', note: 'Covered by the customer’s own rotating-probe pass' }));
    expect(closed).toMatchObject({ state: 'closed', closureNote: 'Covered by the customer’s own rotating-probe pass', dueDate: null });
  });

  it('when a request carries a server-only event or an unknown field, then it is 400 and nothing changes', async () => {
    const cast = await makeCast(context);
    const { finding, action } = await findingWithAction(cast);
    expect((await send(cast.quality, 'findings', finding.id, { type: 'ACTION_VERIFIED' })).status).toBe(400);
    expect((await send(cast.quality, 'actions', action.id, { type: 'REOPEN', reason: 'x' })).status).toBe(400);
    const withFacts = await send(cast.owner, 'actions', action.id, { type: 'START', facts: { evidenceCount: 5 } });
    expect(withFacts.status).toBe(400);
    expect((await CorrectiveAction.findByPk(action.id))!.state).toBe('assigned');
  });

  it('when the checklist runs outside fieldwork, then it is 422; a technique outside the scope is 400', async () => {
    const cast = await makeCast(context);
    const audit = await planAudit(cast);
    expect((await cast.auditor.post(`/api/audits/${audit.id}/checklist-runs`).send({ techniqueCode: 'TAC-ET-023' })).status).toBe(422);
    await expectOk(await send(cast.auditor, 'audits', audit.id, { type: 'START_FIELDWORK' }));
    const outside = await cast.auditor.post(`/api/audits/${audit.id}/checklist-runs`).send({ techniqueCode: 'TAC-ET-999' });
    expect(outside.status).toBe(400);
    expect(outside.body.error.details[0].path).toBe('techniqueCode');
    expect(await ChecklistRun.count({ where: { auditId: audit.id } })).toBe(0);
  });
});

describe('segregation of duties', () => {
  it('when an auditor plans an audit of the area they belong to, then it is 403', async () => {
    const cast = await makeCast(context);
    const insider = await person(context, ['auditor'], cast.areaId);
    const response = await insider.post('/api/audits').send({
      title: 'Own area', criteria: 'Procedure', areaId: cast.areaId, leadAuditorId: insider.user.id,
      plannedStart: today(), plannedEnd: inDays(3), techniques: [{ techniqueId: 1 }],
    });
    expect(response.status).toBe(403);
  });

  it('when the finding’s author is proposed as owner of its action, then it is 403', async () => {
    const cast = await makeCast(context);
    const authorOwner = await person(context, ['auditor', 'level3']);
    const { audit, run, resultIndex } = await auditWithFailedRun(cast, authorOwner);
    const finding = await raiseFromRun(authorOwner, audit.id, run.id, resultIndex);
    await expectOk(await send(authorOwner, 'findings', finding.id, { type: 'SUBMIT' }));
    await expectOk(await send(cast.quality, 'findings', finding.id, { type: 'CLASSIFY', class: 'minor' }));
    const response = await cast.quality.post('/api/actions').send({ findingId: finding.id, ownerId: authorOwner.user.id, dueDate: inDays(30) });
    expect(response.status).toBe(403);
    expect(await CorrectiveAction.count({ where: { findingId: finding.id } })).toBe(0);
  });

  it('when an action’s owner (also an auditor) tries to verify it or check its effectiveness, then both are 403', async () => {
    const cast = await makeCast(context);
    const ownerAuditor = await person(context, ['level3', 'auditor', 'quality_manager']);
    const { finding, action } = await findingWithAction(cast, ownerAuditor);
    await expectOk(await send(ownerAuditor, 'actions', action.id, { type: 'START' }));
    await expectOk(await send(ownerAuditor, 'actions', action.id, { type: 'SUBMIT_PLAN', method: 'other', rootCause: 'Gap', plan: [{ description: 'Fix', dueDate: inDays(5) }] }));
    await expectOk(await send(cast.quality, 'actions', action.id, { type: 'APPROVE_PLAN' }));
    await stubEvidenceRow(action.id, ownerAuditor.user);
    const submitted = await expectOk(await send(ownerAuditor, 'actions', action.id, { type: 'SUBMIT', summary: 'Done' }));
    expect(submitted.allowedEvents).toEqual([]);
    expect((await send(ownerAuditor, 'actions', action.id, { type: 'VERIFY', password: TEST_PASSWORD })).status).toBe(403);
    await expectOk(await send(cast.quality, 'actions', action.id, { type: 'VERIFY', password: TEST_PASSWORD }));
    expect((await send(ownerAuditor, 'findings', finding.id, { type: 'CONFIRM_EFFECTIVE', note: 'mine' })).status).toBe(403);
  });

  it('when the accountable manager owns the action or wrote the finding, then their closure signature is 403', async () => {
    const cast = await makeCast(context);
    const amOwner = await person(context, ['accountable_manager', 'level3']);
    const { finding, action } = await findingWithAction(cast, amOwner);
    await expectOk(await send(amOwner, 'actions', action.id, { type: 'START' }));
    await expectOk(await send(amOwner, 'actions', action.id, { type: 'SUBMIT_PLAN', method: 'other', rootCause: 'Gap', plan: [{ description: 'Fix', dueDate: inDays(5) }] }));
    await expectOk(await send(cast.quality, 'actions', action.id, { type: 'APPROVE_PLAN' }));
    await stubEvidenceRow(action.id, amOwner.user);
    await expectOk(await send(amOwner, 'actions', action.id, { type: 'SUBMIT', summary: 'Done' }));
    await expectOk(await send(cast.quality, 'actions', action.id, { type: 'VERIFY', password: TEST_PASSWORD }));
    await expectOk(await send(cast.auditor, 'findings', finding.id, { type: 'CONFIRM_EFFECTIVE', note: 'ok' }));
    expect((await send(amOwner, 'findings', finding.id, { type: 'CLOSE', password: TEST_PASSWORD })).status).toBe(403);

    const amAuthor = await person(context, ['accountable_manager', 'auditor']);
    const second = await findingWithAction(cast, cast.owner, amAuthor);
    expect((await send(amAuthor, 'findings', second.finding.id, { type: 'CLOSE', password: TEST_PASSWORD })).status).toBe(403);
    expect(await Signature.count({ where: { recordType: 'finding', recordId: [finding.id, second.finding.id] } })).toBe(0);
  });
});
