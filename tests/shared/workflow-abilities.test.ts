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
