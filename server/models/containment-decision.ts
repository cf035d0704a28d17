import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { ContainmentDecisionKind } from '../../shared/schemas/impact';
import type { User } from './user';

/** The quality manager's decision on one past inspection a finding puts in doubt. */
export class ContainmentDecision extends Model<InferAttributes<ContainmentDecision>, InferCreationAttributes<ContainmentDecision>> {
  declare id: CreationOptional<number>;
  declare findingId: number;
  declare inspectionId: number;
  declare decision: ContainmentDecisionKind;
  declare reason: string;
  declare decidedById: number;
  declare decidedAt: Date;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare decidedBy?: NonAttribute<User>;
}

export function initContainmentDecision(sequelize: Sequelize) {
  ContainmentDecision.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      findingId: { type: DataTypes.INTEGER, allowNull: false },
      inspectionId: { type: DataTypes.INTEGER, allowNull: false },
      decision: { type: DataTypes.STRING(24), allowNull: false },
      reason: { type: DataTypes.TEXT, allowNull: false },
      decidedById: { type: DataTypes.INTEGER, allowNull: false },
      decidedAt: { type: DataTypes.DATE(3), allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'containment_decisions', modelName: 'ContainmentDecision', underscored: true, version: true },
  );
}
