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
import { presentUser } from '../presenters/user.presenter';

const SORTABLE = ['displayName', 'email', 'createdAt'] as const;

export async function listUsers(query: z.infer<typeof UserListQuerySchema>): Promise<ListResponse<UserView>> {
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
  return { items: rows.map(presentUser), total: count };
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

export async function createUser({ sequelize }: AppDeps, actorId: number, input: UserCreateInput): Promise<UserView> {
  await requireArea(input.areaId);
  const passwordHash = await hashPassword(input.password);
  const id = await sequelize.transaction(async (transaction) => {
    const user = await User.create(
      { email: input.email, displayName: input.displayName, passwordHash, areaId: input.areaId, lockedAt: null },
      { transaction },
    );
    await RoleAssignment.bulkCreate(input.roles.map((role) => ({ userId: user.id, role })), { transaction });
    await appendTrail(sequelize, transaction, {
      userId: actorId,
      recordType: 'user',
      recordId: user.id,
      event: 'USER_CREATED',
      changes: { email: input.email, displayName: input.displayName, roles: input.roles, areaId: input.areaId },
    });
    return user.id;
  });
  return presentUser((await User.findByPk(id, { include: userIncludes }))!);
}

export async function updateUser({ sequelize }: AppDeps, actorId: number, id: number, input: UserUpdateInput): Promise<UserView> {
  await requireArea(input.areaId);
  const passwordHash = input.password ? await hashPassword(input.password) : undefined;
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
      changes.password = { before: '(set)', after: '(changed)' };
    }
    if (input.roles) {
      const before = user.roles;
      const after = [...new Set(input.roles)].sort();
      if (before.join() !== after.join()) {
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
      await sequelize.query(`DELETE FROM sessions WHERE data LIKE ?`, {
        replacements: [`%"passport":{"user":${id}}%`],
        transaction,
      });
    }
  });
  return presentUser((await User.findByPk(id, { include: userIncludes }))!);
}

export async function unlockUser({ sequelize }: AppDeps, actorId: number, id: number): Promise<UserView> {
  await sequelize.transaction(async (transaction) => {
    const user = await User.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw notFound('User');
    if (!user.lockedAt && user.failedSignIns === 0) return;
    const before = { lockedAt: user.lockedAt?.toISOString() ?? null, failedSignIns: user.failedSignIns };
    user.lockedAt = null;
    user.failedSignIns = 0;
    await user.save({ transaction });
    await appendTrail(sequelize, transaction, {
      userId: actorId,
      recordType: 'user',
      recordId: id,
      event: 'ACCOUNT_UNLOCKED',
      changes: { lockedAt: { before: before.lockedAt, after: null }, failedSignIns: { before: before.failedSignIns, after: 0 } },
    });
  });
  return presentUser((await User.findByPk(id, { include: userIncludes }))!);
}
