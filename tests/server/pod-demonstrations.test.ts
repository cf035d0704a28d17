import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { PodDemonstration, Signature, TrailEntry, type User } from '../../server/models';
import { createTestContext, databaseName, makeUser, rootSql, signedInAs, TEST_PASSWORD, type TestContext } from '../helpers/test-app';
import { makeInspectionFixture, type InspectionFixture } from '../helpers/inspections';
import { contentHash } from '../../server/lib/content-hash';
import { analyseHitMiss } from '../../shared/domain/pod/hit-miss';

let context: TestContext;
let fixture: InspectionFixture;
let inspector: User;

beforeAll(async () => {
  context = createTestContext();
  inspector = await makeUser({ roles: ['technician'] });
  fixture = await makeInspectionFixture(inspector);
});
afterAll(() => context.close());

// 24 flaws from 0.2 to 2.5 mm; hits and misses overlap between 0.5 and 1.1 mm.
const SIZES = [0.2, 0.3, 0.4, 0.5, 0.55, 0.6, 0.65, 0.7, 0.75, 0.8, 0.85, 0.9, 0.95, 1.0, 1.05, 1.1, 1.2, 1.3, 1.5, 1.7, 1.9, 2.1, 2.3, 2.5];
const HITS = [0, 0, 0, 1, 0, 0, 1, 0, 1, 0, 1, 1, 0, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1];

function body(overrides: Record<string, unknown> = {}) {
  return {
    techniqueRevisionId: fixture.approved.id,
    title: 'Surface cracks in bores, eddy current pencil probe',
    model: 'hit-miss',
    sizeDimension: 'length',
    specimens: SIZES.map((sizeMm, i) => ({ specimenId: `S-${Math.floor(i / 6) + 1}`, flawId: `F-${i + 1}`, sizeMm, flawType: 'EDM notch' })),
    inspections: [
      {
        inspectorId: inspector.id,
        performedOn: '2026-10-01',
        equipmentIds: [fixture.instrument.id, fixture.probe.id],
        results: SIZES.map((_, i) => ({ flawId: `F-${i + 1}`, hit: HITS[i] === 1 })),
      },
    ],
    ...overrides,
  };
}

async function recordAndAnalyse(level3: Awaited<ReturnType<typeof signedInAs>>) {
  const created = await level3.post('/api/pod-demonstrations').send(body());
  expect(created.status).toBe(201);
  const analysed = await level3.post(`/api/pod-demonstrations/${created.body.id}/analysis`).send({ version: created.body.version });
  expect(analysed.status).toBe(200);
  return analysed.body;
}

describe('capability demonstrations', () => {
  it('when signed out, then reading and recording are 401', async () => {
    expect((await request(context.app).get('/api/pod-demonstrations')).status).toBe(401);
    expect((await request(context.app).post('/api/pod-demonstrations').send(body())).status).toBe(401);
  });

  it('when an auditor records a demonstration, then it is 403; reading is allowed', async () => {
    const auditor = await signedInAs(context, ['auditor']);
    expect((await auditor.post('/api/pod-demonstrations').send(body())).status).toBe(403);
    expect((await auditor.agent.get('/api/pod-demonstrations')).status).toBe(200);
  });

  it('when the body is not valid, then it is 400 naming the field and nothing is stored', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const before = await PodDemonstration.count();
    const badResult = body();
    (badResult.inspections as { results: { flawId: string }[] }[])[0].results[0].flawId = 'F-999';
    const response = await level3.post('/api/pod-demonstrations').send(badResult);
    expect(response.status).toBe(400);
    expect(response.body.error.details).toContainEqual(expect.objectContaining({ path: 'inspections.0.results.0.flawId', message: 'no specimen has this flaw id' }));
    const unknownEquipment = await level3.post('/api/pod-demonstrations').send(body({ inspections: [{ ...body().inspections[0], equipmentIds: [99_999_999] }] }));
    expect(unknownEquipment.status).toBe(400);
    expect((await level3.post('/api/pod-demonstrations').send(body({ state: 'accepted' }))).status).toBe(400);
    expect(await PodDemonstration.count()).toBe(before);
  });

  it('when a Level 3 records and analyses, then the analysis is stored with the engine version and matches the engine, on the trail', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const analysed = await recordAndAnalyse(level3);
    expect(analysed).toMatchObject({ state: 'draft', engineVersion: 1, analysis: { ok: true, model: 'hit-miss', n: 24 } });
    const direct = analyseHitMiss(SIZES.map((sizeMm, i) => ({ sizeMm, hit: HITS[i] === 1 })));
    expect(direct.ok && analysed.analysis.a9095Mm).toBeCloseTo(direct.ok ? direct.a9095Mm! : NaN, 10);
    const trail = await TrailEntry.findAll({ where: { recordType: 'pod_demonstration', recordId: String(analysed.id) }, order: [['seq', 'ASC']] });
    expect(trail.map((e) => e.event)).toEqual(['POD_DEMONSTRATION_RECORDED', 'POD_ANALYSED']);
  });

  it('when accepted with a wrong password, then it is 401, nothing changes and the refusal is on the trail', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const analysed = await recordAndAnalyse(level3);
    const response = await level3.post(`/api/pod-demonstrations/${analysed.id}/acceptance`).send({ version: analysed.version, password: 'not it' });
    expect(response.status).toBe(401);
    expect((await PodDemonstration.findByPk(analysed.id))!.state).toBe('draft');
    const events = (await TrailEntry.findAll({ where: { recordType: 'pod_demonstration', recordId: String(analysed.id) } })).map((e) => e.event);
    expect(events).toContain('SIGNATURE_REFUSED');
  });

  it('when a Level 3 accepts, then the signature binds the data and the analysis, the record is immutable and a later one supersedes it', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const first = await recordAndAnalyse(level3);
    const accepted = await level3.post(`/api/pod-demonstrations/${first.id}/acceptance`).send({ version: first.version, password: TEST_PASSWORD });
    expect(accepted.status).toBe(200);
    expect(accepted.body).toMatchObject({ state: 'accepted', acceptedById: level3.user.id, signature: { printedName: level3.user.displayName, role: 'level3' } });

    const row = (await PodDemonstration.findByPk(first.id))!;
    const signature = (await Signature.findByPk(row.signatureId!))!;
    expect(signature).toMatchObject({ recordType: 'demonstration', recordId: first.id, event: 'ACCEPT' });
    // The hash recomputed from the stored data and analysis equals the signed one.
    expect(
      contentHash({
        demonstrationId: row.id,
        techniqueRevisionId: row.techniqueRevisionId,
        title: row.title,
        model: row.model,
        sizeDimension: row.sizeDimension,
        data: row.data,
        analysis: row.analysis,
        engineVersion: row.engineVersion,
        meaning: signature.meaning,
      }),
    ).toBe(signature.contentHash);

    // Immutable: the API refuses a correction or a new analysis (422) ...
    const patch = await level3.patch(`/api/pod-demonstrations/${first.id}`).send({ ...body(), version: accepted.body.version });
    expect(patch.status).toBe(422);
    expect((await level3.post(`/api/pod-demonstrations/${first.id}/analysis`).send({ version: accepted.body.version })).status).toBe(422);
    // ... and the database refuses a direct change.
    expect(() => rootSql(`UPDATE \`${databaseName()}\`.pod_demonstrations SET data = '{}' WHERE id = ${first.id}`)).toThrow(/cannot be changed/);

    // A second accepted demonstration of the same revision and dimension supersedes the first.
    const second = await recordAndAnalyse(level3);
    const acceptedSecond = await level3.post(`/api/pod-demonstrations/${second.id}/acceptance`).send({ version: second.version, password: TEST_PASSWORD });
    expect(acceptedSecond.status).toBe(200);
    // The technique's checklist now judges each expected flaw's length by the accepted demonstration.
    const checklist = await level3.agent.get(`/api/techniques/${fixture.technique.id}/checklist?revision=B`);
    expect(checklist.status).toBe(200);
    const podResults = checklist.body.output.results.filter((r: { rule: string }) => r.rule === 'demonstrated-capability');
    expect(podResults.length).toBeGreaterThan(0);
    for (const result of podResults) expect(result.values).toMatchObject({ dimension: 'length', demonstrationId: second.id, a9095Mm: acceptedSecond.body.analysis.a9095Mm });
    expect(await PodDemonstration.findByPk(first.id)).toMatchObject({ state: 'superseded', supersededById: second.id });
    const trail = await TrailEntry.findAll({ where: { recordType: 'pod_demonstration', recordId: String(first.id) }, order: [['seq', 'ASC']] });
    expect(trail.map((e) => e.event)).toEqual(['POD_DEMONSTRATION_RECORDED', 'POD_ANALYSED', 'POD_DEMONSTRATION_ACCEPTED', 'POD_DEMONSTRATION_SUPERSEDED']);
  });

  it('when a draft has no analysis or a stale version, then acceptance is 422 or 409', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const created = await level3.post('/api/pod-demonstrations').send(body());
    expect((await level3.post(`/api/pod-demonstrations/${created.body.id}/acceptance`).send({ version: created.body.version, password: TEST_PASSWORD })).status).toBe(422);
    expect((await level3.post(`/api/pod-demonstrations/${created.body.id}/analysis`).send({ version: created.body.version + 5 })).status).toBe(409);
  });

  it('when the data cannot give a curve, then the refusal is stored with its reason and acceptance is 422', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const separated = body();
    (separated.inspections[0] as { results: { flawId: string; hit: boolean }[] }).results = SIZES.map((s, i) => ({ flawId: `F-${i + 1}`, hit: s > 0.9 }));
    const created = await level3.post('/api/pod-demonstrations').send(separated);
    const analysed = await level3.post(`/api/pod-demonstrations/${created.body.id}/analysis`).send({ version: created.body.version });
    expect(analysed.body.analysis).toMatchObject({ ok: false, code: 'complete_separation' });
    expect((await level3.post(`/api/pod-demonstrations/${created.body.id}/acceptance`).send({ version: analysed.body.version, password: TEST_PASSWORD })).status).toBe(422);
  });

  it('when a CSV of calls is previewed, then it answers specimens, inspections and noise with per-row errors and writes nothing', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const before = await PodDemonstration.count();
    const csv = [
      'Specimen ID;Flaw ID;Size mm;Flaw type;Inspector e-mail;Date;Signal;Probe serial;Flaw free',
      `S-1;F-1;0.5;EDM notch;${inspector.email};2026-10-01;1.2;${fixture.probe.serialNumber};`,
      `S-1;F-2;1.0;EDM notch;${inspector.email};2026-10-01;2.5;${fixture.probe.serialNumber};`,
      `;;;;${inspector.email};2026-10-01;0.1;;yes`,
      `S-2;F-3;-1;EDM notch;nobody@example.invalid;2026-10-01;3;${fixture.instrument.serialNumber};`,
    ].join('\n');
    const response = await level3.post('/api/pod-demonstrations/import/preview').attach('file', Buffer.from(csv), { filename: 'calls.csv', contentType: 'text/csv' });
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ model: 'signal-response', noise: [0.1], valid: false });
    expect(response.body.specimens.map((s: { flawId: string }) => s.flawId)).toEqual(['F-1', 'F-2']);
    expect(response.body.inspections).toEqual([
      { inspectorId: inspector.id, performedOn: '2026-10-01', equipmentIds: [fixture.probe.id], results: [{ flawId: 'F-1', signal: 1.2 }, { flawId: 'F-2', signal: 2.5 }] },
    ]);
    expect(response.body.errors).toEqual(
      expect.arrayContaining([
        { row: 5, field: 'size mm', message: 'must be a number greater than zero' },
        { row: 5, field: 'inspector e-mail', message: 'no person has this e-mail address' },
        { row: 5, field: 'probe serial', message: expect.stringMatching(/not a probe/) },
      ]),
    );
    expect(await PodDemonstration.count()).toBe(before);
    const technician = await signedInAs(context, ['technician']);
    expect((await technician.post('/api/pod-demonstrations/import/preview').attach('file', Buffer.from(csv), { filename: 'calls.csv', contentType: 'text/csv' })).status).toBe(403);
  });
});
