import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { PodDemonstrationData, PodDemonstrationState, PodModel, PodSizeDimension } from '../../shared/schemas/pod';

/** A capability demonstration of a technique revision: data, analysis and, once accepted, its signature. */
export class PodDemonstration extends Model<InferAttributes<PodDemonstration>, InferCreationAttributes<PodDemonstration>> {
  declare id: CreationOptional<number>;
  declare techniqueRevisionId: number;
  declare title: string;
  declare model: PodModel;
  declare sizeDimension: PodSizeDimension;
  declare data: PodDemonstrationData;
  declare analysis: CreationOptional<Record<string, unknown> | null>;
  declare engineVersion: CreationOptional<number | null>;
  declare analysedAt: CreationOptional<Date | null>;
  declare state: PodDemonstrationState;
  declare acceptedById: CreationOptional<number | null>;
  declare acceptedAt: CreationOptional<Date | null>;
  declare signatureId: CreationOptional<number | null>;
  declare supersededById: CreationOptional<number | null>;
  declare createdById: number;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initPodDemonstration(sequelize: Sequelize) {
  PodDemonstration.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      techniqueRevisionId: { type: DataTypes.INTEGER, allowNull: false },
      title: { type: DataTypes.STRING(160), allowNull: false },
      model: { type: DataTypes.STRING(20), allowNull: false },
      sizeDimension: { type: DataTypes.STRING(10), allowNull: false },
      data: { type: DataTypes.JSON, allowNull: false },
      analysis: { type: DataTypes.JSON, allowNull: true },
      engineVersion: { type: DataTypes.INTEGER, allowNull: true },
      analysedAt: { type: DataTypes.DATE(3), allowNull: true },
      state: { type: DataTypes.STRING(16), allowNull: false },
      acceptedById: { type: DataTypes.INTEGER, allowNull: true },
      acceptedAt: { type: DataTypes.DATE(3), allowNull: true },
      signatureId: { type: DataTypes.INTEGER, allowNull: true },
      supersededById: { type: DataTypes.INTEGER, allowNull: true },
      createdById: { type: DataTypes.INTEGER, allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: { type: DataTypes.DATE(3), allowNull: false },
      updatedAt: { type: DataTypes.DATE(3), allowNull: false },
    },
    { sequelize, tableName: 'pod_demonstrations', modelName: 'PodDemonstration', underscored: true },
  );
}
