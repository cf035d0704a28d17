// What each machine effect tells whom (the effect names and their meaning are
// documented in machines/*.machine.ts). Effects that are not mail
// (markFindingActionVerified, requestReopenOfAction) have no entry here.
import type { Sequelize, Transaction } from 'sequelize';
import type { EffectContext } from '../services/effects';
import type { Notice } from './notice';
import { formatDate } from '../../shared/format/dates';
import { actionFacts, auditFacts, findingFacts, usersWithRole, type ActionFacts, type AuditFacts, type FindingFacts } from './record-facts';

type Loaded = { action?: ActionFacts; finding?: FindingFacts; audit?: AuditFacts };
type Builder = (facts: Loaded, context: Record<string, unknown>, people: (role: string) => Promise<number[]>) => Promise<Notice | null | undefined> | Notice | null | undefined;

const text = (value: unknown, fallback = '') => (typeof value === 'string' && value.trim() ? value.trim() : fallback);

function actionNotice(a: ActionFacts, kind: string, to: number[], subject: string, paragraphs: string[]): Notice {
  return { kind, to, subject, paragraphs, path: `/actions/${a.id}`, linkLabel: `Open corrective action ${a.number}`, recordType: 'action', recordId: a.id };
}

function findingNotice(f: FindingFacts, kind: string, to: number[], subject: string, paragraphs: string[]): Notice {
  return { kind, to, subject, paragraphs, path: `/findings/${f.id}`, linkLabel: `Open finding ${f.number}`, recordType: 'finding', recordId: f.id };
}

function auditNotice(a: AuditFacts, kind: string, to: number[], subject: string, paragraphs: string[]): Notice {
  return { kind, to, subject, paragraphs, path: `/audits/${a.id}`, linkLabel: `Open the audit “${a.title}”`, recordType: 'audit', recordId: a.id };
}

const ACTION_EFFECTS: Record<string, Builder> = {
  notifyOwnerAssigned: ({ action: a }) =>
    a && actionNotice(a, 'action-assigned', [a.ownerId], `Corrective action ${a.number} is assigned to you (due ${formatDate(a.dueDate)})`, [
      `You own corrective action ${a.number} for finding ${a.findingNumber}, “${a.findingTitle}”. It is due on ${formatDate(a.dueDate)}.`,
      'Start by investigating the root cause. Your root cause and plan then go to the quality manager for review.',
    ]),
  notifyReviewerPlanSubmitted: async ({ action: a }, _c, people) =>
    a && actionNotice(a, 'action-plan-submitted', await people('quality_manager'), `${a.number}: root cause and plan wait for your review`, [
      `The owner of corrective action ${a.number} (finding ${a.findingNumber}) has submitted a root cause and a plan.`,
      'Approve the plan, or return it to the owner with your reason.',
    ]),
  notifyOwnerPlanApproved: ({ action: a }) =>
    a && actionNotice(a, 'action-plan-approved', [a.ownerId], `${a.number}: your plan is approved`, [
      `The quality manager approved the plan of corrective action ${a.number}. Carry it out and upload the evidence; the action is due on ${formatDate(a.dueDate)}.`,
    ]),
  notifyOwnerPlanReturned: ({ action: a }, c) =>
    a && actionNotice(a, 'action-plan-returned', [a.ownerId], `${a.number}: your plan was returned`, [
      `The quality manager returned the root cause and plan of corrective action ${a.number}.`,
      `Reason: ${text(c.returnReason, 'see the record')}`,
    ]),
  notifyReviewerEvidenceSubmitted: async ({ action: a }, _c, people) =>
    a && actionNotice(a, 'action-submitted', [...(await people('quality_manager')), a.findingAuthorId], `${a.number} waits for verification`, [
      `The owner of corrective action ${a.number} (finding ${a.findingNumber}) has submitted the work and its evidence.`,
      'Verify it with your signature, or return it with your reason. The owner may not verify their own action.',
    ]),
  notifyOwnerSubmissionReturned: ({ action: a }, c) =>
    a && actionNotice(a, 'action-returned', [a.ownerId], `${a.number}: your submission was returned`, [
      `The reviewer returned corrective action ${a.number} to you.`,
      `Reason: ${text(c.returnReason, 'see the record')}`,
    ]),
  notifyOwnerReopened: ({ action: a }, c) =>
    a && actionNotice(a, 'action-reopened', [a.ownerId], `${a.number} is reopened: the correction was not effective`, [
      `The effectiveness check of finding ${a.findingNumber} failed, so corrective action ${a.number} is open again.`,
      `Reason: ${text(c.reopenReason, 'see the record')}`,
    ]),
  notifyReviewerExtensionRequested: async ({ action: a }, c, people) => {
    const pending = c.pendingExtension as { dueDate?: string; reason?: string } | null | undefined;
    return a && actionNotice(a, 'action-extension-requested', await people('quality_manager'), `${a.number}: extension requested to ${pending?.dueDate ? formatDate(pending.dueDate) : 'a later date'}`, [
      `The owner of corrective action ${a.number} asks to move the due date from ${formatDate(a.dueDate)} to ${pending?.dueDate ? formatDate(pending.dueDate) : 'a later date'}.`,
      `Reason: ${text(pending?.reason, 'see the record')}`,
    ]);
  },
  notifyOwnerExtensionApproved: ({ action: a }, c) =>
    a && actionNotice(a, 'action-extension-approved', [a.ownerId], `${a.number}: extension approved, now due ${formatDate(text(c.dueDate, a.dueDate))}`, [
      `The quality manager approved your extension. Corrective action ${a.number} is now due on ${formatDate(text(c.dueDate, a.dueDate))}.`,
    ]),
  notifyOwnerExtensionRejected: ({ action: a }) =>
    a && actionNotice(a, 'action-extension-rejected', [a.ownerId], `${a.number}: extension not approved`, [
      `The quality manager did not approve your extension. Corrective action ${a.number} stays due on ${formatDate(a.dueDate)}; the reason is on the record.`,
    ]),
};

const FINDING_EFFECTS: Record<string, Builder> = {
  notifyFindingSubmitted: async ({ finding: f }, _c, people) =>
    f && findingNotice(f, 'finding-submitted', await people('quality_manager'), `Finding ${f.number} waits for classification`, [
      `Finding ${f.number}, “${f.title}”, was submitted for review. Classify it as major, minor or observation, or withdraw it with a reason.`,
    ]),
  notifyFindingWithdrawn: ({ finding: f }, c) =>
    f && findingNotice(f, 'finding-withdrawn', [f.authorId, ...(f.leadAuditorId ? [f.leadAuditorId] : [])], `Finding ${f.number} was withdrawn`, [
      `Finding ${f.number}, “${f.title}”, was withdrawn.`,
      `Reason: ${text(c.withdrawReason, 'see the record')}`,
    ]),
  notifyActionNeeded: async ({ finding: f }, _c, people) =>
    f && findingNotice(f, 'finding-action-needed', await people('quality_manager'), `Finding ${f.number} needs a corrective action`, [
      `Finding ${f.number}, “${f.title}”, is ready for its corrective action. Assign an owner and a due date.`,
    ]),
  notifyEffectivenessCheckDue: ({ finding: f }) =>
    f && findingNotice(f, 'finding-effectiveness-check', [f.authorId], `Finding ${f.number}: check the effectiveness of the correction`, [
      `The corrective action for finding ${f.number} is verified. Check whether the correction is effective, and confirm it or send it back with your reason.`,
    ]),
  notifyAwaitingSignoff: async ({ finding: f }, _c, people) =>
    f && findingNotice(f, 'finding-awaiting-signoff', await people('accountable_manager'), `Finding ${f.number} awaits your signature`, [
      `The correction of finding ${f.number}, “${f.title}”, was confirmed effective. It now needs your closing signature.`,
    ]),
  notifyFindingClosed: ({ finding: f }) =>
    f && findingNotice(f, 'finding-closed', [f.authorId, ...(f.leadAuditorId ? [f.leadAuditorId] : [])], `Finding ${f.number} is closed`, [
      `Finding ${f.number}, “${f.title}”, is closed.${f.auditTitle ? ` The audit “${f.auditTitle}” may now be closable.` : ''}`,
    ]),
};

const AUDIT_EFFECTS: Record<string, Builder> = {
  notifyAuditReportIssued: ({ audit: a }) =>
    a && auditNotice(a, 'audit-report-issued', [a.leadAuditorId, ...(a.areaLeadId ? [a.areaLeadId] : [])], `Audit report issued: ${a.title}`, [
      `The report of the audit “${a.title}” of ${a.areaName} is issued. Its findings are on the audit's page.`,
    ]),
  notifyAuditCancelled: ({ audit: a }, c) =>
    a && auditNotice(a, 'audit-cancelled', [a.leadAuditorId, ...(a.areaLeadId ? [a.areaLeadId] : [])], `Audit cancelled: ${a.title}`, [
      `The audit “${a.title}” of ${a.areaName}, planned from ${formatDate(a.plannedStart)}, is cancelled.`,
      `Reason: ${text(c.cancelReason, 'see the record')}`,
    ]),
};

const BY_RECORD = { action: ACTION_EFFECTS, finding: FINDING_EFFECTS, audit: AUDIT_EFFECTS } as const;

export const MAIL_EFFECTS: ReadonlySet<string> = new Set(Object.values(BY_RECORD).flatMap((table) => Object.keys(table)));

/** The notices for a batch of effects of one record, read inside its transaction. */
export async function noticesForEffects(sequelize: Sequelize, transaction: Transaction, effects: string[], context: EffectContext): Promise<Notice[]> {
  const table: Record<string, Builder> = BY_RECORD[context.recordType];
  const wanted = effects.filter((effect) => table[effect]);
  if (!wanted.length) return [];
  const facts: Loaded = {};
  if (context.recordType === 'action') facts.action = (await actionFacts(sequelize, context.recordId, transaction)) ?? undefined;
  if (context.recordType === 'finding') facts.finding = (await findingFacts(sequelize, context.recordId, transaction)) ?? undefined;
  if (context.recordType === 'audit') facts.audit = (await auditFacts(sequelize, context.recordId, transaction)) ?? undefined;
  const cache = new Map<string, Promise<number[]>>();
  const people = (role: string) => {
    if (!cache.has(role)) cache.set(role, usersWithRole(sequelize, role, transaction));
    return cache.get(role)!;
  };
  const notices: Notice[] = [];
  for (const effect of wanted) {
    const notice = await table[effect](facts, context.context, people);
    if (notice) notices.push(notice);
  }
  return notices;
}
