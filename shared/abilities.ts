// Role rules, written once: the server enforces them, the client uses them to
// decide which buttons to draw. Event types of the record machines double as
// CASL actions, so "may this person send CLOSE to this finding?" is one check.
import { AbilityBuilder, createMongoAbility, type MongoAbility } from '@casl/ability';
import type { Role } from './roles';

export type SubjectName =
  | 'User'
  | 'Area'
  | 'Policy'
  | 'Trail'
  | 'Mailbox'
  | 'Notification'
  | 'Audit'
  | 'ChecklistRun'
  | 'Finding'
  | 'CorrectiveAction'
  | 'Evidence'
  | 'Technique'
  | 'Material'
  | 'Certification'
  | 'Equipment'
  | 'Dashboard'
  | 'Report'
  | 'Inspection'
  | 'Demonstration'
  | 'all';

export type CrudAction = 'manage' | 'read' | 'create' | 'update' | 'approve' | 'unlock' | 'verify' | 'supersede' | 'export';
/** Extent of condition (run, raise linked findings) and impact (scope, containment decisions) on a finding. */
export type ImpactAction = 'assess_extent' | 'decide_impact';

export type AuditEvent = 'START_FIELDWORK' | 'FINISH_FIELDWORK' | 'ISSUE' | 'CLOSE' | 'CANCEL';
export type FindingEvent =
  | 'SUBMIT'
  | 'WITHDRAW'
  | 'CLASSIFY'
  | 'RECORD_CONTAINMENT'
  | 'CONFIRM_EFFECTIVE'
  | 'NOT_EFFECTIVE'
  | 'CLOSE';
export type ActionEvent =
  | 'START'
  | 'SUBMIT_PLAN'
  | 'APPROVE_PLAN'
  | 'RETURN_PLAN'
  | 'SUBMIT'
  | 'VERIFY'
  | 'RETURN'
  | 'REQUEST_EXTENSION'
  | 'APPROVE_EXTENSION'
  | 'REJECT_EXTENSION';

export type AppAction = CrudAction | ImpactAction | AuditEvent | FindingEvent | ActionEvent;
// Conditions are written against record fields (ownerId, authorId, …) that the
// server puts on plain objects with subject(); CASL's generic typing of those
// fields adds nothing here, so the ability is typed by action and subject name only.
export type AppAbility = MongoAbility;

export interface AbilityUser {
  id: number;
  roles: readonly Role[];
  areaId: number | null;
}

type Builder = AbilityBuilder<AppAbility>;

const READABLE: SubjectName[] = [
  'Audit',
  'ChecklistRun',
  'Finding',
  'CorrectiveAction',
  'Evidence',
  'Technique',
  'Material',
  'Certification',
  'Equipment',
  'Dashboard',
  'Report',
  'Area',
  'Policy',
  'Inspection',
  'Demonstration',
];

const OWNER_ACTION_EVENTS: ActionEvent[] = ['START', 'SUBMIT_PLAN', 'SUBMIT', 'REQUEST_EXTENSION'];

function auditorRules({ can }: Builder, user: AbilityUser) {
  can('create', 'Audit', { leadAuditorId: user.id });
  can(['START_FIELDWORK', 'FINISH_FIELDWORK'], 'Audit', { leadAuditorId: user.id });
  can('create', 'ChecklistRun', { leadAuditorId: user.id, state: 'fieldwork' });
  can('update', 'ChecklistRun', { leadAuditorId: user.id, auditState: 'fieldwork' });
  can('create', 'Finding');
  can('update', 'Finding', { authorId: user.id, state: 'raised' });
  can('SUBMIT', 'Finding', { authorId: user.id });
  can('WITHDRAW', 'Finding', { authorId: user.id, state: 'raised' });
  can(['CONFIRM_EFFECTIVE', 'NOT_EFFECTIVE'], 'Finding');
  can(['VERIFY', 'RETURN'], 'CorrectiveAction');
  can('create', 'Evidence');
  // Auditors hand out audit reports and finding records (PDF, JSON).
  can('export', ['Audit', 'Finding', 'CorrectiveAction']);
}

function qualityManagerRules({ can }: Builder) {
  can(['ISSUE', 'CLOSE', 'CANCEL'], 'Audit');
  can(['WITHDRAW', 'CLASSIFY', 'RECORD_CONTAINMENT', 'CONFIRM_EFFECTIVE', 'NOT_EFFECTIVE'], 'Finding');
  can(['assess_extent', 'decide_impact'], 'Finding');
  // Quality records inspections for any inspector (a batch from another shift, a paper record).
  can(['create', 'update'], 'Inspection');
  can('create', 'CorrectiveAction');
  can(['APPROVE_PLAN', 'RETURN_PLAN', 'VERIFY', 'RETURN', 'APPROVE_EXTENSION', 'REJECT_EXTENSION'], 'CorrectiveAction');
  can(['create', 'update'], ['Certification', 'Equipment']);
  can('create', 'Evidence');
  can('supersede', 'Evidence');
  can('export', 'all');
  can('verify', 'Trail');
}

function accountableManagerRules({ can }: Builder) {
  can('CLOSE', 'Finding');
  can('export', 'all');
  can('verify', 'Trail');
}

function actionOwnerRules({ can }: Builder, user: AbilityUser) {
  // The people who perform inspections record their own, named as the inspector; a correction is theirs or quality's.
  can('create', 'Inspection', { inspectorId: user.id });
  can('update', 'Inspection', { createdById: user.id });
  can(OWNER_ACTION_EVENTS, 'CorrectiveAction', { ownerId: user.id });
  // Evidence subjects carry the owning record's type and its owner (recordOwnerId).
  can('create', 'Evidence', { recordType: 'action', recordOwnerId: user.id });
}

function level3Rules(builder: Builder, user: AbilityUser) {
  const { can } = builder;
  can('create', 'Technique');
  can('update', 'Technique', { state: 'draft' });
  can('approve', 'Technique', { state: 'draft' });
  can('create', 'Evidence', { recordType: 'technique' });
  // A Level 3 corrects any inspection; records new ones as their own inspector (actionOwnerRules).
  can('update', 'Inspection');
  // Capability demonstrations: recorded, analysed and accepted (signed) by a Level 3.
  can(['create', 'update', 'approve'], 'Demonstration');
  actionOwnerRules(builder, user);
}

function adminRules({ can }: Builder) {
  can(['read', 'create', 'update', 'unlock'], 'User');
  can(['create', 'update'], 'Area');
  can('update', 'Policy');
  // Every record's timeline, people's sign-ins included (evidence timelines follow the file's read rule).
  can(['read', 'verify'], 'Trail');
  can('read', 'Mailbox');
  can('read', 'Notification');
  can(['create', 'update'], 'Material');
}

/** Audit events, every one of which an auditor of the audited area may not send. */
const AUDIT_EVENTS: AuditEvent[] = ['START_FIELDWORK', 'FINISH_FIELDWORK', 'ISSUE', 'CLOSE', 'CANCEL'];

/** Segregation of duties: these override every role above. */
function segregationRules({ cannot }: Builder, user: AbilityUser) {
  // Nobody approves or verifies their own work.
  cannot('approve', 'Technique', { createdById: user.id });
  cannot('approve', 'Technique', { updatedById: user.id });
  cannot(['APPROVE_PLAN', 'RETURN_PLAN', 'VERIFY', 'RETURN', 'APPROVE_EXTENSION', 'REJECT_EXTENSION'], 'CorrectiveAction', { ownerId: user.id });
  cannot(['CONFIRM_EFFECTIVE', 'NOT_EFFECTIVE'], 'Finding', { actionOwnerId: user.id });
  cannot('CLOSE', 'Finding', { authorId: user.id });
  cannot('CLOSE', 'Finding', { actionOwnerId: user.id });
  // Area independence: nobody plans, performs or moves on an audit of the area they belong to
  // (checked against the person's area now, so moving into the area ends their part in it).
  if (user.areaId !== null) {
    cannot(['create', ...AUDIT_EVENTS], 'Audit', { areaId: user.areaId });
    cannot(['create', 'update'], 'ChecklistRun', { areaId: user.areaId });
    cannot('create', 'Finding', { areaId: user.areaId, auditLeadAuditorId: { $exists: true } });
  }
  // Nobody gives themself a signing role; another administrator must.
  cannot('update', 'User', { id: user.id, grantsSigningRole: true });
  // Evidence is frozen once its record is closed, verified or approved: a later change is a new record or event.
  cannot(['create', 'supersede'], 'Evidence', { recordFrozen: true });
  // A result a containment decision rests on changes through the finding's impact worksheet only.
  cannot('update', 'Inspection', { hasContainmentDecision: true });
}

/**
 * Timelines: every record's, except people's (sign-ins, lockouts), which only
 * the person and administrators read. An evidence file's timeline also needs
 * the right to read the file itself (checked on the loaded file by the route).
 */
function trailReadRules({ can }: Builder, user: AbilityUser) {
  can('read', 'Trail', { recordType: { $ne: 'user' } });
  can('read', 'Trail', { recordType: 'user', recordId: String(user.id) });
}

/**
 * Evidence files are need-to-know: an account that only administers the system
 * does not open them, and certificates and vision-exam records are seen by the
 * person they belong to and by quality staff (auditor, quality and accountable manager).
 */
function evidenceReadRules({ can, cannot }: Builder, user: AbilityUser) {
  if (user.roles.every((role) => role === 'admin')) cannot('read', 'Evidence');
  const qualityStaff = user.roles.some((role) => role === 'auditor' || role === 'quality_manager' || role === 'accountable_manager');
  if (!qualityStaff) cannot('read', 'Evidence', { recordType: 'certification', recordOwnerId: { $ne: user.id } });
  can('create', 'Evidence', { recordType: 'certification', recordOwnerId: user.id });
}

export function defineAbilityFor(user: AbilityUser): AppAbility {
  const builder = new AbilityBuilder<AppAbility>(createMongoAbility);
  builder.can('read', READABLE);
  builder.can('read', 'User');
  // Everyone reads the messages Whorl sent them (administrators read everyone's: adminRules).
  builder.can('read', 'Notification', { toUserId: user.id });
  builder.can('supersede', 'Evidence', { uploadedById: user.id });
  const roleRules: Record<Role, (b: Builder, u: AbilityUser) => void> = {
    auditor: auditorRules,
    quality_manager: qualityManagerRules,
    accountable_manager: accountableManagerRules,
    level3: level3Rules,
    technician: actionOwnerRules,
    admin: adminRules,
  };
  trailReadRules(builder, user);
  for (const role of user.roles) roleRules[role](builder, user);
  segregationRules(builder, user);
  evidenceReadRules(builder, user);
  return builder.build();
}
