import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { ReferenceNotch } from './reference-notch';

/** An instrument, probe or reference standard, with its calibration dates and status. */
export class Equipment extends Model<InferAttributes<Equipment>, InferCreationAttributes<Equipment>> {
  declare id: CreationOptional<number>;
  declare kind: string;
  declare description: string;
  declare model: string | null;
  declare serialNumber: string;
  declare calibratedOn: string | null;
  declare calibrationDueOn: string | null;
  declare status: CreationOptional<string>;
  /** DECIMAL columns come back as strings from the mariadb driver. */
  declare conductivityIacs: string | number | null;
  declare material: string | null;
  declare notes: string | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare notches?: NonAttribute<ReferenceNotch[]>;
}

export function initEquipment(sequelize: Sequelize) {
  Equipment.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      kind: { type: DataTypes.STRING(24), allowNull: false },
      description: { type: DataTypes.STRING(200), allowNull: false },
      model: { type: DataTypes.STRING(100), allowNull: true },
      serialNumber: { type: DataTypes.STRING(100), allowNull: false },
      calibratedOn: { type: DataTypes.DATEONLY, allowNull: true },
      calibrationDueOn: { type: DataTypes.DATEONLY, allowNull: true },
      status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'in_service' },
      conductivityIacs: { type: DataTypes.DECIMAL(6, 2), allowNull: true },
      material: { type: DataTypes.STRING(100), allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: true },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'equipment', modelName: 'Equipment', version: true },
  );
}
