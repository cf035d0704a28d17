// Demo audits, findings and corrective actions of Tarnbrook Aero Components in
// every state, built through the same services the API uses, so snapshots,
// versions, signatures and trail entries agree exactly as if people had
// clicked through. The clock walks forward from about ten weeks ago, so due
// dates fall in the past, the near future and further out (some overdue).
// Leaves refs['audit:<key>'], refs['finding:<key>'] and refs['action:<key>'].
import { createHash } from 'node:crypto';
import type { AppConfig } from '../../config/env';
import type { AppDeps } from '../../app-deps';
import { createLogger } from '../../lib/logger';
import { defineAbilityFor } from '../../../shared/abilities';
import { DEMO_SECOND_LAYER_TECHNIQUE, DEMO_TECHNIQUES } from '../../../shared/domain/demo-techniques';
import { Audit, CorrectiveAction, EvidenceFile, Finding } from '../../models';
import { createAudit, runChecklist } from '../../services/audits.service';
import { raiseFinding } from '../../services/findings.service';
import { assignAction } from '../../services/actions.service';
import { applyRecordEvent } from '../../services/record-events.service';
import { getFindingImpact, recordContainmentDecisions } from '../../services/finding-impact.service';
import type { ContainmentDecisionKind, ImpactRow } from '../../../shared/schemas/impact';
import { addDays } from '../../services/workflow-policy';
import { contentKey } from '../../storage';
import { addEvidenceFromBytes } from '../../services/evidence.service';
import type { RecordKind } from '../../../machines';
import { DEMO_USERS } from './people.seed';
import { DEMO_PASSWORD, type SeedContext, type SeedStep } from './seed-context';

const DAY_MS = 86_400_000;

type UserKey = 'auditor' | 'auditor2' | 'quality' | 'accountable' | 'level3' | 'technician';

function makeDriver(context: SeedContext) {
  let now = context.now;
  const deps: AppDeps = {
    // The event service reads only the lock threshold, and only after a wrong signing password (never in the seed).
    config: { signIn: { lockThreshold: 10, rateLimit: 0, rateWindowMinutes: 0 } } as unknown as AppConfig,
    sequelize: context.sequelize,
    logger: createLogger('silent'),
    clock: { now: () => now },
  };
  const as = (key: UserKey) => {
    const user = context.users[key];
    const areaCode = DEMO_USERS.find((person) => person.key === key)?.area ?? null;
    const areaId = areaCode ? context.areas[areaCode].id : null;
    return {
      actor: { id: user.id, displayName: user.displayName, roles: user.roles },
      ability: defineAbilityFor({ id: user.id, roles: user.roles, areaId }),
    };
  };
  const versionOf = async (kind: RecordKind, id: number) => {
    const model = kind === 'audit' ? Audit : kind === 'finding' ? Finding : CorrectiveAction;
    return (await (model as typeof Audit).findByPk(id, { attributes: ['version'] }))!.version;
  };
  return {
    deps,
    /** Moves the clock to `days` before the seed's now (negative: after). */
    at(daysAgo: number) {
      now = new Date(context.now.getTime() - daysAgo * DAY_MS);
    },
    day: (offsetDays: number) => addDays(now, offsetDays),
    as,
    async send(key: UserKey, kind: RecordKind, id: number, body: { type: string; [key: string]: unknown }) {
      const { actor, ability } = as(key);
      const signed = ['ISSUE', 'VERIFY', 'CLOSE'].includes(body.type) && !(kind === 'audit' && body.type === 'CLOSE');
      const input = { ...body, version: await versionOf(kind, id), ...(signed ? { password: DEMO_PASSWORD } : {}) };
      await applyRecordEvent(deps, { actor, ability, kind, id, input });
    },
    /**
     * Records the quality manager's containment decisions on a finding's impact
     * worksheet: `choose` gives the decision for a row (null leaves it undecided);
     * rows with the same decision and reason are recorded together, as on the page.
     */
    async decideImpact(key: UserKey, findingId: number, choose: (row: ImpactRow) => { decision: ContainmentDecisionKind; reason: string } | null) {
      const { actor, ability } = as(key);
      const impact = await getFindingImpact(deps, findingId);
      const batches = new Map<string, { decision: ContainmentDecisionKind; reason: string; inspectionIds: number[] }>();
      for (const row of impact.rows) {
        const chosen = row.decision ? null : choose(row);
        if (!chosen) continue;
        const batchKey = `${chosen.decision}|${chosen.reason}`;
        const batch = batches.get(batchKey) ?? { ...chosen, inspectionIds: [] };
        batch.inspectionIds.push(row.inspection.id);
        batches.set(batchKey, batch);
      }
      for (const batch of batches.values()) await recordContainmentDecisions(deps, actor, ability, findingId, batch);
    },
    now: () => now,
  };
}

type Driver = ReturnType<typeof makeDriver>;

/**
 * A current evidence file so the owner can submit. With the application's
 * configuration on the seed context (`context.config`), the file goes through
 * the evidence service like an upload (bytes in storage, trail entry). Without
 * it only the file's metadata row is written (name, size, SHA-256 of the text):
 * the record is consistent, but a download reports the bytes missing.
 */
async function seedEvidenceRow(driver: Driver, context: SeedContext, actionId: number, ownerKey: UserKey, name: string, text: string) {
  const { config } = context;
  const bytes = Buffer.from(text, 'utf8');
  if (config) {
    const { actor, ability } = driver.as(ownerKey);
    const user = { ...actor, email: '', areaId: null, areaName: null, roles: [...actor.roles] };
    await addEvidenceFromBytes({ ...driver.deps, config }, { user, ability }, { recordType: 'action', recordId: actionId, fileName: name, bytes });
    return;
  }
  const sha256 = createHash('sha256').update(bytes).digest('hex');
  await EvidenceFile.create({
    recordType: 'action',
    recordId: actionId,
    originalName: name,
    mediaType: 'text/plain',
    sizeBytes: bytes.length,
    sha256,
    storageKey: contentKey(sha256),
    tempName: null,
    storedAt: null,
    uploadedById: context.users[ownerKey].id,
  });
}

/** A finding written by the auditor (not from a checklist result). */
const manual = (title: string, rule: string, requirement: string, objectiveEvidence: string, techniqueCode?: string) => ({
  title, rule, requirement, objectiveEvidence, ...(techniqueCode ? { techniqueCode } : {}),
});

const technique = (code: string) => [...DEMO_TECHNIQUES, DEMO_SECOND_LAYER_TECHNIQUE].find((item) => item.code === code)!;

/** The scope item: the register's technique when the technique seed ran, else the demo technique itself. */
function scopeItem(context: SeedContext, code: string) {
  const techniqueId = context.refs[`technique:${code}`];
  return techniqueId ? { techniqueId } : { technique: technique(code) as unknown as Record<string, unknown> };
}

async function planAndStart(
  driver: Driver,
  context: SeedContext,
  input: { key: string; title: string; area: string; lead: UserKey; codes: string[]; criteria: string; startInDays?: number },
) {
  const { actor, ability } = driver.as(input.lead);
  const id = await createAudit(driver.deps, actor, ability, {
    title: input.title,
    criteria: input.criteria,
    areaId: context.areas[input.area].id,
    leadAuditorId: context.users[input.lead].id,
    plannedStart: driver.day(input.startInDays ?? 0),
    plannedEnd: driver.day((input.startInDays ?? 0) + 10),
    techniques: input.codes.map((code) => scopeItem(context, code)),
  });
  context.refs[`audit:${input.key}`] = id;
  return id;
}

async function runAll(driver: Driver, lead: UserKey, auditId: number, codes: string[]) {
  const { actor, ability } = driver.as(lead);
  const runs: Record<string, { id: number; results: { rule: string; status: string }[] }> = {};
  for (const code of codes) {
    const run = await runChecklist(driver.deps, actor, ability, auditId, { techniqueCode: code });
    runs[code] = { id: run.id, results: (run.output as { results: { rule: string; status: string }[] }).results };
  }
  return runs;
}

export const seedWorkflows: SeedStep = async (context) => {
  const d = makeDriver(context);
  const auditor = d.as('auditor');
  const raise = async (key: string, auditId: number, body: Parameters<typeof raiseFinding>[4]) => {
    const id = await raiseFinding(d.deps, auditor.actor, auditor.ability, auditId, body);
    context.refs[`finding:${key}`] = id;
    return id;
  };
  const fromResult = (runs: Awaited<ReturnType<typeof runAll>>, code: string, rule: string) => {
    const run = runs[code];
    const resultIndex = run.results.findIndex((result) => result.rule === rule && result.status !== 'pass');
    return { checklistRunId: run.id, resultIndex };
  };
  const assign = async (key: string, findingId: number, owner: UserKey, dueInDays: number) => {
    const quality = d.as('quality');
    const id = await assignAction(d.deps, quality.actor, { findingId, ownerId: context.users[owner].id, dueDate: d.day(dueInDays) });
    context.refs[`action:${key}`] = id;
    return id;
  };
  const plan = (description: string, dueInDays: number) => ({
    type: 'SUBMIT_PLAN',
    method: 'five_whys',
    rootCause: `Why did it happen? ${description}. Why was it not caught? The procedure review had no checklist step for it.`,
    plan: [
      { description: `Revise the procedure: ${description.toLowerCase()}`, dueDate: d.day(dueInDays) },
      { description: 'Brief the inspectors on the revision and record the briefing', dueDate: d.day(dueInDays + 5) },
    ],
  });

  // Audit 3 — Wheel and Brake Shop, bead seat and bores: closed (an observation, a withdrawn finding).
  d.at(95);
  const wheels = await planAndStart(d, context, {
    key: 'wheels',
    title: 'Wheel and Brake Shop: bead seat and fastener-hole techniques',
    area: 'WBS',
    lead: 'auditor2',
    codes: ['TAC-ET-004', 'TAC-ET-011'],
    criteria: 'Company ET procedure QP-ET-01 and the wheel component maintenance manual',
  });
  d.at(92);
  await d.send('auditor2', 'audit', wheels, { type: 'START_FIELDWORK' });
  await runAll(d, 'auditor2', wheels, ['TAC-ET-004', 'TAC-ET-011']);
  const auditor2 = d.as('auditor2');
  const observation = await raiseFinding(d.deps, auditor2.actor, auditor2.ability, wheels, manual(
    'Bead-seat scan start point not marked',
    'technique TAC-ET-004, section 6',
    'The scan starts at a marked datum so coverage can be shown.',
    'Two wheel halves were scanned from different start points; coverage was still complete.',
    'TAC-ET-004',
  ));
  const withdrawn = await raiseFinding(d.deps, auditor2.actor, auditor2.ability, wheels, manual(
    'Rotating probe speed not stated',
    'technique TAC-ET-011, section 5',
    'The technique states the probe rotation speed.',
    'The speed was not found in section 5.',
    'TAC-ET-011',
  ));
  context.refs['finding:observation'] = observation;
  context.refs['finding:withdrawn'] = withdrawn;
  d.at(91);
  await d.send('auditor2', 'finding', observation, { type: 'SUBMIT' });
  await d.send('auditor2', 'finding', withdrawn, { type: 'WITHDRAW', reason: 'The speed is stated in section 4.2; the auditor had read an old copy' });
  d.at(90);
  await d.send('quality', 'finding', observation, { type: 'CLASSIFY', class: 'observation', note: 'Coverage was complete; marking the datum is good practice and was raised at the shop briefing' });
  await d.send('auditor2', 'audit', wheels, { type: 'FINISH_FIELDWORK' });
  d.at(88);
  await d.send('quality', 'audit', wheels, { type: 'ISSUE' });
  d.at(85);
  await d.send('quality', 'audit', wheels, { type: 'CLOSE' });

  // Audit 1 — Receiving Inspection, tube and bar techniques: issued, findings in most states.
  d.at(75);
  const receiving = await planAndStart(d, context, {
    key: 'receiving',
    title: 'Receiving Inspection: tube and bar eddy current techniques',
    area: 'RCV',
    lead: 'auditor',
    codes: ['TAC-ET-017', 'TAC-ET-023'],
    criteria: 'Company ET procedure QP-ET-01, the customer specification for heat-exchanger tubes, and the written techniques in scope',
  });
  d.at(70);
  await d.send('auditor', 'audit', receiving, { type: 'START_FIELDWORK' });
  const runs = await runAll(d, 'auditor', receiving, ['TAC-ET-017', 'TAC-ET-023']);
  d.at(68);
  const orientation = await raise('orientation', receiving, fromResult(runs, 'TAC-ET-023', 'orientation-coverage'));
  const centre = await raise('centre', receiving, fromResult(runs, 'TAC-ET-017', 'center-effect'));
  const frequency = await raise('frequency', receiving, fromResult(runs, 'TAC-ET-023', 'limit-frequency'));
  const serial = await raise('serial', receiving, manual(
    'Instrument serial number missing from inspection reports',
    'QP-ET-01 clause 9.2',
    'Every ET report records the instrument and probe serial numbers used.',
    'Three of the five bar-stock reports sampled (lots 4471, 4473, 4480) name the instrument model but no serial number.',
    'TAC-ET-017',
  ));
  const certificate = await raise('certificate', receiving, manual(
    'Reference tube used after its certificate expired',
    'QP-ET-01 clause 7.4',
    'Reference standards are used only with a current certificate of their notch dimensions.',
    'Reference tube RT-19 was used on 14 inspections after its certificate expired; no re-certification is on file.',
    'TAC-ET-023',
  ));
  const fill = await raise('fill', receiving, manual(
    'Fill factor not recorded for the bobbin coil',
    'technique TAC-ET-023, section 5',
    'The report records the coil and tube dimensions so the fill factor can be checked.',
    'Reports for bundle HX-2 give the coil diameter but not the measured tube inside diameter.',
    'TAC-ET-023',
  ));
  const calibration = await raise('calibration', receiving, manual(
    'Calibration check interval not followed',
    'QP-ET-01 clause 8.1',
    'The system is checked on the reference standard at the start, every 4 hours and at the end of a shift.',
    'Shift log of bundle HX-3 shows one check at the start and none for the following 7 hours.',
    'TAC-ET-023',
  ));
  const briefing = await raise('briefing', receiving, manual(
    'Technique revision not briefed to night shift',
    'QP-ET-01 clause 4.3',
    'Inspectors are briefed on each technique revision before using it.',
    'The briefing record for TAC-ET-017 rev A has no night-shift signatures.',
    'TAC-ET-017',
  ));
  const handling = await raise('handling', receiving, manual(
    'Probe stored without protective cap',
    'QP-ET-01 clause 6.5',
    'Probes are stored capped in their case between uses.',
    'Bobbin probe BP-7 was found uncapped on the bench with a scored wear surface.',
    'TAC-ET-023',
  ));
  d.at(66);
  for (const id of [orientation, centre, frequency, serial, certificate, fill, calibration, briefing, handling]) {
    await d.send('auditor', 'finding', id, { type: 'SUBMIT' });
  }
  d.at(64);
  await d.send('quality', 'finding', orientation, { type: 'CLASSIFY', class: 'major', note: 'Circumferential cracks in the tubes cannot be detected as written' });
  await d.send('quality', 'finding', centre, { type: 'CLASSIFY', class: 'major', note: 'A centreline flaw is claimed but cannot be seen by an encircling coil' });
  await d.send('quality', 'finding', certificate, { type: 'CLASSIFY', class: 'major' });
  await d.send('quality', 'finding', calibration, { type: 'CLASSIFY', class: 'major' });
  for (const id of [frequency, serial, fill, briefing, handling]) await d.send('quality', 'finding', id, { type: 'CLASSIFY', class: 'minor' });
  d.at(63);
  // Each major finding's past inspections get a decision before its containment is recorded.
  await d.decideImpact('quality', orientation, ({ inspection }) =>
    inspection.result === 'reject'
      ? { decision: 'not_affected', reason: 'Already rejected and out of service: the missed orientation changes nothing for this part' }
      : { decision: 'reinspect', reason: 'Accepted with the bobbin coil alone: re-inspect with the rotating probe for circumferential cracks' },
  );
  await d.decideImpact('quality', certificate, () => ({
    decision: 'reinspect',
    reason: 'Set up on a reference tube whose notch dimensions were not certified: re-inspect against RT-22',
  }));
  await d.decideImpact('quality', calibration, () => ({
    decision: 'accept_justified',
    reason: 'The shift log shows the start, 4-hour and end checks for this inspection; only bundle HX-3 lacked them and it is re-inspected under the orientation finding',
  }));
  // "centre" keeps its containment open: the rejected bars are decided, the accepted ones still wait.
  await d.decideImpact('quality', centre, ({ inspection }) =>
    inspection.result === 'reject' ? { decision: 'not_affected', reason: 'Rejected at receiving and returned to the supplier' } : null,
  );
  await d.send('quality', 'finding', orientation, { type: 'RECORD_CONTAINMENT', description: 'Technique TAC-ET-023 suspended; bundles HX-1 to HX-3 quarantined pending a rotating-probe re-inspection' });
  await d.send('quality', 'finding', certificate, { type: 'RECORD_CONTAINMENT', description: 'RT-19 withdrawn; RT-22 (current certificate) issued; the 14 inspections listed for re-inspection' });
  await d.send('quality', 'finding', calibration, { type: 'RECORD_CONTAINMENT', description: 'HX-3 results placed on hold until re-inspected with checks every 4 hours' });
  // "centre" stays in containment: its one-day containment is overdue.

  const orientationAction = await assign('orientation', orientation, 'level3', 30);
  const calibrationAction = await assign('calibration', calibration, 'level3', 28);
  const handlingAction = await assign('handling', handling, 'technician', 40);
  const briefingAction = await assign('briefing', briefing, 'technician', 45);

  // Owners investigate and plan.
  d.at(62);
  for (const [id, owner] of [[orientationAction, 'level3'], [calibrationAction, 'level3'], [handlingAction, 'technician'], [briefingAction, 'technician']] as const) {
    await d.send(owner, 'action', id, { type: 'START' });
  }
  d.at(58);
  await d.send('level3', 'action', orientationAction, plan('The technique named a bobbin coil only, whose current never crosses a circumferential crack', 20));
  await d.send('level3', 'action', calibrationAction, plan('Check times were not on the shift log template', 14));
  await d.send('technician', 'action', handlingAction, plan('The probe case had no place for the cap', 10));
  await d.send('technician', 'action', briefingAction, plan('Night shift was not on the briefing distribution', 10));
  d.at(56);
  for (const id of [orientationAction, calibrationAction, handlingAction, briefingAction]) await d.send('quality', 'action', id, { type: 'APPROVE_PLAN' });

  d.at(50);
  const certificateAction = await assign('certificate', certificate, 'level3', 60);
  const fillAction = await assign('fill', fill, 'technician', 55);
  const serialAction = await assign('serial', serial, 'level3', 70);
  d.at(45);
  await d.send('level3', 'action', certificateAction, { type: 'START' });
  await d.send('technician', 'action', fillAction, { type: 'START' });
  await d.send('level3', 'action', serialAction, { type: 'START' });
  d.at(40);
  await d.send('level3', 'action', certificateAction, plan('Certificate expiry was not tracked in the equipment register', 25)); // waits in plan review
  await d.send('technician', 'action', fillAction, plan('The report template had no field for the tube inside diameter', 20));
  d.at(38);
  await d.send('quality', 'action', fillAction, { type: 'APPROVE_PLAN' }); // in progress
  await d.send('level3', 'action', serialAction, { type: 'REQUEST_EXTENSION', dueDate: d.day(60), reason: 'The report template change waits for the next document-control release' });

  await d.send('auditor', 'audit', receiving, { type: 'FINISH_FIELDWORK' });
  await d.send('quality', 'audit', receiving, { type: 'ISSUE' }); // issued: findings still open

  // Work done, evidence attached, submitted; some verified.
  d.at(35);
  await seedEvidenceRow(d, context, orientationAction, 'level3', 'TAC-ET-023-rev-B-rotating-probe-demonstration.txt', 'Rev B demonstration: circumferential and axial notches on RT-22 detected with the rotating probe at 300 kHz.');
  await d.send('level3', 'action', orientationAction, { type: 'SUBMIT', summary: 'Technique revised to rev B with a rotating-probe pass; HX-1 to HX-3 re-inspected, no rejectable indications.' });
  await seedEvidenceRow(d, context, calibrationAction, 'level3', 'shift-log-template-rev-3.txt', 'Shift log template rev 3 with check times at start, every 4 hours and at the end.');
  await d.send('level3', 'action', calibrationAction, { type: 'SUBMIT', summary: 'Shift log template revised; HX-3 re-inspected with checks every 4 hours.' });
  await seedEvidenceRow(d, context, handlingAction, 'technician', 'probe-case-photo-notes.txt', 'Probe cases fitted with cap holders; photo reference PC-2026-11.');
  await d.send('technician', 'action', handlingAction, { type: 'SUBMIT', summary: 'Cap holders fitted to all probe cases; BP-7 replaced.' });
  await seedEvidenceRow(d, context, briefingAction, 'technician', 'briefing-record-night-shift.txt', 'Briefing record TAC-ET-017 rev A, night shift, five signatures.');
  await d.send('technician', 'action', briefingAction, { type: 'SUBMIT', summary: 'Night shift briefed; distribution list corrected.' });
  d.at(33);
  await d.send('quality', 'action', orientationAction, { type: 'VERIFY' });
  await d.send('quality', 'action', calibrationAction, { type: 'VERIFY' });
  await d.send('quality', 'action', handlingAction, { type: 'VERIFY' });
  // briefingAction stays submitted, waiting for verification.

  d.at(30);
  await d.send('auditor', 'finding', orientation, { type: 'CONFIRM_EFFECTIVE', note: 'Follow-up: rev B in use on all bundles; both notch orientations detected on RT-22.' });
  await d.send('auditor', 'finding', calibration, { type: 'CONFIRM_EFFECTIVE', note: 'Two weeks of shift logs sampled: every check at the required interval.' });
  // handling stays in effectiveness_check.
  d.at(28);
  await d.send('accountable', 'finding', orientation, { type: 'CLOSE' });
  // calibration stays awaiting the accountable manager's signature.

  d.at(27);
  const cancelled = await planAndStart(d, context, {
    key: 'cancelled',
    title: 'Structures Bay: bonded repair inspection',
    area: 'STR',
    lead: 'auditor',
    codes: ['TAC-ET-031'],
    criteria: 'Company ET procedure QP-ET-01',
  });
  d.at(26);
  await d.send('quality', 'audit', cancelled, { type: 'CANCEL', reason: 'Bonded repairs moved to an outside contractor; their audit is the contractor’s' });
  d.at(20);
  await assign('frequency', frequency, 'technician', 10); // assigned, untouched
  // Audit 2 — Structures Bay, lap-joint techniques: in fieldwork, three findings waiting for review. The
  // thick-skin technique TAC-ET-036 conformed by the plane-wave figures when it was approved; the field of its
  // 3 mm pencil probe does not reach the doubler, and the auditor raises it.
  d.at(12);
  const structures = await planAndStart(d, context, {
    key: 'structures',
    title: 'Structures Bay: second-layer lap-joint techniques',
    area: 'STR',
    lead: 'auditor',
    codes: ['TAC-ET-031', 'TAC-ET-036'],
    criteria: 'Company ET procedure QP-ET-01 and the aircraft maintenance manual task for lap-joint inspection',
  });
  d.at(10);
  await d.send('auditor', 'audit', structures, { type: 'START_FIELDWORK' });
  const lapRuns = await runAll(d, 'auditor', structures, ['TAC-ET-031', 'TAC-ET-036']);
  d.at(8);
  const edge = await raise('edge', structures, fromResult(lapRuns, 'TAC-ET-031', 'edge-effect'));
  const coilSize = await raise('coil-size', structures, fromResult(lapRuns, 'TAC-ET-031', 'coil-size'));
  const secondLayer = await raise('second-layer-reach', structures, fromResult(lapRuns, 'TAC-ET-036', 'penetration-depth'));
  await raise('scan-records', structures, manual(
    'Scan pattern not recorded',
    'QP-ET-01 clause 9.4',
    'The report shows the scanned area and the index used.',
    'Draft: two lap-joint reports sampled have no scan sketch; a third still to be checked.',
    'TAC-ET-031',
  )); // still raised: the auditor is drafting it
  d.at(7);
  await d.send('auditor', 'finding', edge, { type: 'SUBMIT' });
  await d.send('auditor', 'finding', coilSize, { type: 'SUBMIT' });
  await d.send('auditor', 'finding', secondLayer, { type: 'SUBMIT' });

  // Audit 4 — Wheel and Brake Shop brake discs: fieldwork finished, report being written.
  d.at(6);
  const discs = await planAndStart(d, context, {
    key: 'discs',
    title: 'Wheel and Brake Shop: bead seat re-audit after tooling change',
    area: 'WBS',
    lead: 'auditor',
    codes: ['TAC-ET-004'],
    criteria: 'Company ET procedure QP-ET-01',
  });
  d.at(5);
  await d.send('auditor', 'audit', discs, { type: 'START_FIELDWORK' });
  await runAll(d, 'auditor', discs, ['TAC-ET-004']);
  d.at(3);
  await d.send('auditor', 'audit', discs, { type: 'FINISH_FIELDWORK' });

  // Audit 5 — planned for next month.
  d.at(1);
  await planAndStart(d, context, {
    key: 'follow-up',
    startInDays: 20,
    title: 'Receiving Inspection: follow-up of the tube technique findings',
    area: 'RCV',
    lead: 'auditor',
    codes: ['TAC-ET-023'],
    criteria: 'Corrective actions of the previous Receiving Inspection audit',
  });
};
