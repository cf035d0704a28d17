// Stored checklist runs and extent runs keep the engine version they were made with,
// say so in words, and a run made again lists what changed, in words, over HTTP
// against MariaDB.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import { ChecklistRun, ExtentRun } from '../../server/models';
import { createIsolatedDatabase, createTestContext, signedInAs, type TestContext } from '../helpers/test-app';
import { expectOk, inDays, makeCast, send, today } from '../helpers/workflow';
import { DEMO_TECHNIQUES } from '../../shared/domain/demo-techniques';
import { CHECKLIST_ENGINE_VERSION, type Technique } from '../../shared/domain/checklist';
import { dayText } from '../../shared/domain/checklist/run-history';

let context: TestContext;
beforeAll(async () => {
  // An extent run scans every approved technique: keep other files' techniques out of it.
  context = createTestContext({ DATABASE_URL: await createIsolatedDatabase('runversion') });
});
afterAll(async () => {
  await context?.close();
});

/** An engine version other than the current one, standing for runs stored before the rules changed. */
const OLDER_ENGINE: string = (CHECKLIST_ENGINE_VERSION as string) === '1.0' ? '0.9' : '1.0';

describe('engine version on stored runs', () => {
  it('when a checklist run is stored, then it keeps the engine version, says so in words, and a re-run lists the results that changed', async () => {
    const cast = await makeCast(context);
    const level3 = await signedInAs(context, ['level3']);
    // Another Level 3 approves: nobody approves their own revision.
    const approver = await signedInAs(context, ['level3']);
    // TAC-ET-031 fails its edge-effect check (an unguided scan near an edge).
    const technique = { ...structuredClone(DEMO_TECHNIQUES.find((t) => t.code === 'TAC-ET-031')!), code: `LAP-${randomBytes(2).toString('hex').toUpperCase()}` } as Technique;
    const created = await expectOk(await level3.post('/api/techniques').send({ technique }), 201);
    await expectOk(await approver.post(`/api/techniques/${created.id}/revisions/${technique.revision}/approve`).send({ version: created.revisions[0].version }));
    const audit = await expectOk(
      await cast.auditor.post('/api/audits').send({
        title: 'Lap joint techniques',
        criteria: 'Company ET procedure',
        areaId: cast.areaId,
        leadAuditorId: cast.auditor.user.id,
        plannedStart: today(),
        plannedEnd: inDays(10),
        techniques: [{ techniqueId: created.id }],
      }),
      201,
    );
    await expectOk(await send(cast.auditor, 'audits', audit.id, { type: 'START_FIELDWORK' }));

    const first = await expectOk(await cast.auditor.post(`/api/audits/${audit.id}/checklist-runs`).send({ techniqueId: created.id }), 201);
    expect(first.engineVersion).toBe(CHECKLIST_ENGINE_VERSION);
    expect(first.engineNote).toBe(`Checked with engine ${CHECKLIST_ENGINE_VERSION} on ${dayText(first.runAt)}, the current engine.`);
    expect(first.changes).toBeNull();
    expect((await ChecklistRun.findByPk(first.id))!.engineVersion).toBe(CHECKLIST_ENGINE_VERSION);

    // The first run as an older engine would have stored it: made with another version, and its edge-effect check passing.
    const stored = (await ChecklistRun.findByPk(first.id))!;
    const edgeIndex = first.output.results.findIndex((result: { rule: string; status: string }) => result.rule === 'edge-effect' && result.status === 'fail');
    expect(edgeIndex).toBeGreaterThanOrEqual(0);
    const olderOutput = structuredClone(first.output);
    olderOutput.results[edgeIndex].status = 'pass';
    olderOutput.verdict = 'conforms';
    await stored.update({ engineVersion: OLDER_ENGINE, output: olderOutput, verdict: 'conforms' });

    const second = await expectOk(await cast.auditor.post(`/api/audits/${audit.id}/checklist-runs`).send({ techniqueId: created.id }), 201);
    expect(second.changes).toMatchObject({ previousRunId: first.id, previousEngineVersion: OLDER_ENGINE });
    expect(second.changes.lines).toContain('Verdict: conforms → does not conform');
    expect(second.changes.lines).toContain('Edge effect, coil 1: pass → fail');
    // In words: no rule ids in the lines.
    for (const line of second.changes.lines) expect(line).not.toMatch(/edge-effect|not_applicable/);

    const detail = await expectOk(await cast.auditor.agent.get(`/api/audits/${audit.id}`));
    const older = detail.checklistRuns.find((run: { id: number }) => run.id === first.id);
    expect(older.engineVersion).toBe(OLDER_ENGINE);
    expect(older.engineNote).toBe(
      `Checked with engine ${OLDER_ENGINE} on ${dayText(first.runAt)}; the current engine is ${CHECKLIST_ENGINE_VERSION}. Run it again to see the verdicts of the current engine.`,
    );
    const newer = detail.checklistRuns.find((run: { id: number }) => run.id === second.id);
    expect(newer.changes.lines).toEqual(second.changes.lines);

    // An extent run from a finding on the edge-effect failure keeps its engine version too, and a second run lists what changed.
    const resultIndex = second.output.results.findIndex((result: { rule: string; status: string }) => result.rule === 'edge-effect' && result.status === 'fail');
    const finding = await expectOk(await cast.auditor.post(`/api/audits/${audit.id}/findings`).send({ checklistRunId: second.id, resultIndex }), 201);
    await expectOk(await send(cast.auditor, 'findings', finding.id, { type: 'SUBMIT' }));
    await expectOk(await send(cast.quality, 'findings', finding.id, { type: 'CLASSIFY', class: 'minor' }));
    const extent1 = await expectOk(await cast.quality.post(`/api/findings/${finding.id}/extent-runs`), 201);
    expect(extent1.engineVersion).toBe(CHECKLIST_ENGINE_VERSION);
    expect(extent1.engineNote).toMatch(/the current engine\.$/);
    expect(extent1.changes).toBeNull();

    const storedExtent = (await ExtentRun.findByPk(extent1.id))!;
    const olderList = structuredClone(storedExtent.techniques).map((entry) => (entry.techniqueId === created.id ? { ...entry, failures: [] } : entry));
    await storedExtent.update({ engineVersion: OLDER_ENGINE, techniques: olderList });
    const extent2 = await expectOk(await cast.quality.post(`/api/findings/${finding.id}/extent-runs`), 201);
    expect(extent2.changes).toMatchObject({ previousRunId: extent1.id, previousEngineVersion: OLDER_ENGINE });
    expect(extent2.changes.lines).toEqual([`${technique.code} rev ${technique.revision}: now fails Edge effect`]);
    const family = await expectOk(await cast.quality.agent.get(`/api/findings/${finding.id}/extent`));
    expect(family.latestRun.id).toBe(extent2.id);
    expect(family.latestRun.changes.lines).toEqual(extent2.changes.lines);
  });
});
