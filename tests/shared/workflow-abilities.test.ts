// The workflow's role rules and segregation of duties, checked on plain records
// as the server checks them (positive and negative case for each).
import { describe, expect, it } from 'vitest';
import { subject } from '@casl/ability';
import { defineAbilityFor } from '../../shared/abilities';

const auditor = defineAbilityFor({ id: 1, roles: ['auditor'], areaId: null });
const areaAuditor = defineAbilityFor({ id: 2, roles: ['auditor'], areaId: 20 });
const quality = defineAbilityFor({ id: 3, roles: ['quality_manager'], areaId: null });
const accountable = defineAbilityFor({ id: 4, roles: ['accountable_manager'], areaId: null });
const owner = defineAbilityFor({ id: 5, roles: ['level3'], areaId: 10 });
const ownerAuditor = defineAbilityFor({ id: 6, roles: ['level3', 'auditor'], areaId: null });

describe('workflow role rules', () => {
  it('when an auditor plans an audit they lead of another area, then it is allowed; of their own area or led by someone else, then refused', () => {
    expect(auditor.can('create', subject('Audit', { leadAuditorId: 1, areaId: 20 }))).toBe(true);
    expect(auditor.can('create', subject('Audit', { leadAuditorId: 2, areaId: 20 }))).toBe(false);
    expect(areaAuditor.can('create', subject('Audit', { leadAuditorId: 2, areaId: 10 }))).toBe(true);
    expect(areaAuditor.can('create', subject('Audit', { leadAuditorId: 2, areaId: 20 }))).toBe(false);
    expect(areaAuditor.can('START_FIELDWORK', subject('Audit', { leadAuditorId: 2, areaId: 20 }))).toBe(false);
    expect(quality.can('create', subject('Audit', { leadAuditorId: 3, areaId: 20 }))).toBe(false);
  });

  it('when the lead auditor starts fieldwork, then allowed; anyone else, refused', () => {
    expect(auditor.can('START_FIELDWORK', subject('Audit', { leadAuditorId: 1, areaId: 20 }))).toBe(true);
    expect(auditor.can('START_FIELDWORK', subject('Audit', { leadAuditorId: 9, areaId: 20 }))).toBe(false);
    expect(quality.can('START_FIELDWORK', subject('Audit', { leadAuditorId: 1, areaId: 20 }))).toBe(false);
  });

  it('when the quality manager classifies, then allowed; the auditor, refused', () => {
    expect(quality.can('CLASSIFY', subject('Finding', { authorId: 1 }))).toBe(true);
    expect(auditor.can('CLASSIFY', subject('Finding', { authorId: 1 }))).toBe(false);
  });

  it('when the owner verifies their own action, then refused; another reviewer, allowed', () => {
    expect(ownerAuditor.can('VERIFY', subject('CorrectiveAction', { ownerId: 6 }))).toBe(false);
    expect(ownerAuditor.can('VERIFY', subject('CorrectiveAction', { ownerId: 5 }))).toBe(true);
    expect(owner.can('VERIFY', subject('CorrectiveAction', { ownerId: 9 }))).toBe(false);
  });

  it('when the action owner checks effectiveness of their own work, then refused; an auditor who is not the owner, allowed', () => {
    expect(ownerAuditor.can('CONFIRM_EFFECTIVE', subject('Finding', { authorId: 1, actionOwnerId: 6 }))).toBe(false);
    expect(auditor.can('CONFIRM_EFFECTIVE', subject('Finding', { authorId: 1, actionOwnerId: 6 }))).toBe(true);
  });

  it('when the accountable manager closes a finding they neither wrote nor own the action of, then allowed; otherwise refused', () => {
    expect(accountable.can('CLOSE', subject('Finding', { authorId: 1, actionOwnerId: 5 }))).toBe(true);
    expect(accountable.can('CLOSE', subject('Finding', { authorId: 4, actionOwnerId: 5 }))).toBe(false);
    expect(accountable.can('CLOSE', subject('Finding', { authorId: 1, actionOwnerId: 4 }))).toBe(false);
    expect(quality.can('CLOSE', subject('Finding', { authorId: 1, actionOwnerId: 5 }))).toBe(false);
  });

  it('when the owner starts their own action, then allowed; someone else’s, refused', () => {
    expect(owner.can('START', subject('CorrectiveAction', { ownerId: 5 }))).toBe(true);
    expect(owner.can('START', subject('CorrectiveAction', { ownerId: 6 }))).toBe(false);
  });
});

const qualityOwner = defineAbilityFor({ id: 7, roles: ['quality_manager', 'technician'], areaId: null });
const admin = defineAbilityFor({ id: 8, roles: ['admin'], areaId: null });
const otherLevel3 = defineAbilityFor({ id: 9, roles: ['level3'], areaId: null });
const technician = defineAbilityFor({ id: 10, roles: ['technician'], areaId: 10 });

describe('segregation of duties', () => {
  it('when a Level 3 approves a revision another Level 3 wrote and last edited, then allowed; one they created or last edited, refused', () => {
    expect(otherLevel3.can('approve', subject('Technique', { state: 'draft', createdById: 5, updatedById: 5 }))).toBe(true);
    expect(owner.can('approve', subject('Technique', { state: 'draft', createdById: 5, updatedById: 5 }))).toBe(false);
    expect(owner.can('approve', subject('Technique', { state: 'draft', createdById: 9, updatedById: 5 }))).toBe(false);
  });

  it('when a quality manager approves the plan of someone else’s action, then allowed; of their own action, refused', () => {
    expect(qualityOwner.can('APPROVE_PLAN', subject('CorrectiveAction', { ownerId: 5 }))).toBe(true);
    expect(qualityOwner.can('APPROVE_PLAN', subject('CorrectiveAction', { ownerId: 7 }))).toBe(false);
    expect(qualityOwner.can('RETURN_PLAN', subject('CorrectiveAction', { ownerId: 7 }))).toBe(false);
  });

  it('when a quality manager decides an extension of someone else’s action, then allowed; of their own action, refused', () => {
    for (const event of ['APPROVE_EXTENSION', 'REJECT_EXTENSION'] as const) {
      expect(qualityOwner.can(event, subject('CorrectiveAction', { ownerId: 5 })), event).toBe(true);
      expect(qualityOwner.can(event, subject('CorrectiveAction', { ownerId: 7 })), event).toBe(false);
    }
    // The owner may still ask for one.
    expect(qualityOwner.can('REQUEST_EXTENSION', subject('CorrectiveAction', { ownerId: 7 }))).toBe(true);
  });

  it('when an auditor of another area works on an audit, then every audit action is allowed; once in the audited area, every one is refused', () => {
    const audit = { leadAuditorId: 2, areaId: 10, state: 'fieldwork' };
    const outside = areaAuditor; // area 20
    const inside = defineAbilityFor({ id: 2, roles: ['auditor'], areaId: 10 });
    for (const event of ['START_FIELDWORK', 'FINISH_FIELDWORK'] as const) {
      expect(outside.can(event, subject('Audit', { ...audit })), event).toBe(true);
      expect(inside.can(event, subject('Audit', { ...audit })), event).toBe(false);
    }
    expect(outside.can('create', subject('ChecklistRun', { ...audit }))).toBe(true);
    expect(inside.can('create', subject('ChecklistRun', { ...audit }))).toBe(false);
    expect(outside.can('update', subject('ChecklistRun', { ...audit, auditState: 'fieldwork' }))).toBe(true);
    expect(inside.can('update', subject('ChecklistRun', { ...audit, auditState: 'fieldwork' }))).toBe(false);
    expect(outside.can('create', subject('Finding', { auditLeadAuditorId: 2, areaId: 10 }))).toBe(true);
    expect(inside.can('create', subject('Finding', { auditLeadAuditorId: 2, areaId: 10 }))).toBe(false);
    // Issuing, closing and cancelling follow the same independence for whoever belongs to the area.
    const areaQuality = defineAbilityFor({ id: 11, roles: ['quality_manager'], areaId: 10 });
    expect(quality.can('ISSUE', subject('Audit', { ...audit }))).toBe(true);
    expect(areaQuality.can('ISSUE', subject('Audit', { ...audit }))).toBe(false);
  });

  it('when an administrator changes another person’s roles to include a signing role, then allowed; their own, refused (other own changes allowed)', () => {
    expect(admin.can('update', subject('User', { id: 3, grantsSigningRole: true }))).toBe(true);
    expect(admin.can('update', subject('User', { id: 8, grantsSigningRole: true }))).toBe(false);
    expect(admin.can('update', subject('User', { id: 8, grantsSigningRole: false }))).toBe(true);
  });

  it('when evidence belongs to an open record, then its owner adds and supersedes; once the record is closed, verified or approved, nobody does', () => {
    // subject() tags the object it is given, so each check gets a fresh one.
    const open = () => ({ recordType: 'action', recordOwnerId: 5, uploadedById: 5, recordFrozen: false });
    const frozen = () => ({ ...open(), recordFrozen: true });
    expect(owner.can('create', subject('Evidence', open()))).toBe(true);
    expect(owner.can('supersede', subject('Evidence', open()))).toBe(true);
    expect(quality.can('supersede', subject('Evidence', open()))).toBe(true);
    expect(owner.can('create', subject('Evidence', frozen()))).toBe(false);
    expect(owner.can('supersede', subject('Evidence', frozen()))).toBe(false);
    expect(quality.can('supersede', subject('Evidence', frozen()))).toBe(false);
    expect(quality.can('create', subject('Evidence', frozen()))).toBe(false);
  });

  it('when someone reads a person’s timeline, then that person and administrators may; anyone else may not (record timelines stay open)', () => {
    expect(technician.can('read', subject('Trail', { recordType: 'user', recordId: '10' }))).toBe(true);
    expect(admin.can('read', subject('Trail', { recordType: 'user', recordId: '10' }))).toBe(true);
    expect(quality.can('read', subject('Trail', { recordType: 'user', recordId: '10' }))).toBe(false);
    expect(technician.can('read', subject('Trail', { recordType: 'user', recordId: '3' }))).toBe(false);
    expect(technician.can('read', subject('Trail', { recordType: 'finding', recordId: '1' }))).toBe(true);
  });

  it('when a technician records an inspection, then only as its inspector; a quality manager records for anyone', () => {
    expect(technician.can('create', subject('Inspection', { inspectorId: 10 }))).toBe(true);
    expect(technician.can('create', subject('Inspection', { inspectorId: 5 }))).toBe(false);
    expect(owner.can('create', subject('Inspection', { inspectorId: 10 }))).toBe(false);
    expect(quality.can('create', subject('Inspection', { inspectorId: 10 }))).toBe(true);
  });

  it('when an inspection has no containment decision, then its recorder corrects it; with one, nobody does outside the worksheet', () => {
    expect(technician.can('update', subject('Inspection', { createdById: 10, hasContainmentDecision: false }))).toBe(true);
    expect(technician.can('update', subject('Inspection', { createdById: 10, hasContainmentDecision: true }))).toBe(false);
    expect(quality.can('update', subject('Inspection', { createdById: 10, hasContainmentDecision: true }))).toBe(false);
  });
});
