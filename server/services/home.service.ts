// "Waiting on you": what this person must act on now, per role, soonest due first.
import { Op } from 'sequelize';
import type { AppDeps } from '../app-deps';
import type { AppAbility } from '../../shared/abilities';
import { Audit, CorrectiveAction, Finding } from '../models';
import type { HomeItem, HomeView } from '../../shared/schemas/workflow';
import type { EventActor } from './record-events.service';
import { findingIncludes } from './findings.service';
import { actionIncludes } from './actions.service';
import { allowedEventsForUser, factsForMany, findingFacts as containmentFacts, openFindingCounts } from './workflow/record-kinds';
import { findingOverdue } from '../presenters/finding.presenter';
import { actionOverdue } from '../presenters/action.presenter';
import { todayIso } from '../presenters/workflow-refs';

const AUDIT_TODO: Record<string, string> = {
  START_FIELDWORK: 'Start fieldwork',
  FINISH_FIELDWORK: 'Run the checklist, raise findings, finish fieldwork',
  ISSUE: 'Issue the audit report (signature)',
  CLOSE: 'Close the audit: every finding is settled',
};
const FINDING_TODO: Record<string, string> = {
  SUBMIT: 'Submit your finding for review',
  CLASSIFY: 'Classify the finding',
  RECORD_CONTAINMENT: 'Record the containment',
  CONFIRM_EFFECTIVE: 'Check the effectiveness of the corrective action',
  CLOSE: 'Close the finding (signature)',
};
const ACTION_TODO: Record<string, string> = {
  START: 'Start the investigation',
  SUBMIT_PLAN: 'Submit the root cause and plan',
  APPROVE_PLAN: 'Review the root cause and plan',
  SUBMIT: 'Attach evidence and submit the corrective action',
  VERIFY: 'Verify the corrective action (signature)',
  APPROVE_EXTENSION: 'Decide on the extension request',
};

export async function waitingOn(deps: AppDeps, actor: EventActor, ability: AppAbility): Promise<HomeView> {
  const now = deps.clock.now();
  const today = todayIso(now);
  const items: HomeItem[] = [];

  // Candidates are records in states someone must act on; the same rules as the record pages decide whether it is this person.
  const [audits, findings, actions] = await Promise.all([
    Audit.findAll({ where: { state: { [Op.in]: ['planned', 'fieldwork', 'reporting', 'issued'] } }, order: [['plannedStart', 'ASC']], limit: 200 }),
    Finding.findAll({
      where: { state: { [Op.in]: ['raised', 'in_review', 'containment', 'action_open', 'effectiveness_check', 'awaiting_signoff'] } },
      include: findingIncludes,
      order: [['dueDate', 'ASC'], ['number', 'ASC']],
      limit: 500,
    }),
    CorrectiveAction.findAll({ where: { state: { [Op.ne]: 'verified' } }, include: actionIncludes, order: [['dueDate', 'ASC']], limit: 500 }),
  ]);
  const [auditCounts, actionFacts, findingFacts] = await Promise.all([
    openFindingCounts(audits.map((a) => a.id)),
    factsForMany('action', actions.map((a) => a.id)),
    containmentFacts(findings, now),
  ]);

  for (const audit of audits) {
    const allowed = allowedEventsForUser('audit', audit, {}, { openFindingCount: auditCounts.get(audit.id) ?? 0 }, ability);
    const todo = allowed.map((type) => AUDIT_TODO[type]).find(Boolean);
    if (!todo) continue;
    items.push({ recordType: 'audit', id: audit.id, label: `Audit ${audit.plannedStart} to ${audit.plannedEnd}`, title: audit.title, state: audit.state, todo, dueDate: audit.plannedEnd, overdue: audit.plannedEnd < today && ['planned', 'fieldwork'].includes(audit.state) });
  }
  for (const finding of findings) {
    const fact = (findingFacts.get(finding.id) ?? { undecidedInspectionCount: 0 }) as { undecidedInspectionCount: number };
    const allowed = allowedEventsForUser('finding', finding, { actionOwnerId: finding.action?.ownerId ?? null }, fact, ability);
    let todo = allowed.map((type) => FINDING_TODO[type]).find(Boolean);
    if (!todo && finding.state === 'containment' && fact.undecidedInspectionCount > 0 && ability.can('decide_impact', 'Finding')) {
      todo = `Decide the ${fact.undecidedInspectionCount} past inspection(s) in doubt, then record the containment`;
    }
    if (!todo && finding.state === 'action_open' && !finding.action && ability.can('create', 'CorrectiveAction')) todo = 'Assign a corrective action';
    if (!todo) continue;
    const dueDate = finding.state === 'containment' ? finding.containmentDueDate : finding.dueDate;
    items.push({ recordType: 'finding', id: finding.id, label: finding.number, title: finding.title, state: finding.state, todo, dueDate, overdue: findingOverdue(finding, now) });
  }
  for (const action of actions) {
    const fact = (actionFacts.get(action.id) ?? { evidenceCount: 0 }) as { evidenceCount: number };
    const allowed = allowedEventsForUser('action', action, { findingAuthorId: action.finding?.authorId ?? null }, fact, ability);
    let todo = allowed.map((type) => ACTION_TODO[type]).find(Boolean);
    if (!todo && action.state === 'in_progress' && action.ownerId === actor.id) todo = ACTION_TODO.SUBMIT;
    if (!todo) continue;
    items.push({ recordType: 'action', id: action.id, label: action.number, title: action.finding ? `${action.finding.number}: ${action.finding.title}` : action.number, state: action.state, todo, dueDate: action.dueDate, overdue: actionOverdue(action, now) });
  }
  items.sort((a, b) => Number(b.overdue) - Number(a.overdue) || (a.dueDate ?? '9999').localeCompare(b.dueDate ?? '9999'));
  return { items };
}
