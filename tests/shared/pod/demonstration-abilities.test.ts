import { describe, expect, it } from 'vitest';
import { defineAbilityFor } from '../../../shared/abilities';
import { ROLES, type Role } from '../../../shared/roles';

const ability = (role: Role) => defineAbilityFor({ id: 1, roles: [role], areaId: null });

describe('capability demonstration role rules', () => {
  it('when a Level 3, then demonstrations may be recorded, corrected, analysed and accepted', () => {
    for (const action of ['read', 'create', 'update', 'approve']) expect(ability('level3').can(action, 'Demonstration'), action).toBe(true);
  });

  it('when any other role, then demonstrations may be read only', () => {
    for (const role of ROLES.filter((r) => r !== 'level3')) {
      expect(ability(role).can('read', 'Demonstration'), role).toBe(true);
      for (const action of ['create', 'update', 'approve']) expect(ability(role).can(action, 'Demonstration'), `${role} ${action}`).toBe(false);
    }
  });
});
