// A refusal in words, naming who may do it: "Only an administrator may add
// people", never "Your role may not create User". The roles are read from the
// role rules themselves, so the sentence follows the rules when they change.
import { defineAbilityFor, type SubjectName } from '../abilities';
import { ROLES, type Role } from '../roles';
import { ROLE_LABELS } from './roles';
import { humanizeCode } from './humanize';
import { ACTION_EVENT_LABELS, AUDIT_EVENT_LABELS, FINDING_EVENT_LABELS } from './workflow';

export const SUBJECT_LABELS: Record<Exclude<SubjectName, 'all'>, string> & { all: string } = {
  User: 'people',
  Area: 'areas',
  Policy: 'the policy',
  Trail: 'the trail',
  Mailbox: 'the mail catcher',
  Notification: 'messages',
  Audit: 'audits',
  ChecklistRun: 'checklist runs',
  Finding: 'findings',
  CorrectiveAction: 'corrective actions',
  Evidence: 'evidence',
  Technique: 'techniques',
  Material: 'materials',
  Certification: 'certifications',
  Equipment: 'equipment',
  Dashboard: 'the dashboard',
  Report: 'reports',
  Inspection: 'inspections',
  Demonstration: 'capability demonstrations',
  all: 'this',
};

const ACTION_WORDS: Readonly<Record<string, string>> = {
  manage: 'manage',
  read: 'see',
  create: 'add',
  update: 'change',
  approve: 'approve',
  unlock: 'unlock',
  verify: 'check',
  supersede: 'supersede',
  export: 'export',
  assess_extent: 'assess the extent of condition of',
  decide_impact: 'decide on the impact of',
};

const EVENT_WORDS: Readonly<Record<string, string>> = { ...ACTION_EVENT_LABELS, ...FINDING_EVENT_LABELS, ...AUDIT_EVENT_LABELS };

function article(label: string) {
  return /^[AEIOU]/i.test(label) ? `an ${label.toLowerCase()}` : `a ${label.toLowerCase()}`;
}

function actionPhrase(action: string, subject: string): string {
  const subjectWords = (SUBJECT_LABELS as Record<string, string>)[subject] ?? humanizeCode(subject).toLowerCase();
  if (ACTION_WORDS[action]) return `${ACTION_WORDS[action]} ${subjectWords}`;
  const event = EVENT_WORDS[action];
  return event ? `“${event.toLowerCase()}” on ${subjectWords}` : `${humanizeCode(action).toLowerCase()} ${subjectWords}`;
}

/** The roles whose rules allow the action on the kind of record (conditions aside). */
export function rolesAllowed(action: string, subject: string): Role[] {
  return ROLES.filter((role) => defineAbilityFor({ id: 0, roles: [role], areaId: null }).can(action, subject));
}

export function forbiddenMessage(action: string, subject: string): string {
  const roles = rolesAllowed(action, subject);
  const what = actionPhrase(action, subject);
  if (!roles.length) return `No role may ${what}`;
  const names = roles.map((role) => article(ROLE_LABELS[role]).replace('et level 3', 'ET Level 3'));
  const list = names.length === 1 ? names[0] : `${names.slice(0, -1).join(', ')} or ${names[names.length - 1]}`;
  return `Only ${list} may ${what}`;
}
