import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { EvidenceRecordType } from '../../shared/schemas/evidence';
import type { User } from './user';

/** Metadata of one uploaded file; the bytes live in storage under `storageKey` (from the SHA-256). */
export class EvidenceFile extends Model<InferAttributes<EvidenceFile>, InferCreationAttributes<EvidenceFile>> {
  declare id: CreationOptional<number>;
  declare recordType: EvidenceRecordType;
  declare recordId: number;
  declare originalName: string;
  declare mediaType: string;
  declare sizeBytes: number;
  declare sha256: string;
  declare storageKey: string;
  declare tempName: string | null;
  declare storedAt: Date | null;
  declare uploadedById: number;
  declare supersededAt: CreationOptional<Date | null>;
  declare supersededById: CreationOptional<number | null>;
  declare supersedeReason: CreationOptional<string | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare uploadedBy?: NonAttribute<User>;
  declare supersededBy?: NonAttribute<User | null>;
}

export function initEvidenceFile(sequelize: Sequelize) {
  EvidenceFile.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      recordType: { type: DataTypes.STRING(16), allowNull: false },
      recordId: { type: DataTypes.INTEGER, allowNull: false },
      originalName: { type: DataTypes.STRING(255), allowNull: false },
      mediaType: { type: DataTypes.STRING(100), allowNull: false },
      // BIGINT comes back as a string from the driver; evidence is at most a few hundred MB.
      sizeBytes: { type: DataTypes.BIGINT, allowNull: false, get() { return Number(this.getDataValue('sizeBytes')); } },
      sha256: { type: DataTypes.CHAR(64), allowNull: false },
      storageKey: { type: DataTypes.STRING(255), allowNull: false },
      tempName: { type: DataTypes.STRING(80), allowNull: true },
      storedAt: { type: DataTypes.DATE(3), allowNull: true },
      uploadedById: { type: DataTypes.INTEGER, allowNull: false },
      supersededAt: { type: DataTypes.DATE(3), allowNull: true, defaultValue: null },
      supersededById: { type: DataTypes.INTEGER, allowNull: true, defaultValue: null },
      supersedeReason: { type: DataTypes.TEXT, allowNull: true, defaultValue: null },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'evidence_files', modelName: 'EvidenceFile', version: true },
  );
}
