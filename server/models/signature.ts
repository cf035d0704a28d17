import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** An electronic signature: who signed what, meaning what, when, and the SHA-256 of the content they signed. */
export class Signature extends Model<InferAttributes<Signature>, InferCreationAttributes<Signature>> {
  declare id: CreationOptional<number>;
  declare recordType: 'audit' | 'finding' | 'action' | 'demonstration';
  declare recordId: number;
  declare event: string;
  declare signerId: number;
  declare printedName: string;
  declare role: string;
  declare meaning: string;
  declare signedAt: Date;
  declare contentHash: string;
}

export function initSignature(sequelize: Sequelize) {
  Signature.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      recordType: { type: DataTypes.STRING(32), allowNull: false },
      recordId: { type: DataTypes.INTEGER, allowNull: false },
      event: { type: DataTypes.STRING(64), allowNull: false },
      signerId: { type: DataTypes.INTEGER, allowNull: false },
      printedName: { type: DataTypes.STRING(120), allowNull: false },
      role: { type: DataTypes.STRING(32), allowNull: false },
      meaning: { type: DataTypes.STRING(120), allowNull: false },
      signedAt: { type: DataTypes.DATE(3), allowNull: false },
      contentHash: { type: DataTypes.CHAR(64), allowNull: false },
    },
    { sequelize, tableName: 'signatures', modelName: 'Signature', underscored: true, timestamps: false },
  );
}
