// Planning an audit covers the revision in force: a technique with only a draft
// is refused at its scope field, and a revision letter the planner saw that is no
// longer in force is refused; the audit stores exactly the revision planned.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import { createTestContext, signedInAs, type TestContext } from '../helpers/test-app';
import { expectOk, inDays, makeCast, today } from '../helpers/workflow';
import { DEMO_TECHNIQUES } from '../../shared/domain/demo-techniques';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterAll(async () => {
  await context?.close();
});

const technique = (code: string) => ({ ...structuredClone(DEMO_TECHNIQUES.find((item) => item.code === 'TAC-ET-023')!), code });

describe('audit scope', () => {
  it('when the scope names a technique with only a draft, or a revision not in force, then the plan is refused at that technique; the revision in force is stored', async () => {
    const cast = await makeCast(context);
    const level3 = await signedInAs(context, ['level3']);
    // Another Level 3 approves: nobody approves their own revision.
    const approver = await signedInAs(context, ['level3']);
    const tag = randomBytes(3).toString('hex').toUpperCase();
    const draftOnly = await expectOk(await level3.post('/api/techniques').send({ technique: technique(`DRAFT-${tag}`) }), 201);
    const approved = await expectOk(await level3.post('/api/techniques').send({ technique: technique(`INFORCE-${tag}`) }), 201);
    const revision = approved.revisions[0];
    await expectOk(await approver.post(`/api/techniques/${approved.id}/revisions/${revision.revision}/approve`).send({ version: revision.version }));
    // A new draft revision of the approved technique: the register lists it, the audit must still cover the one in force.
    const withDraft = await expectOk(await level3.post(`/api/techniques/${approved.id}/revisions`).send({}), 201);
    const next = withDraft.revisions.find((item: { state: string }) => item.state === 'draft');
    expect(next.revision).not.toBe(revision.revision);

    const plan = (techniques: unknown[]) =>
      cast.auditor.post('/api/audits').send({
        title: `Scope ${tag}`,
        criteria: 'Company ET procedure',
        areaId: cast.areaId,
        leadAuditorId: cast.auditor.user.id,
        plannedStart: today(),
        plannedEnd: inDays(5),
        techniques,
      });

    const refused = await plan([{ techniqueId: approved.id, revision: revision.revision }, { techniqueId: draftOnly.id }]);
    expect(refused.status).toBe(400);
    expect(refused.body.error.details).toEqual([
      expect.objectContaining({ path: 'techniques.1.techniqueId', message: `DRAFT-${tag} has no approved revision in force (rev ${draftOnly.revisions[0].revision} is a draft)` }),
    ]);

    const stale = await plan([{ techniqueId: approved.id, revision: next.revision }]);
    expect(stale.status).toBe(400);
    expect(stale.body.error.details[0].path).toBe('techniques.0.revision');

    const audit = await expectOk(await plan([{ techniqueId: approved.id, revision: revision.revision }]), 201);
    expect(audit.scope.map((item: { code: string; revision: string }) => `${item.code} rev ${item.revision}`)).toEqual([`INFORCE-${tag} rev ${revision.revision}`]);
  });
});
