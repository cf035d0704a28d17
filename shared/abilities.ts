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
  can(['create', 'update'], 'Inspection');
  can('create', 'CorrectiveAction');
  can(['APPROVE_PLAN', 'RETURN_PLAN', 'VERIFY', 'RETURN', 'APPROVE_EXTENSION', 'REJECT_EXTENSION'], 'CorrectiveAction');
  can(['create', 'update'], ['Certification', 'Equipment']);
  can('create', 'Evidence');
  can('supersede', 'Evidence');
  can('export', 'all');
  can(['read', 'verify'], 'Trail');
}

function accountableManagerRules({ can }: Builder) {
  can('CLOSE', 'Finding');
  can('export', 'all');
  can(['read', 'verify'], 'Trail');
}

function actionOwnerRules({ can }: Builder, user: AbilityUser) {
  // The people who perform inspections record them; a correction is theirs or quality's.
  can('create', 'Inspection');
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
  can(['create', 'update'], 'Inspection');
  // Capability demonstrations: recorded, analysed and accepted (signed) by a Level 3.
  can(['create', 'update', 'approve'], 'Demonstration');
  actionOwnerRules(builder, user);
}

function adminRules({ can }: Builder) {
  can(['read', 'create', 'update', 'unlock'], 'User');
  can(['create', 'update'], 'Area');
  can('update', 'Policy');
  can(['read', 'verify'], 'Trail');
  can('read', 'Mailbox');
  can(['create', 'update'], 'Material');
}

/** Segregation of duties: these override every role above. */
function segregationRules({ cannot }: Builder, user: AbilityUser) {
  cannot(['VERIFY', 'RETURN'], 'CorrectiveAction', { ownerId: user.id });
  cannot(['CONFIRM_EFFECTIVE', 'NOT_EFFECTIVE'], 'Finding', { actionOwnerId: user.id });
  cannot('CLOSE', 'Finding', { authorId: user.id });
  cannot('CLOSE', 'Finding', { actionOwnerId: user.id });
  // An auditor never audits an area they belong to (neither plans nor performs it).
  if (user.areaId !== null) cannot(['create', 'START_FIELDWORK', 'FINISH_FIELDWORK'], 'Audit', { areaId: user.areaId });
  // A supersede by the uploader is always allowed (granted below); a quality manager may supersede others'.
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
  builder.can('supersede', 'Evidence', { uploadedById: user.id });
  const roleRules: Record<Role, (b: Builder, u: AbilityUser) => void> = {
    auditor: auditorRules,
    quality_manager: qualityManagerRules,
    accountable_manager: accountableManagerRules,
    level3: level3Rules,
    technician: actionOwnerRules,
    admin: adminRules,
  };
  for (const role of user.roles) roleRules[role](builder, user);
  segregationRules(builder, user);
  evidenceReadRules(builder, user);
  return builder.build();
}
