// Administration of people: create, edit, assign roles and area, deactivate
// (never delete) and unlock. Every change is a trail entry in the same transaction.
import { Op, type WhereOptions } from 'sequelize';
import type { AppDeps } from '../app-deps';
import { Area, RoleAssignment, User } from '../models';
import { hashPassword } from '../auth/passwords';
import { appendTrail } from './trail.service';
import { userIncludes } from './user-loader';
import { AppError, notFound, staleVersion } from '../lib/app-error';
import { parseSort, type ListResponse } from '../../shared/schemas/common';
import type { UserCreateInput, UserUpdateInput, UserView } from '../../shared/schemas/user';
import type { z } from 'zod';
import type { UserListQuerySchema } from '../../shared/schemas/user';
import { presentUser, type UserAudience } from '../presenters/user.presenter';
import { subject } from '@casl/ability';
import type { AppAbility } from '../../shared/abilities';
import { SIGNING_ROLES } from '../../shared/schemas/user';
import { passwordProblem } from '../auth/password-policy';
import { clearAccountLock } from '../auth/sign-in.service';
import { endSessionsOf } from '../auth/session-revocation';

const SORTABLE = ['displayName', 'email', 'createdAt'] as const;

export async function listUsers(
  query: z.infer<typeof UserListQuerySchema>,
  audience?: UserAudience,
): Promise<ListResponse<UserView>> {
  const where: WhereOptions = {};
  const and: WhereOptions[] = [];
  if (query.q) {
    const like = `%${query.q}%`;
    and.push({ [Op.or]: [{ displayName: { [Op.like]: like } }, { email: { [Op.like]: like } }] });
  }
  if (query.active) and.push({ active: query.active === 'true' });
  if (query.role) {
    and.push({ id: { [Op.in]: RoleAssignment.sequelize!.literal(`(SELECT user_id FROM role_assignments WHERE role = ${RoleAssignment.sequelize!.escape(query.role)})`) } });
  }
  if (and.length) Object.assign(where, { [Op.and]: and });
  const sort = parseSort(query.sort, SORTABLE, 'displayName');
  const { rows, count } = await User.findAndCountAll({
    where,
    include: userIncludes,
    order: [[sort.field, sort.direction], ['id', 'ASC']],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
    distinct: true,
  });
  return { items: rows.map((row) => presentUser(row, audience)), total: count };
}

async function requireArea(areaId: number | null | undefined) {
  if (areaId == null) return;
  if (!(await Area.findByPk(areaId))) {
    throw new AppError('Some body fields are not valid', {
      status: 400,
      code: 'invalid_input',
      details: [{ path: 'areaId', message: 'no such area' }],
    });
  }
}

/** The administrator acting: who they are, their rules, and their session (kept when their own sessions end). */
export interface AdminActor {
  id: number;
  ability: AppAbility;
  sid?: string;
}

function refusePassword(password: string, email: string) {
  const problem = passwordProblem(password, { email });
  if (problem) {
    throw new AppError('Some body fields are not valid', { status: 400, code: 'invalid_input', details: [{ path: 'password', message: problem }] });
  }
}

const adminView = (now: Date): UserAudience => ({ administrator: true, now });

export async function createUser({ sequelize, clock }: AppDeps, actor: AdminActor, input: UserCreateInput): Promise<UserView> {
  const actorId = actor.id;
  await requireArea(input.areaId);
  refusePassword(input.password, input.email);
  const passwordHash = await hashPassword(input.password);
  const id = await sequelize.transaction(async (transaction) => {
    const user = await User.create(
      // The administrator knows this password: the person replaces it at first sign-in.
      { email: input.email, displayName: input.displayName, passwordHash, areaId: input.areaId, passwordChangeRequired: true },
      { transaction },
    );
    await RoleAssignment.bulkCreate(input.roles.map((role) => ({ userId: user.id, role })), { transaction });
    await appendTrail(sequelize, transaction, {
      userId: actorId,
      recordType: 'user',
      recordId: user.id,
      event: 'USER_CREATED',
      changes: { email: input.email, displayName: input.displayName, roles: input.roles, areaId: input.areaId, passwordChangeRequired: true },
    });
    return user.id;
  });
  return presentUser((await User.findByPk(id, { include: userIncludes }))!, adminView(clock.now()));
}

export async function updateUser({ sequelize, clock }: AppDeps, actor: AdminActor, id: number, input: UserUpdateInput): Promise<UserView> {
  const actorId = actor.id;
  await requireArea(input.areaId);
  let passwordHash: string | undefined;
  if (input.password) {
    const target = await User.findByPk(id, { attributes: ['email'] });
    if (!target) throw notFound('User');
    refusePassword(input.password, target.email);
    passwordHash = await hashPassword(input.password);
  }
  let endSessions = false;
  await sequelize.transaction(async (transaction) => {
    const user = await User.findByPk(id, { include: userIncludes, transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw notFound('User');
    if (user.version !== input.version) throw staleVersion();
    if (input.active === false && id === actorId) {
      throw new AppError('You cannot deactivate your own account', { status: 422, code: 'not_allowed_now' });
    }
    const changes: Record<string, { before: unknown; after: unknown }> = {};
    const setField = <K extends 'displayName' | 'areaId' | 'active' | 'mailDigest'>(key: K, value: User[K] | undefined) => {
      if (value === undefined || user[key] === value) return;
      changes[key] = { before: user[key], after: value };
      user.set(key, value);
    };
    setField('displayName', input.displayName);
    setField('areaId', input.areaId);
    setField('active', input.active);
    setField('mailDigest', input.mailDigest);
    if (passwordHash) {
      user.passwordHash = passwordHash;
      // A password someone else chose is known to them: its holder replaces it at next sign-in.
      const mustChange = id !== actorId;
      changes.password = { before: '(set)', after: mustChange ? '(reset; to be changed at next sign-in)' : '(changed)' };
      if (user.passwordChangeRequired !== mustChange) changes.passwordChangeRequired = { before: user.passwordChangeRequired, after: mustChange };
      user.passwordChangeRequired = mustChange;
      endSessions = true;
    }
    if (input.roles) {
      const before = user.roles;
      const after = [...new Set(input.roles)].sort();
      const granted = after.filter((role) => !before.includes(role));
      const grantsSigningRole = granted.some((role) => (SIGNING_ROLES as readonly string[]).includes(role));
      if (!actor.ability.can('update', subject('User', { id, grantsSigningRole }))) {
        throw new AppError('You cannot give yourself a signing role (quality manager, accountable manager); another administrator must', {
          status: 403,
          code: 'forbidden',
        });
      }
      if (before.join() !== after.join()) {
        endSessions = true;
        await RoleAssignment.destroy({ where: { userId: id }, transaction });
        await RoleAssignment.bulkCreate(after.map((role) => ({ userId: id, role })), { transaction });
        changes.roles = { before, after };
        user.changed('updatedAt', true);
      }
    }
    if (Object.keys(changes).length === 0) return;
    await user.save({ transaction });
    await appendTrail(sequelize, transaction, {
      userId: actorId,
      recordType: 'user',
      recordId: id,
      event: input.active === false && changes.active ? 'USER_DEACTIVATED' : 'USER_UPDATED',
      changes,
    });
    if (changes.active && input.active === false) {
      // Sessions of a deactivated user stop working at once (the session loader also refuses them).
      await endSessionsOf(sequelize, id, { transaction });
    } else if (endSessions) {
      // A new password or new roles: every other session of that person ends (the actor's own stays).
      await endSessionsOf(sequelize, id, { exceptSid: actor.sid, transaction });
    }
  });
  return presentUser((await User.findByPk(id, { include: userIncludes }))!, adminView(clock.now()));
}

export async function unlockUser({ sequelize, clock }: AppDeps, actor: AdminActor, id: number): Promise<UserView> {
  if (!(await User.findByPk(id, { attributes: ['id'] }))) throw notFound('User');
  await clearAccountLock(sequelize, id, actor.id);
  return presentUser((await User.findByPk(id, { include: userIncludes }))!, adminView(clock.now()));
}
