// Builders for the workflow API tests: a fresh cast of people per test, and
// shortcuts that drive records through their lifecycles via the real API.
import { createHash, randomBytes } from 'node:crypto';
import { expect } from 'vitest';
import { EvidenceFile, type User } from '../../server/models';
import { makeArea, makeUser, signIn, TEST_PASSWORD, type SignedIn, type TestContext } from './test-app';
import { DEMO_TECHNIQUES } from '../../shared/domain/demo-techniques';
import type { Role } from '../../shared/roles';

/** The invented heat-exchanger bobbin technique (the shared example, also a demo technique): its bobbin coil cannot see circumferential cracks. */
export const BOBBIN_TECHNIQUE = DEMO_TECHNIQUES.find((technique) => technique.code === 'TAC-ET-023')!;

export const today = () => new Date().toISOString().slice(0, 10);
export const inDays = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

export interface Cast {
  areaId: number;
  auditor: SignedIn;
  quality: SignedIn;
  accountable: SignedIn;
  owner: SignedIn;
  technician: SignedIn;
}

export async function person(context: TestContext, roles: Role[], areaId: number | null = null): Promise<SignedIn> {
  const user = await makeUser({ roles, areaId });
  return signIn(context.app, user);
}

export async function makeCast(context: TestContext): Promise<Cast> {
  const area = await makeArea();
  const [auditor, quality, accountable, owner, technician] = await Promise.all([
    person(context, ['auditor']),
    person(context, ['quality_manager']),
    person(context, ['accountable_manager']),
    person(context, ['level3'], area.id),
    person(context, ['technician'], area.id),
  ]);
  return { areaId: area.id, auditor, quality, accountable, owner, technician };
}

export type Kind = 'audits' | 'findings' | 'actions';

/** Sends an event with the record's current version unless one is given. */
export async function send(session: SignedIn, kind: Kind, id: number, body: Record<string, unknown>) {
  let version = body.version;
  if (version === undefined) version = (await session.agent.get(`/api/${kind}/${id}`)).body.version;
  return session.post(`/api/${kind}/${id}/events`).send({ ...body, version });
}

export async function expectOk(response: { status: number; body: unknown }, status = 200) {
  if (response.status !== status) throw new Error(`expected ${status}, got ${response.status}: ${JSON.stringify(response.body)}`);
  return response.body as Record<string, any>;
}

export async function planAudit(cast: Cast, lead: SignedIn = cast.auditor) {
  return expectOk(
    await lead.post('/api/audits').send({
      title: 'Heat-exchanger tube inspection audit',
      criteria: 'Company ET procedure and the customer specification for heat-exchanger tubes',
      areaId: cast.areaId,
      leadAuditorId: lead.user.id,
      plannedStart: today(),
      plannedEnd: inDays(14),
      techniques: [{ technique: BOBBIN_TECHNIQUE }],
    }),
    201,
  );
}

/** An audit in fieldwork with a checklist run on the bobbin technique, and the index of its orientation failure. */
export async function auditWithFailedRun(cast: Cast, lead: SignedIn = cast.auditor) {
  const audit = await planAudit(cast, lead);
  await expectOk(await send(lead, 'audits', audit.id, { type: 'START_FIELDWORK' }));
  const run = await expectOk(await lead.post(`/api/audits/${audit.id}/checklist-runs`).send({ techniqueCode: 'TAC-ET-023' }), 201);
  const resultIndex = run.output.results.findIndex(
    (result: { rule: string; status: string }) => result.rule === 'orientation-coverage' && result.status === 'fail',
  );
  expect(resultIndex).toBeGreaterThanOrEqual(0);
  return { audit, run, resultIndex };
}

export async function raiseFromRun(lead: SignedIn, auditId: number, runId: number, resultIndex: number) {
  return expectOk(await lead.post(`/api/audits/${auditId}/findings`).send({ checklistRunId: runId, resultIndex }), 201);
}

/** A finding written by hand (no checklist result behind it): any number of these may stand on one audit. */
export function raiseByHandBody(subject: string) {
  return {
    title: `${subject} at the tube bench`,
    rule: 'Company ET procedure §4.2',
    requirement: 'Probe caps are fitted between inspections',
    objectiveEvidence: `${subject}: probe left without its cap`,
  };
}

export async function raiseByHand(lead: SignedIn, auditId: number, subject: string) {
  return expectOk(await lead.post(`/api/audits/${auditId}/findings`).send(raiseByHandBody(subject)), 201);
}

/**
 * Stub evidence row: the metadata row an upload writes (current, stored), inserted
 * directly so SUBMIT has its evidenceCount fact without file storage. Uploading
 * itself is tested by the evidence tests and by the browser journey.
 */
export async function stubEvidenceRow(actionId: number, uploader: User) {
  const bytes = `calibration record ${randomBytes(4).toString('hex')}`;
  const sha256 = createHash('sha256').update(bytes).digest('hex');
  return EvidenceFile.create({
    recordType: 'action',
    recordId: actionId,
    originalName: 'probe-check.txt',
    mediaType: 'text/plain',
    sizeBytes: bytes.length,
    sha256,
    storageKey: sha256,
    tempName: null,
    storedAt: new Date(),
    uploadedById: uploader.id,
  });
}

/** Drives a new finding (major) to action_open with an action owned by `owner`; returns ids. */
export async function findingWithAction(cast: Cast, owner: SignedIn = cast.owner, lead: SignedIn = cast.auditor) {
  const { audit, run, resultIndex } = await auditWithFailedRun(cast, lead);
  const finding = await raiseFromRun(lead, audit.id, run.id, resultIndex);
  await expectOk(await send(lead, 'findings', finding.id, { type: 'SUBMIT' }));
  await expectOk(await send(cast.quality, 'findings', finding.id, { type: 'CLASSIFY', class: 'major' }));
  await expectOk(await send(cast.quality, 'findings', finding.id, { type: 'RECORD_CONTAINMENT', description: 'Tubes re-inspected with a rotating probe' }));
  const action = await expectOk(await cast.quality.post('/api/actions').send({ findingId: finding.id, ownerId: owner.user.id, dueDate: inDays(30) }), 201);
  return { audit, finding, action };
}

/** Drives a finding to awaiting_signoff (action verified by the quality manager, effectiveness confirmed by the auditor). */
export async function findingAwaitingSignoff(cast: Cast, owner: SignedIn = cast.owner, lead: SignedIn = cast.auditor) {
  const { audit, finding, action } = await findingWithAction(cast, owner, lead);
  await expectOk(await send(owner, 'actions', action.id, { type: 'START' }));
  await expectOk(
    await send(owner, 'actions', action.id, {
      type: 'SUBMIT_PLAN',
      method: 'five_whys',
      rootCause: 'The technique was written for axial cracks only',
      plan: [{ description: 'Add a rotating-probe pass', dueDate: inDays(20) }],
    }),
  );
  await expectOk(await send(cast.quality, 'actions', action.id, { type: 'APPROVE_PLAN' }));
  await stubEvidenceRow(action.id, owner.user);
  await expectOk(await send(owner, 'actions', action.id, { type: 'SUBMIT', summary: 'Technique revised and tubes re-inspected' }));
  await expectOk(await send(cast.quality, 'actions', action.id, { type: 'VERIFY', password: TEST_PASSWORD }));
  await expectOk(await send(lead, 'findings', finding.id, { type: 'CONFIRM_EFFECTIVE', note: 'Re-audit found circumferential notches detected' }));
  return { audit, finding, action };
}
