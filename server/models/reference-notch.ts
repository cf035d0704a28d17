import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A notch machined into a reference standard (DECIMAL columns come back as strings). */
export class ReferenceNotch extends Model<InferAttributes<ReferenceNotch>, InferCreationAttributes<ReferenceNotch>> {
  declare id: CreationOptional<number>;
  declare equipmentId: number;
  declare position: number;
  declare label: string | null;
  declare orientation: string;
  declare angleDeg: string | number | null;
  declare depthMm: string | number;
  declare lengthMm: string | number;
  declare edgeDistanceMm: string | number | null;
}

export function initReferenceNotch(sequelize: Sequelize) {
  ReferenceNotch.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      equipmentId: { type: DataTypes.INTEGER, allowNull: false },
      position: { type: DataTypes.SMALLINT, allowNull: false },
      label: { type: DataTypes.STRING(60), allowNull: true },
      orientation: { type: DataTypes.STRING(20), allowNull: false },
      angleDeg: { type: DataTypes.DECIMAL(6, 2), allowNull: true },
      depthMm: { type: DataTypes.DECIMAL(8, 3), allowNull: false },
      lengthMm: { type: DataTypes.DECIMAL(8, 3), allowNull: false },
      edgeDistanceMm: { type: DataTypes.DECIMAL(8, 3), allowNull: true },
    },
    { sequelize, tableName: 'reference_notches', modelName: 'ReferenceNotch', timestamps: false },
  );
}
