import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A message the local SMTP fake received (only when no SMTP_URL is configured). */
export class CaughtMail extends Model<InferAttributes<CaughtMail>, InferCreationAttributes<CaughtMail>> {
  declare id: CreationOptional<number>;
  declare messageId: string | null;
  declare envelopeFrom: string | null;
  declare envelopeTo: string[];
  declare fromHeader: string | null;
  declare toHeader: string | null;
  declare subject: string | null;
  declare textBody: string | null;
  declare htmlBody: string | null;
  declare sizeBytes: number;
  declare receivedAt: Date;
}

export function initCaughtMail(sequelize: Sequelize) {
  CaughtMail.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      messageId: { type: DataTypes.STRING(255), allowNull: true },
      envelopeFrom: { type: DataTypes.STRING(254), allowNull: true },
      envelopeTo: { type: DataTypes.JSON, allowNull: false },
      fromHeader: { type: DataTypes.STRING(500), allowNull: true },
      toHeader: { type: DataTypes.TEXT, allowNull: true },
      subject: { type: DataTypes.STRING(500), allowNull: true },
      textBody: { type: DataTypes.TEXT('medium'), allowNull: true },
      htmlBody: { type: DataTypes.TEXT('medium'), allowNull: true },
      sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
      receivedAt: { type: DataTypes.DATE(3), allowNull: false },
    },
    { sequelize, tableName: 'caught_mails', modelName: 'CaughtMail', timestamps: false },
  );
}
