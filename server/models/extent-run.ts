import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { ExtentTechnique } from '../../shared/schemas/extent';
import type { User } from './user';

/** One extent-of-condition run from a finding: every approved revision evaluated for the finding's rule. Never changed once written. */
export class ExtentRun extends Model<InferAttributes<ExtentRun>, InferCreationAttributes<ExtentRun>> {
  declare id: CreationOptional<number>;
  declare findingId: number;
  declare rule: string;
  declare flawOrientation: string | null;
  declare coilType: string | null;
  declare engineVersion: string;
  declare policyVersion: number;
  declare techniques: ExtentTechnique[];
  declare runById: number;
  declare runAt: Date;

  declare runBy?: NonAttribute<User>;
}

export function initExtentRun(sequelize: Sequelize) {
  ExtentRun.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      findingId: { type: DataTypes.INTEGER, allowNull: false },
      rule: { type: DataTypes.STRING(40), allowNull: false },
      flawOrientation: { type: DataTypes.STRING(20), allowNull: true },
      coilType: { type: DataTypes.STRING(20), allowNull: true },
      engineVersion: { type: DataTypes.STRING(20), allowNull: false },
      policyVersion: { type: DataTypes.INTEGER, allowNull: false },
      techniques: { type: DataTypes.JSON, allowNull: false },
      runById: { type: DataTypes.INTEGER, allowNull: false },
      runAt: { type: DataTypes.DATE(3), allowNull: false },
    },
    { sequelize, tableName: 'extent_runs', modelName: 'ExtentRun', underscored: true, timestamps: false },
  );
}
