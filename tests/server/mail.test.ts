import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { formatDate } from '../../shared/format/dates';
import { Area, CaughtMail, OutboxMessage, User } from '../../server/models';
import { messageIdFor, createOutboxWorker } from '../../server/mail/outbox-worker';
import { createMailTransport } from '../../server/mail/transport';
import { mailEffectSink } from '../../server/mail/mail-effects';
import { SCHEDULED_JOBS, createScheduler } from '../../server/jobs';
import type { MailRuntime } from '../../server/mail';
import { createIsolatedDatabase, createTestContext, signedInAs, type TestContext } from '../helpers/test-app';
import { auditWithFailedRun, expectOk, findingAwaitingSignoff, findingWithAction, inDays, makeCast, planAudit, send } from '../helpers/workflow';
import { caughtFor, makeJobsDue, outboxFor, startTestMail, waitFor } from '../helpers/mail';

let context: TestContext;
let mail: MailRuntime;
beforeAll(async () => {
  // Schedulers and senders work through every due row: on the run's shared database they would
  // also meet the records (and queued messages) of every other test file.
  context = createTestContext({ DATABASE_URL: await createIsolatedDatabase('mail') });
  mail = await startTestMail(context);
});
afterAll(async () => {
  await mail?.stop();
  await context?.close();
});

const at = (day: string) => new Date(`${day}T08:00:00Z`);
const addDays = (day: string, days: number) => new Date(Date.parse(`${day}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);

/** One scheduler run at the given day, then everything due sent. */
async function runDay(day: string) {
  context.clock.set(at(day));
  await makeJobsDue(context);
  await mail.scheduler.tick();
  await mail.worker.runOnce();
}

describe('e-mail through the outbox', () => {
  it('when a corrective action is assigned, then its owner gets exactly one message with a link to the action', async () => {
    const cast = await makeCast(context);
    const { action } = await findingWithAction(cast);
    const [row] = await outboxFor('action', action.id, 'action-assigned');
    expect(row.toAddress).toBe(cast.owner.user.email);
    const caught = await waitFor(async () => {
      const found = await CaughtMail.findAll({ where: { messageId: messageIdFor(row.id) } });
      return found.length ? found : null;
    }, { what: 'the assignment message' });
    expect(caught).toHaveLength(1);
    expect(caught[0].envelopeTo).toEqual([cast.owner.user.email]);
    expect(caught[0].subject).toBe(`Corrective action ${action.number} is assigned to you (due ${formatDate(action.dueDate)})`);
    expect(caught[0].textBody).toContain(`${context.config.publicUrl}/actions/${action.id}`);
    expect(caught[0].htmlBody).toContain(`href="${context.config.publicUrl}/actions/${action.id}"`);
    expect((await caughtFor(cast.owner.user.email)).filter((message) => message.subject?.includes('is assigned to you'))).toHaveLength(1);
    expect((await OutboxMessage.findByPk(row.id))!.status).toBe('sent');
  });

  it('when the SMTP server is down, then the API answers at normal speed and the message goes out once after it is back', async () => {
    const cast = await makeCast(context);
    // Everything up to the assignment, with mail still flowing.
    const { audit, run, resultIndex } = await auditWithFailedRun(cast);
    const finding = await expectOk(await cast.auditor.post(`/api/audits/${audit.id}/findings`).send({ checklistRunId: run.id, resultIndex }), 201);
    await expectOk(await send(cast.auditor, 'findings', finding.id, { type: 'SUBMIT' }));
    await expectOk(await send(cast.quality, 'findings', finding.id, { type: 'CLASSIFY', class: 'minor' }));
    await mail.smtp!.stop();
    try {
      const started = Date.now();
      const response = await cast.quality.post('/api/actions').send({ findingId: finding.id, ownerId: cast.owner.user.id, dueDate: inDays(30) });
      const elapsedMs = Date.now() - started;
      expect(response.status).toBe(201);
      expect(elapsedMs).toBeLessThan(1500);
      const [row] = await outboxFor('action', response.body.id, 'action-assigned');
      const failed = await waitFor(async () => {
        const current = await OutboxMessage.findByPk(row.id);
        return current && current.attempts >= 1 ? current : null;
      }, { what: 'a failed send attempt' });
      expect(failed.status).toBe('pending');
      expect(failed.lastError).toBeTruthy();
      expect(failed.nextAttemptAt.getTime()).toBeGreaterThan(Date.now());
      expect(await CaughtMail.count({ where: { messageId: messageIdFor(row.id) } })).toBe(0);

      await mail.smtp!.start();
      // Past the backoff: the next run retries and delivers.
      context.clock.set(new Date(Date.now() + 10 * 60_000));
      await mail.worker.runOnce();
      await mail.worker.runOnce();
      expect(await CaughtMail.count({ where: { messageId: messageIdFor(row.id) } })).toBe(1);
      expect((await OutboxMessage.findByPk(row.id))!.status).toBe('sent');
    } finally {
      await mail.smtp!.start();
      context.clock.set(null);
    }
  });

  it('when the transaction of a transition rolls back, then its messages are never written nor sent', async () => {
    const cast = await makeCast(context);
    const { action } = await findingWithAction(cast);
    const before = await OutboxMessage.count({ where: { recordType: 'action', recordId: String(action.id) } });
    await expect(
      context.deps.sequelize.transaction(async (transaction) => {
        await mailEffectSink.inTransaction(transaction, ['notifyOwnerPlanApproved', 'notifyOwnerReopened'], {
          deps: context.deps, actorId: cast.quality.user.id, recordType: 'action', recordId: action.id, event: 'APPROVE_PLAN', state: 'in_progress', context: {},
        });
        // The messages exist inside the transaction …
        expect(await OutboxMessage.count({ where: { recordType: 'action', recordId: String(action.id) }, transaction })).toBe(before + 2);
        throw new Error('the transition failed after its effects were queued');
      }),
    ).rejects.toThrow('failed after its effects');
    // … and not after the rollback.
    await mail.worker.runOnce();
    expect(await OutboxMessage.count({ where: { recordType: 'action', recordId: String(action.id) } })).toBe(before);
    expect((await caughtFor(cast.owner.user.email)).filter((message) => message.subject?.includes('plan is approved') || message.subject?.includes('reopened'))).toHaveLength(0);

    // Through the API: a refused event (wrong signing password) queues nothing either.
    const refused = await send(cast.quality, 'actions', action.id, { type: 'VERIFY', password: 'wrong' });
    expect(refused.status).not.toBe(200);
    expect(await OutboxMessage.count({ where: { recordType: 'action', recordId: String(action.id) } })).toBe(before);
  });

  it('when two schedulers and two senders run at the same moment, then each reminder is delivered exactly once', async () => {
    const cast = await makeCast(context);
    const { action } = await findingWithAction(cast);
    const overdueDay = addDays(action.dueDate, 4);
    context.clock.set(at(overdueDay));
    try {
      await makeJobsDue(context);
      // Three instances, as three app servers would have: each ticks on its own connection.
      const second = createScheduler(context.deps, SCHEDULED_JOBS);
      const third = createScheduler(context.deps, SCHEDULED_JOBS);
      const transport = createMailTransport(mail.smtp!.url);
      const secondWorker = createOutboxWorker(context.deps, transport);
      const ran = await Promise.all([mail.scheduler.tick(), second.tick(), third.tick()]);
      expect(ran.flat().filter((name) => name === 'reminders')).toHaveLength(1);
      // The job runs again later the same day: the unique key keeps today's reminders single.
      context.clock.set(new Date(at(overdueDay).getTime() + 3 * 3_600_000));
      await makeJobsDue(context);
      await Promise.all([mail.scheduler.tick(), second.tick()]);
      await Promise.all([mail.worker.runOnce(), secondWorker.runOnce(), mail.worker.runOnce(), secondWorker.runOnce()]);
      transport.close();

      const overdue = await outboxFor('action', action.id, 'action-overdue');
      expect(overdue).toHaveLength(1);
      const escalated = await outboxFor('action', action.id, 'action-escalated');
      expect(escalated.map((row) => row.toUserId)).toContain(cast.quality.user.id);
      for (const row of [...overdue, ...escalated]) {
        expect(await CaughtMail.count({ where: { messageId: messageIdFor(row.id) } })).toBe(1);
      }
      const toOwner = (await caughtFor(cast.owner.user.email)).filter((message) => message.subject === `${action.number} is overdue by 4 days`);
      expect(toOwner).toHaveLength(1);
      expect(toOwner[0].textBody).toContain(`${context.config.publicUrl}/actions/${action.id}`);
    } finally {
      context.clock.set(null);
    }
  });

  it('when the clock moves day by day, then due-soon, daily overdue and one escalation fire on the right days', async () => {
    const cast = await makeCast(context);
    const { action } = await findingWithAction(cast);
    const due = action.dueDate as string;
    const kinds = async () => (await outboxFor('action', action.id)).map((row) => `${row.kind}→${row.toUserId === cast.owner.user.id ? 'owner' : row.toUserId === cast.quality.user.id ? 'quality' : 'other'}`);
    const baseline = (await kinds()).length;
    const newSince = async () => (await kinds()).slice(baseline);
    try {
      await runDay(addDays(due, -8));
      expect(await newSince()).toEqual([]);
      await runDay(addDays(due, -7));
      expect(await newSince()).toEqual(['action-due-soon→owner']);
      const [dueSoon] = await outboxFor('action', action.id, 'action-due-soon');
      expect(dueSoon.subject).toBe(`${action.number} is due in 7 days (${due})`);
      await runDay(addDays(due, -6));
      await runDay(due);
      expect(await newSince()).toEqual(['action-due-soon→owner']);
      await runDay(addDays(due, 1));
      await runDay(addDays(due, 2));
      expect((await newSince()).filter((kind) => kind.startsWith('action-overdue'))).toHaveLength(2);
      expect((await newSince()).some((kind) => kind.startsWith('action-escalated'))).toBe(false);
      await runDay(addDays(due, 3));
      expect((await newSince()).filter((kind) => kind === 'action-escalated→quality')).toHaveLength(1);
      await runDay(addDays(due, 4));
      const all = await newSince();
      expect(all.filter((kind) => kind === 'action-overdue→owner')).toHaveLength(4);
      expect(all.filter((kind) => kind === 'action-escalated→quality')).toHaveLength(1);
      const sent = await outboxFor('action', action.id);
      expect(sent.every((row) => row.status === 'sent')).toBe(true);
    } finally {
      context.clock.set(null);
    }
  });

  it('when an audit is near and a finding waits for signature, then the lead auditor, the area lead and the accountable manager are reminded', async () => {
    const cast = await makeCast(context);
    await Area.update({ leadUserId: cast.technician.user.id }, { where: { id: cast.areaId } });
    const audit = await planAudit(cast);
    const { finding } = await findingAwaitingSignoff(cast);
    try {
      const today = new Date().toISOString().slice(0, 10);
      await runDay(today);
      const auditRows = await outboxFor('audit', audit.id, 'audit-coming-up');
      expect(auditRows.map((row) => row.toUserId).sort()).toEqual([cast.auditor.user.id, cast.technician.user.id].sort());
      expect(auditRows[0].subject).toContain('starts today');
      expect(await outboxFor('finding', finding.id, 'finding-signoff-reminder')).toHaveLength(0);
      // A day later the finding has waited a day for its signature.
      await runDay(addDays(today, 1));
      const signoff = await outboxFor('finding', finding.id, 'finding-signoff-reminder');
      expect(signoff.map((row) => row.toUserId)).toContain(cast.accountable.user.id);
      expect(signoff[0].textBody).toContain(`/findings/${finding.id}`);
    } finally {
      context.clock.set(null);
    }
  });

  it('when someone chose the daily digest, then their messages are held and go out as one digest at the digest hour', async () => {
    const cast = await makeCast(context);
    await User.update({ mailDigest: true }, { where: { id: cast.owner.user.id } });
    const { action } = await findingWithAction(cast);
    const [held] = await outboxFor('action', action.id, 'action-assigned');
    expect(held.status).toBe('held');
    const tomorrow = addDays(new Date().toISOString().slice(0, 10), 1);
    try {
      context.clock.set(new Date(`${tomorrow}T03:00:00Z`));
      await makeJobsDue(context);
      await mail.scheduler.tick();
      expect((await OutboxMessage.findByPk(held.id))!.status).toBe('held');
      await runDay(tomorrow);
      expect((await OutboxMessage.findByPk(held.id))!.status).toBe('digested');
      const digests = (await caughtFor(cast.owner.user.email)).filter((message) => message.subject?.startsWith('Whorl daily digest'));
      expect(digests).toHaveLength(1);
      expect(digests[0].textBody).toContain(`Corrective action ${action.number} is assigned to you`);
      expect(digests[0].textBody).toMatch(/Trail head at .* UTC: sequence \d+, hash [0-9a-f]{64}/);
      await runDay(tomorrow);
      expect((await caughtFor(cast.owner.user.email)).filter((message) => message.subject?.startsWith('Whorl daily digest'))).toHaveLength(1);
    } finally {
      context.clock.set(null);
    }
  });

  it('when an admin opens the mailbox, then the caught messages are listed and readable; other roles get 403', async () => {
    const cast = await makeCast(context);
    const { action } = await findingWithAction(cast);
    await waitFor(async () => (await caughtFor(cast.owner.user.email)).length > 0, { what: 'a caught message' });
    const admin = await signedInAs(context, ['admin']);
    const list = await admin.agent.get(`/api/mailbox?pageSize=5&q=${encodeURIComponent(action.number)}`);
    expect(list.status).toBe(200);
    expect(list.body.total).toBeGreaterThan(0);
    expect(list.body.catching).toBe(true);
    expect(list.body.outbox).toMatchObject({ pending: expect.any(Number), retrying: expect.any(Number) });
    const one = await admin.agent.get(`/api/mailbox/${list.body.items[0].id}`);
    expect(one.status).toBe(200);
    expect(one.body.text).toContain('Hello');
    const technician = await signedInAs(context, ['technician']);
    expect((await technician.agent.get('/api/mailbox')).status).toBe(403);
  });
});
