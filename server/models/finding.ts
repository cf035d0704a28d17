import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { FindingClass, FindingState } from '../../machines';
import type { ResultValue } from '../../shared/domain/checklist';
import type { Area } from './area';
import type { Audit } from './audit';
import type { CorrectiveAction } from './corrective-action';
import type { User } from './user';

export class Finding extends Model<InferAttributes<Finding>, InferCreationAttributes<Finding>> {
  declare id: CreationOptional<number>;
  /** F-YYYY-NNNN, sequential per year without gaps. */
  declare number: string;
  declare auditId: number | null;
  declare techniqueId: number | null;
  declare techniqueCode: string | null;
  declare checklistRunId: number | null;
  declare resultIndex: number | null;
  declare title: string;
  /** The checklist rule or the clause of the criteria that is not met. */
  declare rule: string;
  declare requirement: string;
  declare objectiveEvidence: string;
  declare resultValues: Record<string, ResultValue> | null;
  declare class: FindingClass | null;
  declare classificationNote: string | null;
  declare containment: string | null;
  declare containmentDueDate: string | null;
  declare dueDate: string | null;
  declare effectivenessNote: string | null;
  declare notEffectiveReason: string | null;
  declare closureNote: string | null;
  declare withdrawReason: string | null;
  declare closedAt: Date | null;
  /** The finding whose extent-of-condition run this one was raised from. */
  declare extentOfId: CreationOptional<number | null>;
  declare proposedClass: CreationOptional<FindingClass | null>;
  /** The first day the impact worksheet lists inspections from; null: each affected revision's approval. */
  declare impactSince: CreationOptional<string | null>;
  declare authorId: number;
  declare areaId: number;
  declare state: FindingState;
  declare snapshot: unknown;
  declare machineVersion: number;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare author?: NonAttribute<User>;
  declare area?: NonAttribute<Area>;
  declare audit?: NonAttribute<Audit | null>;
  declare action?: NonAttribute<CorrectiveAction | null>;
  declare extentOf?: NonAttribute<Finding | null>;
  declare extentMembers?: NonAttribute<Finding[]>;
}

export function initFinding(sequelize: Sequelize) {
  Finding.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      number: { type: DataTypes.STRING(16), allowNull: false },
      auditId: { type: DataTypes.INTEGER, allowNull: true },
      techniqueId: { type: DataTypes.INTEGER, allowNull: true },
      techniqueCode: { type: DataTypes.STRING(64), allowNull: true },
      checklistRunId: { type: DataTypes.INTEGER, allowNull: true },
      resultIndex: { type: DataTypes.INTEGER, allowNull: true },
      title: { type: DataTypes.STRING(200), allowNull: false },
      rule: { type: DataTypes.STRING(200), allowNull: false },
      requirement: { type: DataTypes.TEXT, allowNull: false },
      objectiveEvidence: { type: DataTypes.TEXT, allowNull: false },
      resultValues: { type: DataTypes.JSON, allowNull: true },
      class: { type: DataTypes.STRING(16), allowNull: true },
      classificationNote: { type: DataTypes.TEXT, allowNull: true },
      containment: { type: DataTypes.TEXT, allowNull: true },
      containmentDueDate: { type: DataTypes.DATEONLY, allowNull: true },
      dueDate: { type: DataTypes.DATEONLY, allowNull: true },
      effectivenessNote: { type: DataTypes.TEXT, allowNull: true },
      notEffectiveReason: { type: DataTypes.TEXT, allowNull: true },
      closureNote: { type: DataTypes.TEXT, allowNull: true },
      withdrawReason: { type: DataTypes.TEXT, allowNull: true },
      closedAt: { type: DataTypes.DATE(3), allowNull: true },
      extentOfId: { type: DataTypes.INTEGER, allowNull: true },
      proposedClass: { type: DataTypes.STRING(16), allowNull: true },
      impactSince: { type: DataTypes.DATEONLY, allowNull: true },
      authorId: { type: DataTypes.INTEGER, allowNull: false },
      areaId: { type: DataTypes.INTEGER, allowNull: false },
      state: { type: DataTypes.STRING(32), allowNull: false },
      snapshot: { type: DataTypes.JSON, allowNull: false },
      machineVersion: { type: DataTypes.INTEGER, allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'findings', modelName: 'Finding', underscored: true, version: true },
  );
}
