// The invented demo organisation: Tarnbrook Aero Components, a component-repair
// shop with three areas. Names are invented; e-mail addresses are the product's.
import { Area, RoleAssignment, User } from '../../models';
import { hashPassword } from '../../auth/passwords';
import { appendTrail } from '../../services/trail.service';
import type { Role } from '../../../shared/roles';
import { DEMO_PASSWORD, type SeedStep } from './seed-context';

export const DEMO_AREAS = [
  { code: 'WBS', name: 'Wheel and Brake Shop' },
  { code: 'STR', name: 'Structures Bay' },
  { code: 'RCV', name: 'Receiving Inspection' },
] as const;

export const DEMO_USERS: { key: string; email: string; displayName: string; roles: Role[]; area: string | null }[] = [
  { key: 'auditor', email: 'auditor@tarnbrook.example', displayName: 'Mara Quillon', roles: ['auditor'], area: null },
  { key: 'auditor2', email: 'auditor2@tarnbrook.example', displayName: 'Tobias Venn', roles: ['auditor'], area: 'STR' },
  { key: 'quality', email: 'quality@tarnbrook.example', displayName: 'Ines Harrow', roles: ['quality_manager'], area: null },
  { key: 'accountable', email: 'accountable@tarnbrook.example', displayName: 'Rafael Oduya', roles: ['accountable_manager'], area: null },
  { key: 'level3', email: 'level3@tarnbrook.example', displayName: 'Sunniva Brack', roles: ['level3'], area: 'WBS' },
  // A second Level 3: nobody approves a technique revision they wrote.
  { key: 'level3b', email: 'level3b@tarnbrook.example', displayName: 'Orla Dunmore', roles: ['level3'], area: null },
  { key: 'technician', email: 'technician@tarnbrook.example', displayName: 'Deniz Calloway', roles: ['technician'], area: 'RCV' },
  { key: 'admin', email: 'admin@tarnbrook.example', displayName: 'Petra Lowe', roles: ['admin'], area: null },
];

const AREA_LEADS: Record<string, string> = { WBS: 'level3', STR: 'auditor2', RCV: 'technician' };

export const seedPeople: SeedStep = async (context) => {
  const { sequelize } = context;
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await sequelize.transaction(async (transaction) => {
    for (const area of DEMO_AREAS) {
      const created = await Area.create({ code: area.code, name: area.name, leadUserId: null }, { transaction });
      context.areas[area.code] = { id: created.id, name: created.name };
    }
    for (const person of DEMO_USERS) {
      const user = await User.create(
        {
          email: person.email,
          displayName: person.displayName,
          passwordHash,
          areaId: person.area ? context.areas[person.area].id : null,
          lockedAt: null,
        },
        { transaction },
      );
      await RoleAssignment.bulkCreate(person.roles.map((role) => ({ userId: user.id, role })), { transaction });
      context.users[person.key] = { id: user.id, displayName: person.displayName, roles: person.roles };
      await appendTrail(sequelize, transaction, {
        userId: null,
        recordType: 'user',
        recordId: user.id,
        event: 'USER_CREATED',
        changes: { email: person.email, roles: person.roles, source: 'demo data' },
      });
    }
    for (const [code, key] of Object.entries(AREA_LEADS)) {
      await Area.update({ leadUserId: context.users[key].id }, { where: { id: context.areas[code].id }, transaction });
    }
  });
};
