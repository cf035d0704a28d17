// Every model is initialised and associated here, once per Sequelize instance.
// Add a model: write its file with an init function, call it below, wire its associations.
import type { Sequelize } from 'sequelize';
import { Area, initArea } from './area';
import { User, initUser } from './user';
import { RoleAssignment, initRoleAssignment } from './role-assignment';
import { TrailEntry, initTrailEntry, type TrailChanges } from './trail-entry';
import { Session, initSession } from './session';
import { Audit, initAudit, type AuditScopeTechnique } from './audit';
import { ChecklistRun, initChecklistRun } from './checklist-run';
import { Finding, initFinding } from './finding';
import { CorrectiveAction, initCorrectiveAction } from './corrective-action';
import { Signature, initSignature } from './signature';
import { Certification, initCertification } from './certification';
import { Equipment, initEquipment } from './equipment';
import { ReferenceNotch, initReferenceNotch } from './reference-notch';
import { TechniqueEquipment, TechniquePerformer, initTechniqueLinks } from './technique-link';
import { Material, initMaterial } from './material';
import { Technique, initTechnique } from './technique';
import { TechniqueRevision, initTechniqueRevision } from './technique-revision';
import { PolicyHead, PolicySetting, initPolicySetting } from './policy-setting';
import { EvidenceFile, initEvidenceFile } from './evidence-file';
import { OutboxMessage, initOutboxMessage, type OutboxStatus } from './outbox-message';
import { CaughtMail, initCaughtMail } from './caught-mail';
import { Inspection, initInspection } from './inspection';
import { ExtentRun, initExtentRun } from './extent-run';
import { ContainmentDecision, initContainmentDecision } from './containment-decision';
import { PodDemonstration, initPodDemonstration } from './pod-demonstration';

export { Area, User, RoleAssignment, TrailEntry, Session };
export { Certification, Equipment, ReferenceNotch, TechniqueEquipment, TechniquePerformer };
export { Material, Technique, TechniqueRevision, PolicySetting, PolicyHead };
export { EvidenceFile, OutboxMessage, CaughtMail };
export type { TrailChanges, OutboxStatus };
export { Audit, ChecklistRun, Finding, CorrectiveAction, Signature };
export type { AuditScopeTechnique };
export { Inspection, ExtentRun, ContainmentDecision };
export { PodDemonstration };

let initialisedFor: Sequelize | undefined;

/** Binds every model to this instance (idempotent; a different instance rebinds them). */
export function initModels(sequelize: Sequelize): void {
  if (initialisedFor === sequelize) return;
  initialisedFor = sequelize;
  initArea(sequelize);
  initUser(sequelize);
  initRoleAssignment(sequelize);
  initTrailEntry(sequelize);
  initSession(sequelize);
  initCertification(sequelize);
  initEquipment(sequelize);
  initReferenceNotch(sequelize);
  initTechniqueLinks(sequelize);
  initMaterial(sequelize);
  initTechnique(sequelize);
  initTechniqueRevision(sequelize);
  initPolicySetting(sequelize);
  initEvidenceFile(sequelize);
  initOutboxMessage(sequelize);
  initCaughtMail(sequelize);

  User.belongsTo(Area, { as: 'area', foreignKey: 'areaId' });
  Area.hasMany(User, { as: 'members', foreignKey: 'areaId' });
  Area.belongsTo(User, { as: 'lead', foreignKey: 'leadUserId', constraints: false });
  User.hasMany(RoleAssignment, { as: 'roleAssignments', foreignKey: 'userId' });
  RoleAssignment.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  Certification.belongsTo(User, { as: 'person', foreignKey: 'userId' });
  Equipment.hasMany(ReferenceNotch, { as: 'notches', foreignKey: 'equipmentId' });
  Technique.belongsTo(Area, { as: 'area', foreignKey: 'areaId' });
  Technique.hasMany(TechniqueRevision, { as: 'revisions', foreignKey: 'techniqueId' });
  Technique.hasOne(TechniqueRevision, { as: 'latestRevision', foreignKey: 'techniqueId' });
  TechniqueRevision.belongsTo(Technique, { as: 'technique', foreignKey: 'techniqueId' });
  TechniqueRevision.belongsTo(User, { as: 'approvedBy', foreignKey: 'approvedById' });
  TechniqueRevision.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
  TechniqueRevision.belongsTo(User, { as: 'updatedBy', foreignKey: 'updatedById' });
  PolicySetting.belongsTo(User, { as: 'updatedBy', foreignKey: 'updatedById' });
  PolicyHead.belongsTo(User, { as: 'updatedBy', foreignKey: 'updatedById' });
  EvidenceFile.belongsTo(User, { as: 'uploadedBy', foreignKey: 'uploadedById' });
  EvidenceFile.belongsTo(User, { as: 'supersededBy', foreignKey: 'supersededById' });

  initWorkflowModels();
  initImpactModels();
  initPodDemonstration(sequelize);
  PodDemonstration.belongsTo(TechniqueRevision, { as: 'revision', foreignKey: 'techniqueRevisionId' });
}

/** Audits, checklist runs, findings, corrective actions and signatures (the workflow records). */
function initWorkflowModels(): void {
  const sequelize = initialisedFor!;
  initAudit(sequelize);
  initChecklistRun(sequelize);
  initFinding(sequelize);
  initCorrectiveAction(sequelize);
  initSignature(sequelize);
  Audit.belongsTo(Area, { as: 'area', foreignKey: 'areaId' });
  Audit.belongsTo(User, { as: 'leadAuditor', foreignKey: 'leadAuditorId' });
  Audit.hasMany(Finding, { as: 'findings', foreignKey: 'auditId' });
  Audit.hasMany(ChecklistRun, { as: 'checklistRuns', foreignKey: 'auditId' });
  ChecklistRun.belongsTo(User, { as: 'runBy', foreignKey: 'runById' });
  Finding.belongsTo(Audit, { as: 'audit', foreignKey: 'auditId' });
  Finding.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  Finding.belongsTo(Area, { as: 'area', foreignKey: 'areaId' });
  Finding.hasOne(CorrectiveAction, { as: 'action', foreignKey: 'findingId' });
  CorrectiveAction.belongsTo(Finding, { as: 'finding', foreignKey: 'findingId' });
  CorrectiveAction.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' });
}

/** Inspections performed with technique revisions, extent runs and containment decisions. */
function initImpactModels(): void {
  const sequelize = initialisedFor!;
  initInspection(sequelize);
  initExtentRun(sequelize);
  initContainmentDecision(sequelize);
  Inspection.belongsTo(Technique, { as: 'technique', foreignKey: 'techniqueId' });
  Inspection.belongsTo(TechniqueRevision, { as: 'techniqueRevision', foreignKey: 'techniqueRevisionId' });
  Inspection.belongsTo(User, { as: 'inspector', foreignKey: 'inspectorId' });
  Inspection.belongsTo(Equipment, { as: 'instrument', foreignKey: 'instrumentId' });
  Inspection.belongsTo(Equipment, { as: 'probe', foreignKey: 'probeId' });
  Inspection.belongsTo(Equipment, { as: 'referenceStandard', foreignKey: 'referenceStandardId' });
  ExtentRun.belongsTo(User, { as: 'runBy', foreignKey: 'runById' });
  ContainmentDecision.belongsTo(User, { as: 'decidedBy', foreignKey: 'decidedById' });
  ContainmentDecision.belongsTo(Inspection, { as: 'inspection', foreignKey: 'inspectionId' });
  Finding.belongsTo(Finding, { as: 'extentOf', foreignKey: 'extentOfId' });
  Finding.hasMany(Finding, { as: 'extentMembers', foreignKey: 'extentOfId' });
}
