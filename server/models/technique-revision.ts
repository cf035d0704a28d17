import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { RuleId, Verdict } from '../../shared/domain/checklist';
import type { Technique as TechniqueContent } from '../../shared/schemas/technique';
import type { TechniqueRevisionState } from '../../shared/schemas/technique-register';
import type { Technique } from './technique';
import type { User } from './user';

/** One revision of a technique: draft → approved (by a Level 3) → superseded. Approved revisions are read-only. */
export class TechniqueRevision extends Model<InferAttributes<TechniqueRevision>, InferCreationAttributes<TechniqueRevision>> {
  declare id: CreationOptional<number>;
  declare techniqueId: number;
  declare seq: number;
  declare revision: string;
  declare state: TechniqueRevisionState;
  declare content: TechniqueContent;
  declare verdict: Verdict;
  declare failedRules: RuleId[];
  declare createdById: number;
  declare updatedById: number;
  declare approvedById: number | null;
  declare approvedAt: Date | null;
  declare supersededAt: Date | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare technique?: NonAttribute<Technique>;
  declare approvedBy?: NonAttribute<User | null>;
  declare createdBy?: NonAttribute<User>;
  declare updatedBy?: NonAttribute<User>;
}

export function initTechniqueRevision(sequelize: Sequelize) {
  TechniqueRevision.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      techniqueId: { type: DataTypes.INTEGER, allowNull: false },
      seq: { type: DataTypes.INTEGER, allowNull: false },
      revision: { type: DataTypes.STRING(20), allowNull: false },
      state: { type: DataTypes.STRING(16), allowNull: false },
      content: { type: DataTypes.JSON, allowNull: false },
      verdict: { type: DataTypes.STRING(20), allowNull: false },
      failedRules: { type: DataTypes.JSON, allowNull: false },
      createdById: { type: DataTypes.INTEGER, allowNull: false },
      updatedById: { type: DataTypes.INTEGER, allowNull: false },
      approvedById: { type: DataTypes.INTEGER, allowNull: true },
      approvedAt: { type: DataTypes.DATE(3), allowNull: true },
      supersededAt: { type: DataTypes.DATE(3), allowNull: true },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'technique_revisions', modelName: 'TechniqueRevision', version: true },
  );
}
