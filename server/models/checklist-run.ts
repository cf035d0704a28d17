import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { ChecklistOutput } from '../../shared/domain/checklist';
import type { Technique } from '../../shared/schemas/technique';
import type { User } from './user';

/** One checklist evaluation of one technique during an audit, with the auditor's notes per result. */
export class ChecklistRun extends Model<InferAttributes<ChecklistRun>, InferCreationAttributes<ChecklistRun>> {
  declare id: CreationOptional<number>;
  declare auditId: number;
  declare techniqueId: number | null;
  declare techniqueCode: string;
  declare techniqueRevision: string;
  declare technique: Technique;
  declare output: ChecklistOutput;
  declare verdict: string;
  /** CHECKLIST_ENGINE_VERSION when the run was made. */
  declare engineVersion: string;
  /** Keyed by the result's index in output.results. */
  declare notes: Record<string, string>;
  declare runById: number;
  declare runAt: Date;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare runBy?: NonAttribute<User>;
}

export function initChecklistRun(sequelize: Sequelize) {
  ChecklistRun.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      auditId: { type: DataTypes.INTEGER, allowNull: false },
      techniqueId: { type: DataTypes.INTEGER, allowNull: true },
      techniqueCode: { type: DataTypes.STRING(64), allowNull: false },
      techniqueRevision: { type: DataTypes.STRING(32), allowNull: false },
      technique: { type: DataTypes.JSON, allowNull: false },
      output: { type: DataTypes.JSON, allowNull: false },
      verdict: { type: DataTypes.STRING(32), allowNull: false },
      engineVersion: { type: DataTypes.STRING(20), allowNull: false },
      notes: { type: DataTypes.JSON, allowNull: false },
      runById: { type: DataTypes.INTEGER, allowNull: false },
      runAt: { type: DataTypes.DATE(3), allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'checklist_runs', modelName: 'ChecklistRun', underscored: true, version: true },
  );
}
