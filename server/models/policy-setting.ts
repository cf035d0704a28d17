import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { PolicyKey } from '../../shared/domain/policy';

/** A policy setting the organisation changed from its default (absent rows mean "use the default"). */
export class PolicySetting extends Model<InferAttributes<PolicySetting>, InferCreationAttributes<PolicySetting>> {
  declare key: PolicyKey;
  declare value: number;
  declare updatedById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** The single row whose version guards an edit of the policy as a whole. */
export class PolicyHead extends Model<InferAttributes<PolicyHead>, InferCreationAttributes<PolicyHead>> {
  declare id: number;
  declare version: CreationOptional<number>;
  declare updatedById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initPolicySetting(sequelize: Sequelize) {
  PolicySetting.init(
    {
      key: { type: DataTypes.STRING(60), primaryKey: true },
      value: { type: DataTypes.DOUBLE, allowNull: false },
      updatedById: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'policy_settings', modelName: 'PolicySetting' },
  );
  PolicyHead.init(
    {
      id: { type: DataTypes.TINYINT, primaryKey: true },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      updatedById: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'policy_heads', modelName: 'PolicyHead', version: true },
  );
}
