import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { Area } from './area';
import type { TechniqueRevision } from './technique-revision';

/** A written technique in the register; its content lives in its revisions. */
export class Technique extends Model<InferAttributes<Technique>, InferCreationAttributes<Technique>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare title: string;
  declare areaId: number | null;
  declare createdById: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare area?: NonAttribute<Area | null>;
  declare revisions?: NonAttribute<TechniqueRevision[]>;
}

export function initTechnique(sequelize: Sequelize) {
  Technique.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      code: { type: DataTypes.STRING(40), allowNull: false },
      title: { type: DataTypes.STRING(200), allowNull: false },
      areaId: { type: DataTypes.INTEGER, allowNull: true },
      createdById: { type: DataTypes.INTEGER, allowNull: false },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'techniques', modelName: 'Technique' },
  );
}
