import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { AuditState } from '../../machines';
import type { Technique } from '../../shared/schemas/technique';
import type { Area } from './area';
import type { User } from './user';

/** One technique in an audit's scope. `techniqueId` refers to the technique register once it exists. */
export interface AuditScopeTechnique {
  techniqueId: number | null;
  code: string;
  title: string;
  revision: string;
  /** The technique as written, evaluated by the checklist (kept with the audit until the register holds it). */
  definition: Technique | null;
}

export class Audit extends Model<InferAttributes<Audit>, InferCreationAttributes<Audit>> {
  declare id: CreationOptional<number>;
  declare title: string;
  declare criteria: string;
  declare areaId: number;
  declare leadAuditorId: number;
  declare plannedStart: string;
  declare plannedEnd: string;
  declare scope: AuditScopeTechnique[];
  declare cancelReason: string | null;
  declare issuedAt: Date | null;
  declare closedAt: Date | null;
  declare createdById: number;
  declare state: AuditState;
  declare snapshot: unknown;
  declare machineVersion: number;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare area?: NonAttribute<Area>;
  declare leadAuditor?: NonAttribute<User>;
}

export function initAudit(sequelize: Sequelize) {
  Audit.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      title: { type: DataTypes.STRING(200), allowNull: false },
      criteria: { type: DataTypes.TEXT, allowNull: false },
      areaId: { type: DataTypes.INTEGER, allowNull: false },
      leadAuditorId: { type: DataTypes.INTEGER, allowNull: false },
      plannedStart: { type: DataTypes.DATEONLY, allowNull: false },
      plannedEnd: { type: DataTypes.DATEONLY, allowNull: false },
      scope: { type: DataTypes.JSON, allowNull: false },
      cancelReason: { type: DataTypes.TEXT, allowNull: true },
      issuedAt: { type: DataTypes.DATE(3), allowNull: true },
      closedAt: { type: DataTypes.DATE(3), allowNull: true },
      createdById: { type: DataTypes.INTEGER, allowNull: false },
      state: { type: DataTypes.STRING(32), allowNull: false },
      snapshot: { type: DataTypes.JSON, allowNull: false },
      machineVersion: { type: DataTypes.INTEGER, allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'audits', modelName: 'Audit', underscored: true, version: true },
  );
}
