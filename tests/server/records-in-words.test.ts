// The trail found by record number and told in words; server errors in words.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, signedInAs, type TestContext } from '../helpers/test-app';
import { findingWithAction, makeCast } from '../helpers/workflow';
import type { RecordTrailView } from '../../shared/schemas/trail';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterAll(() => context.close());

const noCodes = (text: string) => {
  expect(text).not.toMatch(/\b[A-Z]{3,}_[A-Z_]+\b/);
  expect(text).not.toMatch(/\b(areaId|ownerId|leadAuditorId|inspectionIds|action_open|in_review|five_whys)\b/);
  expect(text).not.toMatch(/[{[]\s*"\w+"\s*:/);
};

/** Everything a person reads of the entries, as lines. */
const inText = (view: RecordTrailView) =>
  view.items.flatMap((entry) => [entry.eventLabel, ...entry.details.map((line) => [line.label, line.before, line.after, line.value].filter(Boolean).join(' '))]).join('\n');

describe('the trail in words', () => {
  it('when the trail is searched by a finding number, then it finds the finding and tells each event and change in words', async () => {
    const cast = await makeCast(context);
    const { finding, action } = await findingWithAction(cast);
    const byNumber = await cast.auditor.agent.get('/api/trail').query({ record: finding.number });
    expect(byNumber.status).toBe(200);
    const view = byNumber.body as RecordTrailView;
    expect(view.record).toEqual({ type: 'finding', id: String(finding.id), label: `Finding ${finding.number}` });
    expect(view.items.length).toBeGreaterThan(2);
    // The same entries as by type and id.
    const byId = (await cast.auditor.agent.get('/api/trail').query({ record: `finding:${finding.id}` })).body as RecordTrailView;
    expect(byId.items.map((entry) => entry.seq)).toEqual(view.items.map((entry) => entry.seq));

    const labels = view.items.map((entry) => entry.eventLabel);
    expect(labels).toEqual(expect.arrayContaining(['Finding raised', 'Finding submitted for review', 'Finding classified']));
    const classified = view.items.find((entry) => entry.event === 'CLASSIFY')!;
    expect(classified.details).toEqual(expect.arrayContaining([{ label: 'State', before: 'In review', after: 'Containment' }]));
    noCodes(inText(view));

    // The corrective action by its number, too; the owner's id reads as a name.
    const actionTrail = (await cast.auditor.agent.get('/api/trail').query({ record: action.number })).body as RecordTrailView;
    expect(actionTrail.record?.label).toBe(`Corrective action ${action.number}`);
    const assigned = actionTrail.items.find((entry) => entry.eventLabel === 'Corrective action assigned');
    expect(assigned).toBeDefined();
    noCodes(inText(actionTrail));
  });

  it('when the search names no record, then the answer says none was found instead of failing', async () => {
    const session = await signedInAs(context, ['auditor']);
    const none = await session.agent.get('/api/trail').query({ record: 'F-1999-9999' });
    expect(none.status).toBe(200);
    expect(none.body).toEqual({ record: null, items: [], total: 0 });
  });
});

describe('server errors in words', () => {
  it('when a body field is invalid, then the message names the field by its label and details keep the path', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const response = await quality.post('/api/equipment').send({
      kind: 'instrument',
      description: 'Eddy current instrument',
      serialNumber: `SN-${Date.now()}`,
      calibratedOn: '2026-06-01',
      calibrationDueOn: '2026-05-01',
    });
    expect(response.status).toBe(400);
    expect(response.body.error.message).toBe('Calibration due: the due date must be after the calibration date');
    expect(response.body.error.message).not.toContain('calibrationDueOn');
    expect(response.body.error.details).toEqual([{ path: 'calibrationDueOn', label: 'Calibration due', message: 'the due date must be after the calibration date' }]);
  });

  it('when a service refuses a field, then the message names the field by its label too', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const cast = await makeCast(context);
    const { finding } = await findingWithAction(cast);
    // A second action on the same finding is refused by the service, not by zod.
    const response = await quality.post('/api/actions').send({ findingId: finding.id, ownerId: cast.owner.user.id, dueDate: '2020-01-01' });
    expect(response.status).toBe(400);
    expect(response.body.error.message).not.toMatch(/dueDate|Some body fields/);
    expect(response.body.error.details[0]).toMatchObject({ path: 'dueDate', label: 'Due date' });
  });

  it('when a role may not create a record, then the refusal says who may, in words', async () => {
    const auditor = await signedInAs(context, ['auditor']);
    const response = await auditor.post('/api/users').send({ email: 'x@test.example', displayName: 'X', password: 'a long enough passphrase', roles: ['technician'] });
    expect(response.status).toBe(403);
    expect(response.body.error.message).toBe('Only an administrator may add people');
  });
});
