import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { OutboxMessage, TrailEntry, User } from '../../server/models';
import { enqueueMail } from '../../server/mail/outbox';
import { createTestContext, signedInAs, type SignedIn, type TestContext } from '../helpers/test-app';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterAll(async () => {
  await context?.close();
});

let serial = 0;
async function message(to: SignedIn, fields: Partial<{ status: 'pending' | 'sent' | 'held' | 'digested'; attempts: number; digestId: number; kind: string; recordType: string; recordId: string; sentAt: Date }> = {}) {
  serial += 1;
  return OutboxMessage.create({
    kind: fields.kind ?? 'action-overdue',
    toUserId: to.user.id,
    toAddress: to.user.email,
    subject: `Message ${serial} for ${to.user.displayName}`,
    textBody: `Hello ${to.user.displayName},\n\nBody ${serial}.`,
    htmlBody: `<p>Body ${serial}</p>`,
    recordType: fields.recordType ?? 'action',
    recordId: fields.recordId ?? '7',
    dedupeKey: null,
    status: fields.status ?? 'sent',
    attempts: fields.attempts ?? 0,
    nextAttemptAt: new Date(),
    sentAt: fields.sentAt ?? (fields.status === undefined || fields.status === 'sent' ? new Date() : null),
    digestId: fields.digestId ?? null,
  });
}

describe('each person’s messages', () => {
  it('when signed out, then the messages and the delivery choice are 401', async () => {
    const anonymous = request(context.app);
    expect((await anonymous.get('/api/notifications')).status).toBe(401);
    expect((await anonymous.get('/api/me/delivery')).status).toBe(401);
  });

  it('when a technician reads their messages, then only theirs come back, with status and record link in words; another’s is 404 and everyone’s is 403', async () => {
    const technician = await signedInAs(context, ['technician']);
    const other = await signedInAs(context, ['level3']);
    const mine = await message(technician, { kind: 'action-overdue', recordType: 'action', recordId: '42' });
    const theirs = await message(other);

    const list = await technician.agent.get('/api/notifications');
    expect(list.status).toBe(200);
    expect(list.body.total).toBe(1);
    expect(list.body.items[0]).toMatchObject({
      id: mine.id,
      subject: mine.subject,
      kindLabel: 'Reminder: corrective action overdue',
      status: 'sent',
      statusLabel: 'Sent',
      recordPath: '/actions/42',
      recipient: { id: technician.user.id, displayName: technician.user.displayName },
    });
    expect(list.body.items[0].text).toContain('Body');

    expect((await technician.agent.get(`/api/notifications/${mine.id}`)).status).toBe(200);
    expect((await technician.agent.get(`/api/notifications/${theirs.id}`)).status).toBe(404);
    expect((await technician.agent.get('/api/notifications?person=all')).status).toBe(403);
    expect((await technician.agent.get(`/api/notifications?person=${other.user.id}`)).status).toBe(403);
    expect((await technician.agent.get('/api/notifications?person=someone')).status).toBe(400);
  });

  it('when an administrator reads one person’s or everyone’s messages, then they come back', async () => {
    const admin = await signedInAs(context, ['admin']);
    const person = await signedInAs(context, ['auditor']);
    const first = await message(person);
    const second = await message(person, { status: 'pending' });
    const forPerson = await admin.agent.get(`/api/notifications?person=${person.user.id}`);
    expect(forPerson.body.items.map((item: { id: number }) => item.id)).toEqual([second.id, first.id]);
    const everyone = await admin.agent.get(`/api/notifications?person=all&q=${encodeURIComponent(first.subject)}`);
    expect(everyone.body.items.map((item: { id: number }) => item.id)).toEqual([first.id]);
    expect((await admin.agent.get(`/api/notifications/${second.id}`)).body).toMatchObject({ status: 'sending', statusLabel: 'Being sent' });
  });

  it('when messages are held, retried or sent in a digest, then each says so', async () => {
    const person = await signedInAs(context, ['quality_manager']);
    const retrying = await message(person, { status: 'pending', attempts: 2 });
    const held = await message(person, { status: 'held' });
    const digest = await message(person, { kind: 'daily-digest', status: 'sent' });
    const digested = await message(person, { status: 'digested', digestId: digest.id });
    const byId = new Map(((await person.agent.get('/api/notifications')).body.items as { id: number }[]).map((item) => [item.id, item]));
    expect(byId.get(retrying.id)).toMatchObject({ status: 'retrying', statusLabel: 'Not yet accepted by the mail server; Whorl keeps trying', sentAt: null });
    expect(byId.get(held.id)).toMatchObject({ status: 'held_for_digest', statusLabel: 'Held for the next daily digest' });
    expect(byId.get(digested.id)).toMatchObject({ status: 'sent_in_digest', sentAt: digest.sentAt!.toISOString() });
    expect(byId.get(digest.id)).toMatchObject({ kindLabel: 'Daily digest' });
  });

  it('when a person chooses the daily digest, then it is stored with a trail entry and their next message is held for it; a stale version is 409', async () => {
    const person = await signedInAs(context, ['technician']);
    const before = await person.agent.get('/api/me/delivery');
    expect(before.body).toMatchObject({ delivery: 'immediate', digestHourUtc: expect.any(Number) });

    expect((await person.patch('/api/me/delivery').send({ delivery: 'weekly', version: before.body.version })).status).toBe(400);
    expect((await person.patch('/api/me/delivery').send({ delivery: 'daily_digest' })).status).toBe(400);
    const changed = await person.patch('/api/me/delivery').send({ delivery: 'daily_digest', version: before.body.version });
    expect(changed.status).toBe(200);
    expect(changed.body.delivery).toBe('daily_digest');
    expect((await User.findByPk(person.user.id))!.mailDigest).toBe(true);
    const [entry] = await TrailEntry.findAll({ where: { recordType: 'user', recordId: String(person.user.id), event: 'MAIL_DELIVERY_CHANGED' } });
    expect(entry.changes).toEqual({ delivery: { from: 'immediate', to: 'daily_digest' } });
    expect((await person.patch('/api/me/delivery').send({ delivery: 'immediate', version: before.body.version })).status).toBe(409);

    await context.deps.sequelize.transaction((transaction) =>
      enqueueMail(transaction, [{ kind: 'action-assigned', toUserId: person.user.id, mail: { subject: 'Held for the digest', text: 'x', html: '<p>x</p>' } }], new Date()),
    );
    const [held] = (await person.agent.get('/api/notifications?q=Held%20for%20the%20digest')).body.items;
    expect(held).toMatchObject({ status: 'held_for_digest', kindLabel: 'Corrective action assigned' });
  });
});
