import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { CorrectiveActionState, PlanStep, RootCauseMethod } from '../../machines';
import type { Finding } from './finding';
import type { User } from './user';

export class CorrectiveAction extends Model<InferAttributes<CorrectiveAction>, InferCreationAttributes<CorrectiveAction>> {
  declare id: CreationOptional<number>;
  /** CA-YYYY-NNNN, sequential per year without gaps. */
  declare number: string;
  declare findingId: number;
  declare ownerId: number;
  /** Mirrors the machine's context.dueDate after every transition (the reminder jobs read this column). */
  declare dueDate: string;
  declare pendingExtension: { dueDate: string; reason: string } | null;
  declare method: RootCauseMethod | null;
  declare rootCause: string | null;
  declare plan: PlanStep[];
  declare submissionSummary: string | null;
  declare returnReason: string | null;
  declare reopenReason: string | null;
  declare verifiedAt: Date | null;
  declare createdById: number;
  declare state: CorrectiveActionState;
  declare snapshot: unknown;
  declare machineVersion: number;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare owner?: NonAttribute<User>;
  declare finding?: NonAttribute<Finding>;
}

export function initCorrectiveAction(sequelize: Sequelize) {
  CorrectiveAction.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      number: { type: DataTypes.STRING(16), allowNull: false },
      findingId: { type: DataTypes.INTEGER, allowNull: false },
      ownerId: { type: DataTypes.INTEGER, allowNull: false },
      dueDate: { type: DataTypes.DATEONLY, allowNull: false },
      pendingExtension: { type: DataTypes.JSON, allowNull: true },
      method: { type: DataTypes.STRING(32), allowNull: true },
      rootCause: { type: DataTypes.TEXT, allowNull: true },
      plan: { type: DataTypes.JSON, allowNull: false },
      submissionSummary: { type: DataTypes.TEXT, allowNull: true },
      returnReason: { type: DataTypes.TEXT, allowNull: true },
      reopenReason: { type: DataTypes.TEXT, allowNull: true },
      verifiedAt: { type: DataTypes.DATE(3), allowNull: true },
      createdById: { type: DataTypes.INTEGER, allowNull: false },
      state: { type: DataTypes.STRING(32), allowNull: false },
      snapshot: { type: DataTypes.JSON, allowNull: false },
      machineVersion: { type: DataTypes.INTEGER, allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'corrective_actions', modelName: 'CorrectiveAction', underscored: true, version: true },
  );
}
