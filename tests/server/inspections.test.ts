import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Inspection, TrailEntry, User } from '../../server/models';
import { createTestContext, makeUser, signIn, signedInAs, type TestContext } from '../helpers/test-app';
import { inspectionBody, makeInspectionFixture, type InspectionFixture } from '../helpers/inspections';

let context: TestContext;
let fixture: InspectionFixture;
let inspector: User;

beforeAll(async () => {
  context = createTestContext();
  // The register's "now": dates after it are refused as future.
  context.clock.set(new Date('2026-11-20T12:00:00Z'));
  inspector = await makeUser({ roles: ['technician'] });
  fixture = await makeInspectionFixture(inspector);
});
afterAll(() => context.close());

const detailsOf = (body: { error?: { details?: { path: string; message: string }[] } }) => body.error?.details ?? [];

describe('inspection register', () => {
  it('when signed out, then reading and recording are 401', async () => {
    expect((await request(context.app).get('/api/inspections')).status).toBe(401);
    expect((await request(context.app).post('/api/inspections').send(inspectionBody(fixture, inspector))).status).toBe(401);
  });

  it('when a quality manager records an inspection, then it is stored with the revision’s technique, presented in full and on the trail', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const response = await quality.post('/api/inspections').send(inspectionBody(fixture, inspector, { notes: 'Indication at 3 o’clock, Å-side' }));
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({
      technique: { id: fixture.technique.id, code: fixture.technique.code },
      revision: { id: fixture.approved.id, revision: 'B' },
      performedOn: '2026-07-15',
      customer: 'Kühlwerk Ærø Flugdienst',
      inspector: { id: inspector.id, name: inspector.displayName },
      result: 'accept',
      instrument: { id: fixture.instrument.id, kind: 'instrument', serialNumber: fixture.instrument.serialNumber },
      probe: { id: fixture.probe.id, kind: 'probe' },
      referenceStandard: { id: fixture.standard.id, kind: 'reference-standard' },
      notes: 'Indication at 3 o’clock, Å-side',
      version: 0,
    });
    const row = await Inspection.findByPk(response.body.id);
    expect(row).toMatchObject({ techniqueId: fixture.technique.id, techniqueRevisionId: fixture.approved.id, createdById: quality.user.id, customer: 'Kühlwerk Ærø Flugdienst' });
    const trail = await TrailEntry.findAll({ where: { recordType: 'inspection', recordId: String(row!.id) } });
    expect(trail.map((entry) => entry.event)).toEqual(['INSPECTION_RECORDED']);
    expect(trail[0].userId).toBe(quality.user.id);
    expect(trail[0].changes).toMatchObject({ partNumber: `PN-${fixture.tag}`, techniqueId: fixture.technique.id });

    const got = await quality.agent.get(`/api/inspections/${row!.id}`);
    expect(got.status).toBe(200);
    expect(got.body).toEqual(response.body);
  });

  it('when a technician records against the superseded revision within its period, then it is accepted', async () => {
    const technician = await signedInAs(context, ['technician']);
    // A technician records their own work: they are its inspector.
    const response = await technician.post('/api/inspections').send(inspectionBody(fixture, technician.user, { techniqueRevisionId: fixture.superseded.id, performedOn: '2026-03-01' }));
    expect(response.status).toBe(201);
    expect(response.body.revision.revision).toBe('A');
  });

  for (const roles of [['auditor'], ['admin'], ['accountable_manager']] as const) {
    it(`when an ${roles[0]}-only user records or corrects an inspection, then it is 403 and nothing is written`, async () => {
      const session = await signedInAs(context, [...roles]);
      const before = await Inspection.count();
      const response = await session.post('/api/inspections').send(inspectionBody(fixture, inspector));
      expect(response.status).toBe(403);
      expect(await Inspection.count()).toBe(before);
      const existing = await Inspection.findOne({ where: { techniqueId: fixture.technique.id } });
      const patch = await session.patch(`/api/inspections/${existing!.id}`).send({ ...inspectionBody(fixture, inspector), version: existing!.version });
      expect(patch.status).toBe(403);
      // Everyone reads the register.
      expect((await session.agent.get('/api/inspections')).status).toBe(200);
      const csv = await session.agent.get(`/api/inspections.csv?techniqueId=${fixture.technique.id}`);
      expect(csv.status).toBe(200);
    });
  }

  it('when the revision is a draft, the date is before approval or in the future, then each is a 400 naming the field and nothing is written', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const before = await Inspection.count();
    const draft = await quality.post('/api/inspections').send(inspectionBody(fixture, inspector, { techniqueRevisionId: fixture.draft.id }));
    expect(draft.status).toBe(400);
    expect(detailsOf(draft.body)).toEqual([expect.objectContaining({ path: 'techniqueRevisionId', message: expect.stringContaining('draft') })]);

    const early = await quality.post('/api/inspections').send(inspectionBody(fixture, inspector, { performedOn: '2026-05-31' }));
    expect(early.status).toBe(400);
    expect(detailsOf(early.body)).toEqual([expect.objectContaining({ path: 'performedOn', message: expect.stringContaining('2026-06-01') })]);

    // The approval day itself is allowed (approved at 08:00 UTC on 2026-06-01).
    expect((await quality.post('/api/inspections').send(inspectionBody(fixture, inspector, { performedOn: '2026-06-01' }))).status).toBe(201);

    const future = await quality.post('/api/inspections').send(inspectionBody(fixture, inspector, { performedOn: '2026-11-21' }));
    expect(future.status).toBe(400);
    expect(detailsOf(future.body)).toEqual([expect.objectContaining({ path: 'performedOn', message: expect.stringContaining('future') })]);

    const noDay = await quality.post('/api/inspections').send(inspectionBody(fixture, inspector, { performedOn: '2026-09-31' }));
    expect(noDay.status).toBe(400);
    expect(await Inspection.count()).toBe(before + 1);
  });

  it('when equipment is of the wrong kind or missing, or the inspector is inactive, then it is a 400 per field', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const swapped = await quality.post('/api/inspections').send(inspectionBody(fixture, inspector, { instrumentId: fixture.probe.id, probeId: fixture.standard.id, referenceStandardId: 999999999 }));
    expect(swapped.status).toBe(400);
    expect(detailsOf(swapped.body).map((d) => d.path).sort()).toEqual(['instrumentId', 'probeId', 'referenceStandardId']);
    expect(detailsOf(swapped.body).find((d) => d.path === 'instrumentId')!.message).toContain('not an instrument');

    const gone = await makeUser({ roles: ['technician'] });
    await gone.update({ active: false });
    const inactive = await quality.post('/api/inspections').send(inspectionBody(fixture, gone));
    expect(inactive.status).toBe(400);
    expect(detailsOf(inactive.body)).toEqual([expect.objectContaining({ path: 'inspectorId' })]);
    expect(await Inspection.count({ where: { inspectorId: gone.id } })).toBe(0);
  });

  it('when the body has an unknown field, a bad result or an empty part number, then it is 400', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const unknown = await quality.post('/api/inspections').send({ ...inspectionBody(fixture, inspector), createdById: 1 });
    expect(unknown.status).toBe(400);
    const badResult = await quality.post('/api/inspections').send(inspectionBody(fixture, inspector, { result: 'maybe', partNumber: '  ' }));
    expect(badResult.status).toBe(400);
    expect(detailsOf(badResult.body).map((d) => d.path).sort()).toEqual(['partNumber', 'result']);
  });

  it('when the list is filtered by technique, revision, equipment, result, dates and text, then only matching rows come back, paged and sorted', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const own = await makeInspectionFixture(inspector);
    const record = (overrides: Record<string, unknown>) => quality.post('/api/inspections').send(inspectionBody(own, inspector, overrides)).then((r) => {
      expect(r.status).toBe(201);
      return r.body as { id: number };
    });
    const a = await record({ performedOn: '2026-07-01', partNumber: 'PN-ALPHA', result: 'accept' });
    const b = await record({ performedOn: '2026-08-01', partNumber: 'PN-BRAVO', result: 'reject', probeId: null, workOrder: 'WO-ZULU-7' });
    const c = await record({ performedOn: '2026-09-01', partNumber: 'PN-CHARLIE', result: 'indication_recorded', customer: 'Fjordvik Rotorteknikk' });
    const d = await record({ techniqueRevisionId: own.superseded.id, performedOn: '2026-04-01', partNumber: 'PN-DELTA' });
    const ids = (body: { items: { id: number }[] }) => body.items.map((item) => item.id);
    const list = (query: string) => quality.agent.get(`/api/inspections?techniqueId=${own.technique.id}&${query}`).then((r) => {
      expect(r.status).toBe(200);
      return r.body;
    });

    const all = await list('');
    expect(all.total).toBe(4);
    expect(ids(all)).toEqual([c.id, b.id, a.id, d.id]); // newest first by default
    expect(ids(await list('sort=performedOn'))).toEqual([d.id, a.id, b.id, c.id]);
    expect(ids(await list(`revisionId=${own.superseded.id}`))).toEqual([d.id]);
    expect(ids(await list('result=reject'))).toEqual([b.id]);
    expect(ids(await list('from=2026-07-15&to=2026-08-31'))).toEqual([b.id]);
    expect(ids(await list('q=zulu'))).toEqual([b.id]);
    expect(ids(await list('q=Fjordvik'))).toEqual([c.id]);
    expect(ids(await list('q=pn-alpha'))).toEqual([a.id]);
    // Any of the three equipment columns matches; B used no probe.
    expect(ids(await list(`equipmentId=${own.probe.id}&sort=performedOn`))).toEqual([d.id, a.id, c.id]);
    expect(ids(await list(`equipmentId=${own.standard.id}`)).length).toBe(4);
    const page = await list('sort=performedOn&pageSize=2&page=2');
    expect(page.total).toBe(4);
    expect(ids(page)).toEqual([b.id, c.id]);
    // A sort outside the allow-list falls back to the default.
    expect(ids(await list('sort=notes'))).toEqual([c.id, b.id, a.id, d.id]);
    expect((await quality.agent.get('/api/inspections?result=maybe')).status).toBe(400);
    expect((await quality.agent.get('/api/inspections?colour=red')).status).toBe(400);

    const csv = await quality.agent.get(`/api/inspections.csv?techniqueId=${own.technique.id}&sort=performedOn`);
    expect(csv.status).toBe(200);
    expect(csv.headers['content-type']).toContain('text/csv');
    const lines = csv.text.replace(/^\uFEFF/, '').trim().split('\r\n');
    // Every field quoted (CSV injection guard).
    expect(lines[0]).toBe('"Date","Technique code","Revision","Part number","Serial number","Work order","Customer","Inspector","Result","Instrument serial","Probe serial","Reference standard serial","Notes"');
    expect(lines).toHaveLength(5);
    expect(lines[1]).toContain('2026-04-01');
    expect(lines[1]).toContain('PN-DELTA');
    expect(lines[3]).toContain('Reject');
  });

  it('when an inspection is corrected with its version, then the changes are saved and trailed; a stale version is 409 and changes nothing', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const created = (await quality.post('/api/inspections').send(inspectionBody(fixture, inspector))).body;
    const corrected = await quality.patch(`/api/inspections/${created.id}`).send({
      ...inspectionBody(fixture, inspector, { result: 'indication_recorded', techniqueRevisionId: fixture.superseded.id, performedOn: '2026-05-20', notes: 'Re-read from the strip chart' }),
      version: created.version,
    });
    expect(corrected.status).toBe(200);
    expect(corrected.body).toMatchObject({ result: 'indication_recorded', revision: { revision: 'A' }, performedOn: '2026-05-20', version: created.version + 1 });
    const trail = await TrailEntry.findAll({ where: { recordType: 'inspection', recordId: String(created.id) }, order: [['seq', 'ASC']] });
    expect(trail.map((entry) => entry.event)).toEqual(['INSPECTION_RECORDED', 'INSPECTION_CORRECTED']);
    expect(trail[1].changes).toMatchObject({
      result: { before: 'accept', after: 'indication_recorded' },
      techniqueRevisionId: { before: fixture.approved.id, after: fixture.superseded.id },
      performedOn: { before: '2026-07-15', after: '2026-05-20' },
    });

    const stale = await quality.patch(`/api/inspections/${created.id}`).send({ ...inspectionBody(fixture, inspector, { result: 'reject' }), version: created.version });
    expect(stale.status).toBe(409);
    expect((await Inspection.findByPk(created.id))!.result).toBe('indication_recorded');
    expect(await TrailEntry.count({ where: { recordType: 'inspection', recordId: String(created.id) } })).toBe(2);

    // A correction that breaks a rule is refused like a new record.
    const toDraft = await quality.patch(`/api/inspections/${created.id}`).send({ ...inspectionBody(fixture, inspector, { techniqueRevisionId: fixture.draft.id }), version: created.version + 1 });
    expect(toDraft.status).toBe(400);
    expect((await quality.agent.get('/api/inspections/999999999')).status).toBe(404);
  });

  it('when the inspector has left since, then a correction may keep them but not name another inactive person', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const leaver = await makeUser({ roles: ['technician'] });
    const created = (await quality.post('/api/inspections').send(inspectionBody(fixture, leaver))).body;
    await leaver.update({ active: false });
    const kept = await quality.patch(`/api/inspections/${created.id}`).send({ ...inspectionBody(fixture, leaver, { result: 'reject' }), version: created.version });
    expect(kept.status).toBe(200);
    expect(kept.body).toMatchObject({ result: 'reject', inspector: { id: leaver.id } });
    const other = await makeUser({ roles: ['technician'] });
    await other.update({ active: false });
    const swapped = await quality.patch(`/api/inspections/${created.id}`).send({ ...inspectionBody(fixture, other), version: kept.body.version });
    expect(swapped.status).toBe(400);
    expect(detailsOf(swapped.body)).toEqual([expect.objectContaining({ path: 'inspectorId' })]);
  });

  it('when a technician corrects a row another person recorded, then it is 403; their own row they may correct', async () => {
    const technicianUser = await makeUser({ roles: ['technician'] });
    const technician = await signIn(context.app, technicianUser);
    const quality = await signedInAs(context, ['quality_manager']);
    const theirs = (await quality.post('/api/inspections').send(inspectionBody(fixture, inspector))).body;
    const refused = await technician.patch(`/api/inspections/${theirs.id}`).send({ ...inspectionBody(fixture, inspector, { result: 'reject' }), version: theirs.version });
    expect(refused.status).toBe(403);
    expect((await Inspection.findByPk(theirs.id))!.result).toBe('accept');
    const own = (await technician.post('/api/inspections').send(inspectionBody(fixture, technicianUser))).body;
    const fixed = await technician.patch(`/api/inspections/${own.id}`).send({ ...inspectionBody(fixture, technicianUser, { result: 'reject' }), version: own.version });
    expect(fixed.status).toBe(200);
    expect(fixed.body.result).toBe('reject');
  });

  it('when the form asks for its options, then only approved or superseded revisions are offered, with active people and equipment', async () => {
    const technician = await signedInAs(context, ['technician']);
    const response = await technician.agent.get('/api/inspections/options');
    expect(response.status).toBe(200);
    const offered = response.body.revisions.filter((r: { techniqueId: number }) => r.techniqueId === fixture.technique.id);
    expect(offered.map((r: { revision: string }) => r.revision)).toEqual(['B', 'A']);
    expect(offered[0]).toMatchObject({ techniqueCode: fixture.technique.code, approvedOn: '2026-06-01' });
    expect(response.body.inspectors.some((p: { id: number }) => p.id === inspector.id)).toBe(true);
    expect(response.body.equipment.find((e: { id: number }) => e.id === fixture.probe.id)).toMatchObject({ kind: 'probe' });
  });
});
