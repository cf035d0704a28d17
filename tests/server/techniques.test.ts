import path from 'node:path';
// The technique register over HTTP: create, edit, approve, new revision, the
// checklist of a stored revision, and the access ladder of each change.
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { randomBytes } from 'node:crypto';
import { Technique, TechniqueRevision, TrailEntry } from '../../server/models';
import { createTestContext, makeArea, signedInAs, type SignedIn, type TestContext } from '../helpers/test-app';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterAll(() => context.close());

const EXAMPLE = JSON.parse(readFileSync(path.join(import.meta.dirname, '../shared/fixtures/wheel-bead-seat.json'), 'utf8'));

/** A fresh copy of the wheel bead-seat example (it conforms) under a code of its own. */
function exampleTechnique(overrides: Record<string, unknown> = {}) {
  return { ...structuredClone(EXAMPLE), code: `T-${randomBytes(4).toString('hex')}`, revision: 'A', ...overrides };
}

async function createDraft(session: SignedIn, technique = exampleTechnique()) {
  const response = await session.post('/api/techniques').send({ technique });
  expect(response.status).toBe(201);
  return { id: response.body.id as number, body: response.body, technique };
}

/** A second Level 3: nobody approves a revision they wrote. */
let reviewer: SignedIn | undefined;
async function otherLevel3(): Promise<SignedIn> {
  reviewer ??= await signedInAs(context, ['level3']);
  return reviewer;
}

async function trailEvents(id: number) {
  const entries = await TrailEntry.findAll({ where: { recordType: 'technique', recordId: String(id) }, order: [['seq', 'ASC']] });
  return entries.map((entry) => entry.event);
}

describe('creating a technique', () => {
  it('when signed out, then 401', async () => {
    expect((await request(context.app).post('/api/techniques').send({ technique: exampleTechnique() })).status).toBe(401);
    expect((await request(context.app).get('/api/techniques')).status).toBe(401);
  });

  it('when the technique is invalid, then 400 names each field with the engine’s message', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const technique = exampleTechnique();
    technique.coils[0].diameterMm = -5;
    delete technique.material.conductivityIacs;
    const response = await level3.post('/api/techniques').send({ technique });
    expect(response.status).toBe(400);
    const paths = response.body.error.details.map((detail: { path: string }) => detail.path);
    expect(paths).toEqual(expect.arrayContaining(['technique.coils[0].diameterMm', 'technique.material.conductivityIacs']));
    const coilIssue = response.body.error.details.find((detail: { path: string }) => detail.path === 'technique.coils[0].diameterMm');
    expect(coilIssue.message).toBe('diameterMm (coil diameter) must be greater than 0 mm');
    expect(await Technique.count({ where: { code: technique.code } })).toBe(0);
  });

  it('when an unknown field is sent in the envelope, then 400', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const response = await level3.post('/api/techniques').send({ technique: exampleTechnique(), approved: true });
    expect(response.status).toBe(400);
  });

  it.each([['auditor'], ['technician'], ['quality_manager'], ['admin']] as const)('when a %s creates one, then 403', async (role) => {
    const session = await signedInAs(context, [role]);
    const technique = exampleTechnique();
    expect((await session.post('/api/techniques').send({ technique })).status).toBe(403);
    expect(await Technique.count({ where: { code: technique.code } })).toBe(0);
  });

  it('when a Level 3 creates one, then it is a draft with its verdict, and on the trail', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const area = await makeArea();
    const technique = exampleTechnique();
    const response = await level3.post('/api/techniques').send({ technique, areaId: area.id });
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({ code: technique.code, title: technique.title, areaId: area.id, areaName: area.name, currentRevision: 'A' });
    expect(response.body.revisions).toHaveLength(1);
    expect(response.body.revisions[0]).toMatchObject({ revision: 'A', state: 'draft', verdict: 'conforms', allowedEvents: ['EDIT'] /* its author never approves it */ });
    expect(response.body.revisions[0].content.coils[0].shielded).toBe(true);
    expect(await trailEvents(response.body.id)).toEqual(['TECHNIQUE_CREATED']);
  });

  it('when the code is already in the register, then 409', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const { technique } = await createDraft(level3);
    const again = await level3.post('/api/techniques').send({ technique });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('duplicate');
  });

  it('when the area does not exist, then 400 on areaId', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const response = await level3.post('/api/techniques').send({ technique: exampleTechnique(), areaId: 999_999 });
    expect(response.status).toBe(400);
    expect(response.body.error.details).toEqual([expect.objectContaining({ path: 'areaId', message: 'no such area' })]);
  });
});

describe('editing a draft revision', () => {
  it('when the ladder is walked, then 401 → 400 → 403 → 404 → 409 → 200', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const { id, body, technique } = await createDraft(level3);
    const version = body.revisions[0].version;
    const edited = { ...technique, title: 'Bead seat, edited' };

    expect((await request(context.app).patch(`/api/techniques/${id}/revisions/A`).send({ version, technique: edited })).status).toBe(401);

    const invalid = await level3.patch(`/api/techniques/${id}/revisions/A`).send({ version, technique: { ...edited, coils: [] } });
    expect(invalid.status).toBe(400);
    expect(invalid.body.error.details[0]).toMatchObject({ path: 'technique.coils', message: 'coils needs at least 1 entry' });

    const noVersion = await level3.patch(`/api/techniques/${id}/revisions/A`).send({ technique: edited });
    expect(noVersion.status).toBe(400);
    expect(noVersion.body.error.details[0].path).toBe('version');

    const auditor = await signedInAs(context, ['auditor']);
    expect((await auditor.patch(`/api/techniques/${id}/revisions/A`).send({ version, technique: edited })).status).toBe(403);

    expect((await level3.patch(`/api/techniques/999999/revisions/A`).send({ version, technique: edited })).status).toBe(404);
    expect((await level3.patch(`/api/techniques/${id}/revisions/Q`).send({ version, technique: edited })).status).toBe(404);

    expect((await level3.patch(`/api/techniques/${id}/revisions/A`).send({ version: version + 5, technique: edited })).status).toBe(409);

    const ok = await level3.patch(`/api/techniques/${id}/revisions/A`).send({ version, technique: edited });
    expect(ok.status).toBe(200);
    expect(ok.body.title).toBe('Bead seat, edited');
    expect(ok.body.revisions[0].content.title).toBe('Bead seat, edited');
    expect(ok.body.revisions[0].version).toBe(version + 1);

    const stale = await level3.patch(`/api/techniques/${id}/revisions/A`).send({ version, technique: { ...edited, title: 'Lost update' } });
    expect(stale.status).toBe(409);
    expect((await Technique.findByPk(id))!.title).toBe('Bead seat, edited');

    const entries = await TrailEntry.findAll({ where: { recordType: 'technique', recordId: String(id) }, order: [['seq', 'ASC']] });
    expect(entries.map((entry) => entry.event)).toEqual(['TECHNIQUE_CREATED', 'REVISION_EDITED']);
    expect(entries[1].changes).toMatchObject({ revision: 'A', title: { before: technique.title, after: 'Bead seat, edited' } });
  });

  it('when the edit changes a coil type, then the stored verdict follows the engine', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const tube = JSON.parse(readFileSync(path.join(import.meta.dirname, '../shared/fixtures/heat-exchanger-bobbin.json'), 'utf8'));
    const { id, body } = await createDraft(level3, { ...tube, code: `T-${randomBytes(4).toString('hex')}` });
    expect(body.revisions[0].verdict).toBe('does-not-conform');
    expect(body.revisions[0].failedRules).toContain('orientation-coverage');
    // A rotating probe inside the tube induces current in every surface direction: both cracks are crossed.
    const rotating = { ...tube, code: body.code, coils: [{ ...tube.coils[0], type: 'rotating', diameterMm: 3 }] };
    const edited = await level3.patch(`/api/techniques/${id}/revisions/A`).send({ version: body.revisions[0].version, technique: rotating });
    expect(edited.status).toBe(200);
    expect(edited.body.revisions[0].failedRules).not.toContain('orientation-coverage');
  });

  it('when the edit changes the code or the revision letter, then 400 on that field', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const { id, body, technique } = await createDraft(level3);
    const version = body.revisions[0].version;
    const code = await level3.patch(`/api/techniques/${id}/revisions/A`).send({ version, technique: { ...technique, code: 'OTHER-1' } });
    expect(code.status).toBe(400);
    expect(code.body.error.details[0].path).toBe('technique.code');
    const letter = await level3.patch(`/api/techniques/${id}/revisions/A`).send({ version, technique: { ...technique, revision: 'B' } });
    expect(letter.status).toBe(400);
    expect(letter.body.error.details[0].path).toBe('technique.revision');
  });
});

describe('approving and revising', () => {
  it('when someone other than a Level 3 approves, then 403 and the revision stays a draft', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const { id, body } = await createDraft(level3);
    for (const role of ['auditor', 'quality_manager', 'accountable_manager', 'technician', 'admin'] as const) {
      const session = await signedInAs(context, [role]);
      const response = await session.post(`/api/techniques/${id}/revisions/A/approve`).send({ version: body.revisions[0].version });
      expect(response.status, role).toBe(403);
    }
    expect((await TechniqueRevision.findOne({ where: { techniqueId: id } }))!.state).toBe('draft');
  });

  it('when the approve ladder is walked, then 401 → 400 → 404 → 409 → 200, and the approved revision is read-only (422)', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const { id, body, technique } = await createDraft(level3);
    const version = body.revisions[0].version;
    expect((await request(context.app).post(`/api/techniques/${id}/revisions/A/approve`).send({ version })).status).toBe(401);
    expect((await (await otherLevel3()).post(`/api/techniques/${id}/revisions/A/approve`).send({})).status).toBe(400);
    expect((await (await otherLevel3()).post(`/api/techniques/${id}/revisions/Z/approve`).send({ version })).status).toBe(404);
    expect((await (await otherLevel3()).post(`/api/techniques/${id}/revisions/A/approve`).send({ version: version + 1 })).status).toBe(409);

    // Its author may not approve it (segregation of duties); another Level 3 may.
    const own = await level3.post(`/api/techniques/${id}/revisions/A/approve`).send({ version });
    expect(own.status).toBe(403);
    expect(own.body.revisions).toBeUndefined();
    const approver = await otherLevel3();
    const approved = await approver.post(`/api/techniques/${id}/revisions/A/approve`).send({ version });
    expect(approved.status).toBe(200);
    expect(approved.body.revisions[0]).toMatchObject({
      state: 'approved',
      approvedBy: { id: approver.user.id, name: approver.user.displayName },
      allowedEvents: [],
    });
    expect(approved.body.revisions[0].approvedAt).toEqual(expect.any(String));
    expect(approved.body.allowedEvents).toEqual(['NEW_REVISION']);

    const edit = await level3
      .patch(`/api/techniques/${id}/revisions/A`)
      .send({ version: approved.body.revisions[0].version, technique: { ...technique, title: 'Changed after approval' } });
    expect(edit.status).toBe(422);
    expect(edit.body.error.message).toContain('read-only');
    const again = await (await otherLevel3()).post(`/api/techniques/${id}/revisions/A/approve`).send({ version: approved.body.revisions[0].version });
    expect(again.status).toBe(422);
    expect((await TechniqueRevision.findOne({ where: { techniqueId: id } }))!.content.title).toBe(technique.title);
    expect(await trailEvents(id)).toEqual(['TECHNIQUE_CREATED', 'REVISION_APPROVED']);
  });

  it('when a new revision is started, then it copies the latest into a draft B; approving B supersedes A', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const { id, body } = await createDraft(level3);
    await (await otherLevel3()).post(`/api/techniques/${id}/revisions/A/approve`).send({ version: body.revisions[0].version });

    expect((await request(context.app).post(`/api/techniques/${id}/revisions`).send({})).status).toBe(401);
    const auditor = await signedInAs(context, ['auditor']);
    expect((await auditor.post(`/api/techniques/${id}/revisions`).send({})).status).toBe(403);
    expect((await level3.post(`/api/techniques/999999/revisions`).send({})).status).toBe(404);

    const started = await level3.post(`/api/techniques/${id}/revisions`).send({});
    expect(started.status).toBe(201);
    const [draft, first] = started.body.revisions;
    expect(draft).toMatchObject({ revision: 'B', state: 'draft', verdict: first.verdict });
    expect({ ...draft.content, revision: 'A' }).toEqual(first.content);
    expect(draft.content.revision).toBe('B');
    expect(started.body.currentRevision).toBe('A');
    expect(started.body.allowedEvents).toEqual([]);

    const second = await level3.post(`/api/techniques/${id}/revisions`).send({});
    expect(second.status).toBe(422);
    expect(second.body.error.message).toContain('still a draft');

    const approved = await (await otherLevel3()).post(`/api/techniques/${id}/revisions/B/approve`).send({ version: draft.version });
    expect(approved.status).toBe(200);
    const states = Object.fromEntries(approved.body.revisions.map((revision: { revision: string; state: string }) => [revision.revision, revision.state]));
    expect(states).toEqual({ A: 'superseded', B: 'approved' });
    expect(approved.body.revisions[1].supersededAt).toEqual(expect.any(String));
    expect(approved.body.currentRevision).toBe('B');
    expect(await trailEvents(id)).toEqual(['TECHNIQUE_CREATED', 'REVISION_APPROVED', 'REVISION_CREATED', 'REVISION_SUPERSEDED', 'REVISION_APPROVED']);
  });
});

describe('reading the register', () => {
  it('when anyone signed in lists and filters, then paging, sorting, state, verdict and text work on the server', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const tag = `LIST${randomBytes(3).toString('hex')}`;
    const tube = JSON.parse(readFileSync(path.join(import.meta.dirname, '../shared/fixtures/heat-exchanger-bobbin.json'), 'utf8'));
    const a = await createDraft(level3, exampleTechnique({ code: `${tag}-1` }));
    await createDraft(level3, { ...tube, code: `${tag}-2` });
    const area = await makeArea();
    const cResponse = await level3.post('/api/techniques').send({ technique: exampleTechnique({ code: `${tag}-3` }), areaId: area.id });
    const c = { id: cResponse.body.id as number, body: cResponse.body };
    await (await otherLevel3()).post(`/api/techniques/${a.id}/revisions/A/approve`).send({ version: a.body.revisions[0].version });
    await level3.post(`/api/techniques/${a.id}/revisions`).send({});
    await (await otherLevel3()).post(`/api/techniques/${c.id}/revisions/A/approve`).send({ version: c.body.revisions[0].version });

    const technician = await signedInAs(context, ['technician']);
    const all = await technician.agent.get(`/api/techniques?q=${tag}&sort=-code`);
    expect(all.status).toBe(200);
    expect(all.body.total).toBe(3);
    expect(all.body.items.map((item: { code: string }) => item.code)).toEqual([`${tag}-3`, `${tag}-2`, `${tag}-1`]);
    expect(all.body.items[2]).toMatchObject({ revision: 'B', state: 'draft', approvedRevision: 'A', verdict: 'conforms' });

    const drafts = await technician.agent.get(`/api/techniques?q=${tag}&state=draft&sort=code`);
    expect(drafts.body.items.map((item: { code: string }) => item.code)).toEqual([`${tag}-1`, `${tag}-2`]);
    const failing = await technician.agent.get(`/api/techniques?q=${tag}&verdict=does-not-conform`);
    expect(failing.body.items.map((item: { code: string }) => item.code)).toEqual([`${tag}-2`]);
    const page = await technician.agent.get(`/api/techniques?q=${tag}&pageSize=2&page=2&sort=code`);
    expect(page.body).toMatchObject({ total: 3, items: [{ code: `${tag}-3` }] });
    const bySate = await technician.agent.get(`/api/techniques?q=${tag}&sort=state`);
    expect(bySate.body.items.map((item: { state: string }) => item.state)).toEqual(['approved', 'draft', 'draft']);

    const inArea = await technician.agent.get(`/api/techniques?areaId=${area.id}`);
    expect(inArea.body).toMatchObject({ total: 1, items: [{ code: `${tag}-3`, areaName: area.name }] });
    const recent = await technician.agent.get(`/api/techniques?q=${tag}&sort=-updatedAt`);
    expect(recent.body.items[0].code).toBe(`${tag}-3`);

    expect((await technician.agent.get('/api/techniques?state=open')).status).toBe(400);
    const one = await technician.agent.get(`/api/techniques/${a.id}`);
    expect(one.status).toBe(200);
    expect(one.body.revisions.map((revision: { revision: string }) => revision.revision)).toEqual(['B', 'A']);
    expect(one.body.revisions[0].allowedEvents).toEqual([]);
    expect((await technician.agent.get('/api/techniques/999999')).status).toBe(404);
  });

  it('when the checklist of a technique is asked for, then the approved revision in force is evaluated (or the one named)', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const { id, body, technique } = await createDraft(level3);
    await (await otherLevel3()).post(`/api/techniques/${id}/revisions/A/approve`).send({ version: body.revisions[0].version });
    const started = await level3.post(`/api/techniques/${id}/revisions`).send({});
    // Draft B drops the reference notch at the edge: the edge-effect rule then fails.
    const withoutEdgeNotch = {
      ...technique,
      revision: 'B',
      reference: { ...technique.reference, notches: technique.reference.notches.map(({ edgeDistanceMm: _drop, ...notch }: Record<string, unknown>) => notch) },
    };
    const edited = await level3.patch(`/api/techniques/${id}/revisions/B`).send({ version: started.body.revisions[0].version, technique: withoutEdgeNotch });
    expect(edited.status).toBe(200);
    expect(edited.body.revisions[0].verdict).toBe('does-not-conform');

    const auditor = await signedInAs(context, ['auditor']);
    expect((await request(context.app).get(`/api/techniques/${id}/checklist`)).status).toBe(401);
    const current = await auditor.agent.get(`/api/techniques/${id}/checklist`);
    expect(current.status).toBe(200);
    expect(current.body).toMatchObject({ techniqueId: id, code: technique.code, revision: { revision: 'A', state: 'approved' } });
    // The rules on the technique as written pass; people and equipment come from the registers when they are included.
    const asWritten = current.body.output.results.filter((result: { rule: string }) => result.rule !== 'personnel' && result.rule !== 'equipment');
    expect(asWritten.filter((result: { status: string }) => result.status === 'fail')).toEqual([]);
    expect(current.body.registersIncluded).toBe(true);
    expect(current.body.output.results.some((result: { rule: string }) => result.rule === 'personnel')).toBe(true);
    expect(current.body.output.results.length).toBeGreaterThan(5);

    const draft = await auditor.agent.get(`/api/techniques/${id}/checklist?revision=B`);
    expect(draft.body.revision).toMatchObject({ revision: 'B', state: 'draft' });
    expect(draft.body.output.verdict).toBe('does-not-conform');
    expect(draft.body.output.results.find((result: { rule: string; status: string }) => result.rule === 'edge-effect' && result.status === 'fail')).toBeTruthy();
    expect((await auditor.agent.get(`/api/techniques/${id}/checklist?revision=Q`)).status).toBe(404);
    expect((await auditor.agent.get(`/api/techniques/${id}/checklist?revision=a%20b`)).status).toBe(400);
  });
});
