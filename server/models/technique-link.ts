// Which equipment and which people a technique uses: two plain mapping tables,
// read by the register facts of the checklist's `personnel` and `equipment` rules.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class TechniqueEquipment extends Model<InferAttributes<TechniqueEquipment>, InferCreationAttributes<TechniqueEquipment>> {
  declare techniqueId: number;
  declare equipmentId: number;
  declare createdAt: CreationOptional<Date>;
}

export class TechniquePerformer extends Model<InferAttributes<TechniquePerformer>, InferCreationAttributes<TechniquePerformer>> {
  declare techniqueId: number;
  declare userId: number;
  declare createdAt: CreationOptional<Date>;
}

export function initTechniqueLinks(sequelize: Sequelize) {
  TechniqueEquipment.init(
    {
      techniqueId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
      equipmentId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'technique_equipment', modelName: 'TechniqueEquipment', updatedAt: false },
  );
  TechniquePerformer.init(
    {
      techniqueId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
      userId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'technique_performers', modelName: 'TechniquePerformer', updatedAt: false },
  );
}
