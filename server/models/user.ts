import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { Role } from '../../shared/roles';
import type { Area } from './area';
import type { RoleAssignment } from './role-assignment';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare displayName: string;
  declare passwordHash: string;
  declare areaId: number | null;
  declare active: CreationOptional<boolean>;
  declare failedSignIns: CreationOptional<number>;
  /** Left from permanent locks; no longer set (see lockedUntil). */
  declare lockedAt: CreationOptional<Date | null>;
  /** A temporary lock after failed passwords: sign-in is refused until then. */
  declare lockedUntil: CreationOptional<Date | null>;
  /** Locks in a row without a successful sign-in: each lock lasts twice as long as the one before. */
  declare lockouts: CreationOptional<number>;
  /** Set when an administrator chose this person's password: they choose their own at next sign-in. */
  declare passwordChangeRequired: CreationOptional<boolean>;
  declare mailDigest: CreationOptional<boolean>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare area?: NonAttribute<Area | null>;
  declare roleAssignments?: NonAttribute<RoleAssignment[]>;

  get roles(): NonAttribute<Role[]> {
    return (this.roleAssignments ?? []).map((assignment) => assignment.role).sort();
  }
}

export function initUser(sequelize: Sequelize) {
  User.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      email: { type: DataTypes.STRING(254), allowNull: false },
      displayName: { type: DataTypes.STRING(120), allowNull: false },
      passwordHash: { type: DataTypes.STRING(255), allowNull: false },
      areaId: { type: DataTypes.INTEGER, allowNull: true },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      failedSignIns: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      lockedAt: { type: DataTypes.DATE(3), allowNull: true },
      lockedUntil: { type: DataTypes.DATE(3), allowNull: true },
      lockouts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      passwordChangeRequired: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      mailDigest: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'users', modelName: 'User', version: true },
  );
}
