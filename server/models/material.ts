import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** An entry of the materials library: conductivity and permeability, with where the values come from. */
export class Material extends Model<InferAttributes<Material>, InferCreationAttributes<Material>> {
  declare id: CreationOptional<number>;
  declare libraryKey: string | null;
  declare name: string;
  declare conductivityIacs: number;
  declare relativePermeability: number;
  declare source: string;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initMaterial(sequelize: Sequelize) {
  Material.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      libraryKey: { type: DataTypes.STRING(60), allowNull: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      conductivityIacs: { type: DataTypes.DOUBLE, allowNull: false },
      relativePermeability: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1 },
      source: { type: DataTypes.STRING(1000), allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'materials', modelName: 'Material', version: true },
  );
}
