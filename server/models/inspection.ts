import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { InspectionResult } from '../../shared/schemas/inspection';
import type { Equipment } from './equipment';
import type { Technique } from './technique';
import type { TechniqueRevision } from './technique-revision';
import type { User } from './user';

/** One inspection performed to one technique revision: the part, the work order, who, the result and the equipment used. */
export class Inspection extends Model<InferAttributes<Inspection>, InferCreationAttributes<Inspection>> {
  declare id: CreationOptional<number>;
  declare techniqueRevisionId: number;
  declare techniqueId: number;
  declare performedOn: string;
  declare partNumber: string;
  declare serialNumber: string;
  declare workOrder: string;
  declare customer: string;
  declare inspectorId: number;
  declare result: InspectionResult;
  declare instrumentId: number | null;
  declare probeId: number | null;
  declare referenceStandardId: number | null;
  declare notes: string | null;
  declare createdById: number;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare technique?: NonAttribute<Technique>;
  declare techniqueRevision?: NonAttribute<TechniqueRevision>;
  declare inspector?: NonAttribute<User>;
  declare instrument?: NonAttribute<Equipment | null>;
  declare probe?: NonAttribute<Equipment | null>;
  declare referenceStandard?: NonAttribute<Equipment | null>;
}

export function initInspection(sequelize: Sequelize) {
  Inspection.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      techniqueRevisionId: { type: DataTypes.INTEGER, allowNull: false },
      techniqueId: { type: DataTypes.INTEGER, allowNull: false },
      performedOn: { type: DataTypes.DATEONLY, allowNull: false },
      partNumber: { type: DataTypes.STRING(80), allowNull: false },
      serialNumber: { type: DataTypes.STRING(80), allowNull: false },
      workOrder: { type: DataTypes.STRING(60), allowNull: false },
      customer: { type: DataTypes.STRING(120), allowNull: false },
      inspectorId: { type: DataTypes.INTEGER, allowNull: false },
      result: { type: DataTypes.STRING(24), allowNull: false },
      instrumentId: { type: DataTypes.INTEGER, allowNull: true },
      probeId: { type: DataTypes.INTEGER, allowNull: true },
      referenceStandardId: { type: DataTypes.INTEGER, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: true },
      createdById: { type: DataTypes.INTEGER, allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'inspections', modelName: 'Inspection', underscored: true, version: true },
  );
}
