// Extent of condition and impact on past inspections, over HTTP against MariaDB:
// the extent run compared with the engine's own per-technique output, linked
// findings, the impact worksheet by revision, date and equipment, the
// containment guard on undecided rows, and the trail entries of each step.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import { ContainmentDecision, Equipment, ExtentRun, Finding, Inspection, TechniqueRevision, TrailEntry } from '../../server/models';
import { createIsolatedDatabase, createTestContext, signedInAs, type SignedIn, type TestContext } from '../helpers/test-app';
import { expectOk, inDays, makeCast, send, today, type Cast } from '../helpers/workflow';
import { binary, pdfPages } from '../helpers/pdf';
import { contentHash } from '../../server/lib/content-hash';
import { DEMO_TECHNIQUES } from '../../shared/domain/demo-techniques';
import { CHECKLIST_ENGINE_VERSION, DEFAULT_POLICY, evaluateTechnique, type Technique } from '../../shared/domain/checklist';

let context: TestContext;
beforeAll(async () => {
  // An extent run scans every approved technique: on the shared database it would meet every other file's techniques.
  context = createTestContext({ DATABASE_URL: await createIsolatedDatabase('extent') });
});
afterAll(async () => {
  await context?.close();
});

const demo = (code: string) => structuredClone(DEMO_TECHNIQUES.find((technique) => technique.code === code)!) as Technique;

/**
 * The techniques of the register in these tests: the demo techniques (TAC-ET-023's bobbin coil misses
 * circumferential cracks) and variants of them that fail or pass the same rule in different ways.
 */
function registerTechniques(): Technique[] {
  const tag = randomBytes(2).toString('hex').toUpperCase();
  const bobbinCopy = { ...demo('TAC-ET-023'), code: `TUBE-${tag}`, title: 'Condenser tubes, bobbin coil' };
  // Encircling and bobbin coils induce current around the part only, so a circumferential crack lies along it and is
  // missed, and a lamination (parallel to the surface) is missed by every coil: a flaw is found when the current crosses it
  // [pub: the usual ET handbook statement of orientation sensitivity; common practice, no single source for the coil-type split].
  // An encircling coil on a bar with a circumferential crack: same rule, same orientation, other coil type.
  const bar = demo('TAC-ET-017');
  const barCircumferential = {
    ...bar,
    code: `BARC-${tag}`,
    flaws: [bar.flaws[0], { id: 'transverse-crack', orientation: 'circumferential', location: 'surface', depthMm: 0.3, lengthMm: 5 }],
    reference: { ...bar.reference, notches: [...bar.reference.notches, { orientation: 'circumferential', depthMm: 0.3, lengthMm: 5 }] },
  } as Technique;
  // A lamination lies parallel to every coil's current: same rule, another orientation.
  const barLaminar = {
    ...bar,
    code: `BARL-${tag}`,
    flaws: [bar.flaws[0], { id: 'lamination', orientation: 'laminar', location: 'subsurface', depthMm: 2, lengthMm: 10, metalAboveMm: 1 }],
  } as Technique;
  const others = ['TAC-ET-004', 'TAC-ET-011', 'TAC-ET-017', 'TAC-ET-031'].map(demo);
  return [demo('TAC-ET-023'), bobbinCopy, barCircumferential, barLaminar, ...others];
}

/** Written by one Level 3, approved by another (nobody approves their own revision). */
async function createApproved(level3: SignedIn, approver: SignedIn, technique: Technique) {
  const created = await expectOk(await level3.post('/api/techniques').send({ technique }), 201);
  await expectOk(await approver.post(`/api/techniques/${created.id}/revisions/${technique.revision}/approve`).send({ version: created.revisions[0].version }));
  return created.id as number;
}

interface World {
  cast: Cast;
  level3: SignedIn;
  techniques: Technique[];
  ids: Map<string, number>;
  finding: Record<string, any>;
}

let world: World | undefined;

/** Once per file: the register, an audit of TAC-ET-023 and a major finding raised from its orientation failure, in containment. */
async function setUp(): Promise<World> {
  if (world) return world;
  const cast = await makeCast(context);
  const level3 = await signedInAs(context, ['level3']);
  const approver = await signedInAs(context, ['level3']);
  const techniques = registerTechniques();
  const ids = new Map<string, number>();
  for (const technique of techniques) ids.set(technique.code, await createApproved(level3, approver, technique));
  // A draft that fails the same rule is not in force: the run leaves it out.
  await expectOk(await level3.post('/api/techniques').send({ technique: { ...demo('TAC-ET-023'), code: `DRAFT-${randomBytes(2).toString('hex')}` } }), 201);

  const audit = await expectOk(
    await cast.auditor.post('/api/audits').send({
      title: 'Receiving inspection techniques',
      criteria: 'Company ET procedure',
      areaId: cast.areaId,
      leadAuditorId: cast.auditor.user.id,
      plannedStart: today(),
      plannedEnd: inDays(10),
      techniques: [{ techniqueId: ids.get('TAC-ET-023') }],
    }),
    201,
  );
  await expectOk(await send(cast.auditor, 'audits', audit.id, { type: 'START_FIELDWORK' }));
  const run = await expectOk(await cast.auditor.post(`/api/audits/${audit.id}/checklist-runs`).send({ techniqueId: ids.get('TAC-ET-023') }), 201);
  const resultIndex = run.output.results.findIndex((result: { rule: string; status: string }) => result.rule === 'orientation-coverage' && result.status === 'fail');
  const finding = await expectOk(await cast.auditor.post(`/api/audits/${audit.id}/findings`).send({ checklistRunId: run.id, resultIndex }), 201);
  await expectOk(await send(cast.auditor, 'findings', finding.id, { type: 'SUBMIT' }));
  await expectOk(await send(cast.quality, 'findings', finding.id, { type: 'CLASSIFY', class: 'major' }));
  world = { cast, level3, techniques, ids, finding: { ...finding, auditId: audit.id } };
  return world;
}

async function trailOf(findingId: number) {
  return TrailEntry.findAll({ where: { recordType: 'finding', recordId: String(findingId) }, order: [['seq', 'ASC']] });
}

describe('extent of condition', () => {
  it('when the quality manager runs it, then it lists exactly the approved techniques whose own checklist fails the rule, with the orientation and coil-type subsets', async () => {
    const { cast, techniques, finding } = await setUp();
    const response = await expectOk(await cast.quality.post(`/api/findings/${finding.id}/extent-runs`), 201);

    // Computed independently: the engine's output for each approved technique, under the default policy (this database sets none).
    const failing = techniques.filter((technique) =>
      evaluateTechnique(technique, { policy: DEFAULT_POLICY }).results.some((result) => result.rule === 'orientation-coverage' && result.status === 'fail'),
    );
    const orientationOf = (technique: Technique, flawId: string | undefined) => technique.flaws.find((flaw) => flaw.id === flawId)?.orientation;
    const failuresOf = (technique: Technique) =>
      evaluateTechnique(technique, { policy: DEFAULT_POLICY }).results.filter((result) => result.rule === 'orientation-coverage' && result.status === 'fail');
    const sameOrientation = failing.filter((technique) => failuresOf(technique).some((result) => orientationOf(technique, result.flaw) === 'circumferential'));
    const sameCoilType = failing.filter((technique) => failuresOf(technique).some((result) => result.coil !== undefined && technique.coils[result.coil].type === 'bobbin'));

    const codes = (list: Array<{ code: string }>) => list.map((item) => item.code).sort();
    expect(response.rule).toBe('orientation-coverage');
    expect(response.flawOrientation).toBe('circumferential');
    expect(response.coilType).toBe('bobbin');
    expect(response.evaluatedCount).toBe(techniques.length);
    expect(codes(response.failing)).toEqual(codes(failing));
    expect(codes(response.failing.filter((item: { sameOrientation: boolean }) => item.sameOrientation))).toEqual(codes(sameOrientation));
    expect(codes(response.failing.filter((item: { sameCoilType: boolean }) => item.sameCoilType))).toEqual(codes(sameCoilType));
    // The three variants differ where they should: a bobbin copy (both), an encircling bar (orientation only), a lamination (neither).
    expect(sameOrientation.length).toBe(3);
    expect(sameCoilType.length).toBe(2);
    expect(failing.length).toBe(4);
    expect(response.failing[0]).toMatchObject({ code: 'TAC-ET-023', isFindingTechnique: true });
    const bar = response.failing.find((item: { code: string }) => item.code.startsWith('BARC-'));
    expect(bar.failures[0]).toMatchObject({ flaw: 'transverse-crack', flawOrientation: 'circumferential', coilType: 'encircling' });
    expect(bar.failures[0].message.length).toBeGreaterThan(10);

    const stored = await ExtentRun.findByPk(response.id);
    expect(stored).toMatchObject({ findingId: finding.id, runById: cast.quality.user.id, engineVersion: CHECKLIST_ENGINE_VERSION, policyVersion: 0 });
    expect(stored!.techniques).toHaveLength(techniques.length);
    const entry = (await trailOf(finding.id)).find((item) => item.event === 'EXTENT_RUN')!;
    expect(entry.userId).toBe(cast.quality.user.id);
    expect(entry.changes).toMatchObject({ runId: response.id, rule: 'orientation-coverage', engineVersion: CHECKLIST_ENGINE_VERSION, policyVersion: 0, evaluated: techniques.length });
    expect((entry.changes as { failing: string[] }).failing).toHaveLength(4);
    expect((entry.changes as { listSha256: string }).listSha256).toBe(contentHash(stored!.techniques));
  });

  it('when someone other than a quality manager runs it, then 403 and no run is recorded', async () => {
    const { cast, finding } = await setUp();
    const before = await ExtentRun.count();
    for (const session of [cast.auditor, cast.owner, cast.accountable]) {
      expect((await session.post(`/api/findings/${finding.id}/extent-runs`)).status).toBe(403);
    }
    expect(await ExtentRun.count()).toBe(before);
  });

  it('when the finding was raised by hand, then the run is refused with the reason (422)', async () => {
    const { cast, finding } = await setUp();
    const manual = await expectOk(
      await cast.auditor.post(`/api/audits/${finding.auditId}/findings`).send({
        title: 'Records kept in pencil', rule: 'Procedure §4.2', requirement: 'Records in ink', objectiveEvidence: 'Two sheets in pencil',
      }),
      201,
    );
    const response = await cast.quality.post(`/api/findings/${manual.id}/extent-runs`);
    expect(response.status).toBe(422);
    expect(response.body.error.message).toMatch(/raised by hand/);
    const family = await expectOk(await cast.quality.agent.get(`/api/findings/${manual.id}/extent`));
    expect(family).toMatchObject({ extentPossible: false, latestRun: null });
  });

  it('when techniques are chosen from the run, then one linked finding each is raised in review with the class proposed, and the family shows them', async () => {
    const { cast, finding } = await setUp();
    const run = await expectOk(await cast.quality.post(`/api/findings/${finding.id}/extent-runs`), 201);
    const others = run.failing.filter((item: { isFindingTechnique: boolean }) => !item.isFindingTechnique);
    const own = run.failing.find((item: { isFindingTechnique: boolean }) => item.isFindingTechnique);

    const refusedOwn = await cast.quality.post(`/api/findings/${finding.id}/extent-findings`).send({ runId: run.id, revisionIds: [own.revisionId] });
    expect(refusedOwn.status).toBe(400);
    expect(refusedOwn.body.error.details[0].path).toBe('revisionIds.0');
    expect((await cast.auditor.post(`/api/findings/${finding.id}/extent-findings`).send({ runId: run.id, revisionIds: [others[0].revisionId] })).status).toBe(403);

    const chosen = others.slice(0, 2);
    const raised = await expectOk(
      await cast.quality.post(`/api/findings/${finding.id}/extent-findings`).send({ runId: run.id, revisionIds: chosen.map((item: { revisionId: number }) => item.revisionId) }),
      201,
    );
    expect(raised.created).toHaveLength(2);
    for (const [index, created] of raised.created.entries()) {
      const row = await Finding.findByPk(created.id);
      expect(row).toMatchObject({ extentOfId: finding.id, proposedClass: 'major', state: 'in_review', techniqueCode: chosen[index].code, authorId: cast.quality.user.id, auditId: null });
      expect(row!.objectiveEvidence).toContain(`Extent-of-condition run ${run.id}`);
      const [entry] = await trailOf(created.id);
      expect(entry).toMatchObject({ event: 'FINDING_RAISED' });
      expect(entry.changes).toMatchObject({ extentOf: finding.number, extentRunId: run.id, proposedClass: 'major', state: 'in_review' });
      // It goes on like any finding: the quality manager classifies it, starting from the class proposed.
      const view = (await cast.quality.agent.get(`/api/findings/${created.id}`)).body;
      expect(view).toMatchObject({ extentOfId: finding.id, proposedClass: 'major' });
      expect(view.allowedEvents).toContain('CLASSIFY');
    }
    expect((await trailOf(finding.id)).some((entry) => entry.event === 'EXTENT_FINDINGS_RAISED')).toBe(true);

    const again = await cast.quality.post(`/api/findings/${finding.id}/extent-findings`).send({ runId: run.id, revisionIds: [chosen[0].revisionId] });
    expect(again.status).toBe(409);
    expect(again.body.error.message).toContain(raised.created[0].number);

    const family = await expectOk(await cast.quality.agent.get(`/api/findings/${finding.id}/extent`));
    expect(family.members.map((member: { number: string }) => member.number)).toEqual(raised.created.map((created: { number: string }) => created.number));
    expect(family.members[0]).toMatchObject({ state: 'in_review', proposedClass: 'major', class: null });
    expect(family.latestRun.linked).toHaveLength(2);
    const child = await expectOk(await cast.quality.agent.get(`/api/findings/${raised.created[0].id}/extent`));
    expect(child.extentOf).toMatchObject({ id: finding.id, number: finding.number });
  });
});

describe('one open finding per failed check', () => {
  it('when a second audit of the same register technique raises the same failed check, then 409 names the open finding; a linked finding counts too', async () => {
    const { cast, finding, ids } = await setUp();
    const secondAudit = async (techniqueCode: string) => {
      const audit = await expectOk(
        await cast.auditor.post('/api/audits').send({
          title: `Second look at ${techniqueCode}`,
          criteria: 'Company ET procedure',
          areaId: cast.areaId,
          leadAuditorId: cast.auditor.user.id,
          plannedStart: today(),
          plannedEnd: inDays(10),
          techniques: [{ techniqueId: ids.get(techniqueCode) }],
        }),
        201,
      );
      await expectOk(await send(cast.auditor, 'audits', audit.id, { type: 'START_FIELDWORK' }));
      const run = await expectOk(await cast.auditor.post(`/api/audits/${audit.id}/checklist-runs`).send({ techniqueId: ids.get(techniqueCode) }), 201);
      const resultIndex = run.output.results.findIndex((result: { rule: string; status: string }) => result.rule === 'orientation-coverage' && result.status === 'fail');
      return cast.auditor.post(`/api/audits/${audit.id}/findings`).send({ checklistRunId: run.id, resultIndex });
    };
    const repeat = await secondAudit('TAC-ET-023');
    expect(repeat.status).toBe(409);
    expect(repeat.body.error).toMatchObject({ code: 'duplicate_finding', details: { findingId: finding.id, number: finding.number } });

    // A sister technique already has a finding linked from the extent of condition for this rule.
    const family = await expectOk(await cast.quality.agent.get(`/api/findings/${finding.id}/extent`));
    const linked = family.members[0] as { id: number; number: string; techniqueCode: string };
    const sister = await secondAudit(linked.techniqueCode);
    expect(sister.status).toBe(409);
    expect(sister.body.error.details).toMatchObject({ findingId: linked.id, number: linked.number });
  });
});

describe('impact on past inspections', () => {
  let probe: Equipment;
  let otherProbe: Equipment;
  let revisionA: TechniqueRevision;
  let revisionB: TechniqueRevision;
  const ids: Record<string, number> = {};

  /** Revision A approved 100 days ago, B (without the circumferential claim, so it passes) approved 20 days ago; inspections on both. */
  async function setUpInspections() {
    if (revisionB) return;
    const { level3, ids: techniqueIds, cast } = await setUp();
    const techniqueId = techniqueIds.get('TAC-ET-023')!;
    const started = await expectOk(await level3.post(`/api/techniques/${techniqueId}/revisions`).send({}), 201);
    const fixed = { ...demo('TAC-ET-023'), revision: 'B' };
    fixed.flaws = [fixed.flaws[0]];
    const draft = started.revisions.find((revision: { revision: string }) => revision.revision === 'B');
    const edited = await expectOk(await level3.patch(`/api/techniques/${techniqueId}/revisions/B`).send({ version: draft.version, technique: fixed }));
    await expectOk(await (await signedInAs(context, ['level3'])).post(`/api/techniques/${techniqueId}/revisions/B/approve`).send({ version: edited.revisions.find((r: { revision: string }) => r.revision === 'B').version }));
    revisionA = (await TechniqueRevision.findOne({ where: { techniqueId, revision: 'A' } }))!;
    revisionB = (await TechniqueRevision.findOne({ where: { techniqueId, revision: 'B' } }))!;
    await TechniqueRevision.update({ approvedAt: new Date(Date.now() - 100 * 86_400_000) }, { where: { id: revisionA.id }, silent: true });
    await TechniqueRevision.update({ approvedAt: new Date(Date.now() - 20 * 86_400_000) }, { where: { id: revisionB.id }, silent: true });

    probe = await Equipment.create({ kind: 'probe', description: 'Bobbin probe 15.5 mm', model: null, serialNumber: `BP-${randomBytes(3).toString('hex')}`, calibratedOn: inDays(-40), calibrationDueOn: inDays(325), conductivityIacs: null, material: null, notes: null });
    otherProbe = await Equipment.create({ kind: 'probe', description: 'Bobbin probe 15.5 mm', model: null, serialNumber: `BP-${randomBytes(3).toString('hex')}`, calibratedOn: inDays(-200), calibrationDueOn: inDays(165), conductivityIacs: null, material: null, notes: null });
    const inspection = (key: string, revision: TechniqueRevision, daysAgo: number, customer: string, partNumber: string, probeId: number) =>
      Inspection.create({
        techniqueRevisionId: revision.id, techniqueId: revision.techniqueId, performedOn: inDays(-daysAgo), partNumber, serialNumber: `SN-${key}`,
        workOrder: `WO-${key}`, customer, inspectorId: cast.technician.user.id, result: 'accept', instrumentId: null, probeId, referenceStandardId: null,
        notes: null, createdById: cast.technician.user.id,
      }).then((row) => (ids[key] = row.id));
    await inspection('a-before-approval', revisionA, 120, 'Harwick Condensers', 'HX-100', otherProbe.id);
    await inspection('a-early', revisionA, 90, 'Harwick Condensers', 'HX-100', otherProbe.id);
    await inspection('a-mid', revisionA, 50, 'Harwick Condensers', 'HX-200', probe.id);
    await inspection('a-late', revisionA, 30, 'Ølund Kraftværk', 'HX-100', probe.id);
    await inspection('b-1', revisionB, 10, 'Harwick Condensers', 'HX-100', probe.id);
  }

  it('when the finding is about revision A, then the worksheet lists A’s inspections since its approval (not B’s, not earlier), grouped by customer and part', async () => {
    await setUpInspections();
    const { cast, finding } = await setUp();
    const impact = await expectOk(await cast.quality.agent.get(`/api/findings/${finding.id}/impact`));
    expect(impact.revisions.map((revision: { revision: string }) => revision.revision)).toEqual(['A']);
    expect(impact.revisions[0].from).toBe(inDays(-100));
    const listed = impact.rows.map((row: { inspection: { id: number } }) => row.inspection.id).sort();
    expect(listed).toEqual([ids['a-early'], ids['a-mid'], ids['a-late']].sort());
    expect(impact.groups).toEqual([
      { customer: 'Harwick Condensers', partNumber: 'HX-100', count: 1, undecided: 1 },
      { customer: 'Harwick Condensers', partNumber: 'HX-200', count: 1, undecided: 1 },
      { customer: 'Ølund Kraftværk', partNumber: 'HX-100', count: 1, undecided: 1 },
    ]);
    expect(impact).toMatchObject({ total: 3, undecided: 3, blocksContainment: true, since: null });
  });

  it('when the quality manager chooses an earlier date, then the worksheet starts there; a stale version is 409; the trail keeps the change', async () => {
    await setUpInspections();
    const { cast, finding } = await setUp();
    const current = (await cast.quality.agent.get(`/api/findings/${finding.id}`)).body.version;
    expect((await cast.quality.patch(`/api/findings/${finding.id}/impact-scope`).send({ since: inDays(-130), version: current + 5 })).status).toBe(409);
    expect((await cast.auditor.patch(`/api/findings/${finding.id}/impact-scope`).send({ since: inDays(-130), version: current })).status).toBe(403);
    const wider = await expectOk(await cast.quality.patch(`/api/findings/${finding.id}/impact-scope`).send({ since: inDays(-130), version: current }));
    expect(wider.total).toBe(4);
    expect(wider.rows.map((row: { inspection: { id: number } }) => row.inspection.id)).toContain(ids['a-before-approval']);
    const entry = (await trailOf(finding.id)).find((item) => item.event === 'IMPACT_SCOPE_SET')!;
    expect(entry.changes).toMatchObject({ impactSince: { from: null, to: inDays(-130) } });
    const version = (await cast.quality.agent.get(`/api/findings/${finding.id}`)).body.version;
    const back = await expectOk(await cast.quality.patch(`/api/findings/${finding.id}/impact-scope`).send({ since: null, version }));
    expect(back.total).toBe(3);
  });

  it('when rows are undecided, then the major finding cannot leave containment; once each has a decision it can, and the trail has each decision', async () => {
    await setUpInspections();
    const { cast, finding } = await setUp();
    const detail = (await cast.quality.agent.get(`/api/findings/${finding.id}`)).body;
    expect(detail.state).toBe('containment');
    expect(detail.allowedEvents).not.toContain('RECORD_CONTAINMENT');
    const listed = (await cast.quality.agent.get('/api/findings').query({ state: 'containment', pageSize: 200 })).body.items.find((item: { id: number }) => item.id === finding.id);
    expect(listed.allowedEvents).not.toContain('RECORD_CONTAINMENT');
    const refused = await send(cast.quality, 'findings', finding.id, { type: 'RECORD_CONTAINMENT', description: 'Bundles quarantined' });
    expect(refused.status).toBe(422);
    expect(refused.body.error.message).toMatch(/^3 past inspection\(s\) .* no containment decision/);

    const home = (await cast.quality.agent.get('/api/home')).body.items.find((item: { recordType: string; id: number }) => item.recordType === 'finding' && item.id === finding.id);
    expect(home.todo).toMatch(/^Decide the 3 past inspection\(s\) in doubt/);

    const outside = await cast.quality.post(`/api/findings/${finding.id}/containment-decisions`).send({ inspectionIds: [ids['b-1']], decision: 'not_affected', reason: 'Revision B' });
    expect(outside.status).toBe(400);
    expect((await cast.auditor.post(`/api/findings/${finding.id}/containment-decisions`).send({ inspectionIds: [ids['a-mid']], decision: 'reinspect', reason: 'r' })).status).toBe(403);
    expect((await cast.quality.post(`/api/findings/${finding.id}/containment-decisions`).send({ inspectionIds: [ids['a-mid']], decision: 'reinspect', reason: ' ' })).status).toBe(400);

    const partly = await expectOk(
      await cast.quality.post(`/api/findings/${finding.id}/containment-decisions`).send({ inspectionIds: [ids['a-early'], ids['a-mid']], decision: 'reinspect', reason: 'Re-inspect with a rotating probe' }),
    );
    expect(partly).toMatchObject({ undecided: 1, blocksContainment: true });
    expect((await send(cast.quality, 'findings', finding.id, { type: 'RECORD_CONTAINMENT', description: 'Bundles quarantined' })).body.error.message).toMatch(/^1 past/);
    // A later decision replaces the earlier one; the trail keeps both.
    await expectOk(
      await cast.quality.post(`/api/findings/${finding.id}/containment-decisions`).send({ inspectionIds: [ids['a-early'], ids['a-late']], decision: 'recall_report', reason: 'Report issued to the customer is recalled' }),
    );
    const decided = await expectOk(await cast.quality.agent.get(`/api/findings/${finding.id}/impact`));
    expect(decided).toMatchObject({ undecided: 0, blocksContainment: false });
    expect(decided.rows.find((row: { inspection: { id: number } }) => row.inspection.id === ids['a-early']).decision).toMatchObject({ decision: 'recall_report', decidedBy: { id: cast.quality.user.id } });
    expect(await ContainmentDecision.count({ where: { findingId: finding.id } })).toBe(3);
    const decisions = (await trailOf(finding.id)).filter((entry) => entry.event === 'CONTAINMENT_DECIDED');
    expect(decisions).toHaveLength(2);
    expect(decisions[1].changes).toMatchObject({ decision: 'recall_report', replaced: [{ inspectionId: ids['a-early'], decision: 'reinspect' }] });

    const csv = await cast.quality.agent.get(`/api/findings/${finding.id}/impact.csv`);
    expect(csv.status).toBe(200);
    expect(csv.text).toContain('Decision');
    expect(csv.text).toContain('Ølund Kraftværk');
    expect(csv.text).toContain('Recall report');

    const allowed = (await cast.quality.agent.get(`/api/findings/${finding.id}`)).body.allowedEvents;
    expect(allowed).toContain('RECORD_CONTAINMENT');
    const listedAfter = (await cast.quality.agent.get('/api/findings').query({ state: 'containment', pageSize: 200 })).body.items.find((item: { id: number }) => item.id === finding.id);
    expect(listedAfter.allowedEvents).toContain('RECORD_CONTAINMENT');
    const contained = await expectOk(await send(cast.quality, 'findings', finding.id, { type: 'RECORD_CONTAINMENT', description: 'Bundles quarantined; reports recalled' }));
    expect(contained.state).toBe('action_open');
  });

  it('when a probe is found out of calibration, then the equipment view lists the inspections made with it since its last calibration, or since a chosen date', async () => {
    await setUpInspections();
    const { cast } = await setUp();
    const sinceCalibration = await expectOk(await cast.auditor.agent.get(`/api/equipment/${probe.id}/impact`));
    expect(sinceCalibration.from).toBe(inDays(-40));
    expect(sinceCalibration.rows.map((row: { inspection: { id: number } }) => row.inspection.id).sort()).toEqual([ids['a-late'], ids['b-1']].sort());
    expect(sinceCalibration.groups).toEqual([
      { customer: 'Harwick Condensers', partNumber: 'HX-100', count: 1, undecided: null },
      { customer: 'Ølund Kraftværk', partNumber: 'HX-100', count: 1, undecided: null },
    ]);
    const wider = await expectOk(await cast.auditor.agent.get(`/api/equipment/${probe.id}/impact?since=${inDays(-60)}`));
    expect(wider.total).toBe(3);
    expect(wider.basis).toContain(inDays(-60));
    const other = await expectOk(await cast.auditor.agent.get(`/api/equipment/${otherProbe.id}/impact`));
    expect(other.total).toBe(2);
    expect((await cast.auditor.agent.get(`/api/equipment/${probe.id}/impact?since=${inDays(5)}`)).status).toBe(400);
    expect((await cast.auditor.agent.get(`/api/equipment/${probe.id}/impact?since=yesterday`)).status).toBe(400);
    const csv = await cast.auditor.agent.get(`/api/equipment/${probe.id}/impact.csv`);
    expect(csv.status).toBe(200);
    expect(csv.text.split('\r\n').filter(Boolean)).toHaveLength(3);
  });
});

describe('the finding record', () => {
  it('when exported, then the JSON and the PDF carry the extent run, the linked findings and the containment worksheet', async () => {
    const { cast, finding } = await setUp();
    const exported = await expectOk(await cast.quality.agent.get(`/api/findings/${finding.id}/export.json`));
    const { extent, impact } = exported.content;
    expect(extent.latestRun.rule).toBe('orientation-coverage');
    expect(extent.members.length).toBeGreaterThanOrEqual(2);
    expect(impact.rows.length).toBe(impact.total);
    expect(impact.rows.every((row: { decision: unknown }) => row.decision !== null)).toBe(true);

    const pdf = await cast.quality.agent.get(`/api/findings/${finding.id}/record.pdf`).buffer(true).parse(binary);
    expect(pdf.status).toBe(200);
    const text = pdfPages(pdf.body as Buffer).join('\n');
    expect(text).toContain('Extent of condition');
    expect(text).toContain('Impact on past inspections');
    expect(text).toContain('Containment worksheet');
    expect(text).toContain('Ølund Kraftværk');
    expect(text).toContain('Recall report');
    expect(text).toContain(extent.members[0].number);
  });
});
