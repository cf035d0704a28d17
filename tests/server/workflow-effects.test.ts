import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { Finding, TrailEntry } from '../../server/models';
import { setEffectSink, noEffects, type EffectContext } from '../../server/services/effects';
import { createTestContext, TEST_PASSWORD, type TestContext } from '../helpers/test-app';
import { auditWithFailedRun, expectOk, findingWithAction, makeCast, raiseFromRun, send, stubEvidenceRow, inDays } from '../helpers/workflow';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterEach(() => {
  setEffectSink(noEffects);
});
afterAll(() => context.close());

interface Call {
  phase: 'inTransaction' | 'afterCommit';
  effects: string[];
  recordType: string;
  event: string;
  state: string;
  committedState?: string;
}

describe('the effects seam', () => {
  it('when a transition runs, then its effects reach the sink inside the transaction and again after commit', async () => {
    const calls: Call[] = [];
    setEffectSink({
      async inTransaction(transaction, effects, ctx: EffectContext) {
        // The row is visible as changed inside the transaction.
        const row = await Finding.findByPk(ctx.recordId, { transaction });
        calls.push({ phase: 'inTransaction', effects, recordType: ctx.recordType, event: ctx.event, state: ctx.state, committedState: row?.state });
      },
      async afterCommit(effects, ctx) {
        calls.push({ phase: 'afterCommit', effects, recordType: ctx.recordType, event: ctx.event, state: ctx.state });
      },
    });
    const cast = await makeCast(context);
    const { audit, run, resultIndex } = await auditWithFailedRun(cast);
    const finding = await raiseFromRun(cast.auditor, audit.id, run.id, resultIndex);
    calls.length = 0;
    await expectOk(await send(cast.auditor, 'findings', finding.id, { type: 'SUBMIT' }));
    expect(calls).toEqual([
      { phase: 'inTransaction', effects: ['notifyFindingSubmitted'], recordType: 'finding', event: 'SUBMIT', state: 'in_review', committedState: 'in_review' },
      { phase: 'afterCommit', effects: ['notifyFindingSubmitted'], recordType: 'finding', event: 'SUBMIT', state: 'in_review' },
    ]);
  });

  it('when the action is verified, then the sink gets both records’ effects: the action’s and the finding’s server event', async () => {
    const cast = await makeCast(context);
    const { action } = await findingWithAction(cast);
    await expectOk(await send(cast.owner, 'actions', action.id, { type: 'START' }));
    await expectOk(await send(cast.owner, 'actions', action.id, { type: 'SUBMIT_PLAN', method: 'other', rootCause: 'Gap', plan: [{ description: 'Fix', dueDate: inDays(5) }] }));
    await expectOk(await send(cast.quality, 'actions', action.id, { type: 'APPROVE_PLAN' }));
    await stubEvidenceRow(action.id, cast.owner.user);
    await expectOk(await send(cast.owner, 'actions', action.id, { type: 'SUBMIT', summary: 'Done' }));
    const after: Array<{ recordType: string; event: string; effects: string[] }> = [];
    setEffectSink({ async inTransaction() {}, async afterCommit(effects, ctx) { after.push({ recordType: ctx.recordType, event: ctx.event, effects }); } });
    await expectOk(await send(cast.quality, 'actions', action.id, { type: 'VERIFY', password: TEST_PASSWORD }));
    expect(after).toEqual([
      { recordType: 'action', event: 'VERIFY', effects: ['markFindingActionVerified'] },
      { recordType: 'finding', event: 'ACTION_VERIFIED', effects: ['notifyEffectivenessCheckDue'] },
    ]);
  });

  it('when the sink fails inside the transaction, then the transition is rolled back with its trail entry', async () => {
    const cast = await makeCast(context);
    const { audit, run, resultIndex } = await auditWithFailedRun(cast);
    const finding = await raiseFromRun(cast.auditor, audit.id, run.id, resultIndex);
    setEffectSink({ async inTransaction() { throw new Error('outbox unavailable'); }, async afterCommit() {} });
    const response = await send(cast.auditor, 'findings', finding.id, { type: 'SUBMIT' });
    expect(response.status).toBe(500);
    expect((await Finding.findByPk(finding.id))!.state).toBe('raised');
    expect(await TrailEntry.count({ where: { recordType: 'finding', recordId: String(finding.id), event: 'SUBMIT' } })).toBe(0);
  });

  it('when the sink fails after commit, then the request still succeeds and the change stays', async () => {
    const cast = await makeCast(context);
    const { audit, run, resultIndex } = await auditWithFailedRun(cast);
    const finding = await raiseFromRun(cast.auditor, audit.id, run.id, resultIndex);
    setEffectSink({ async inTransaction() {}, async afterCommit() { throw new Error('mail server down'); } });
    await expectOk(await send(cast.auditor, 'findings', finding.id, { type: 'SUBMIT' }));
    expect((await Finding.findByPk(finding.id))!.state).toBe('in_review');
  });
});
