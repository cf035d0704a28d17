import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** pending → sent; held (kept for the recipient's daily digest) → digested. */
export type OutboxStatus = 'pending' | 'sent' | 'held' | 'digested';

export class OutboxMessage extends Model<InferAttributes<OutboxMessage>, InferCreationAttributes<OutboxMessage>> {
  declare id: CreationOptional<number>;
  declare kind: string;
  declare toUserId: number | null;
  declare toAddress: string;
  declare subject: string;
  declare textBody: string;
  declare htmlBody: string;
  declare recordType: string | null;
  declare recordId: string | null;
  declare dedupeKey: string | null;
  declare status: OutboxStatus;
  declare attempts: CreationOptional<number>;
  declare nextAttemptAt: Date;
  declare lockedUntil: CreationOptional<Date | null>;
  declare lastError: CreationOptional<string | null>;
  declare sentAt: CreationOptional<Date | null>;
  declare digestId: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initOutboxMessage(sequelize: Sequelize) {
  OutboxMessage.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      kind: { type: DataTypes.STRING(48), allowNull: false },
      toUserId: { type: DataTypes.INTEGER, allowNull: true },
      toAddress: { type: DataTypes.STRING(254), allowNull: false },
      subject: { type: DataTypes.STRING(255), allowNull: false },
      textBody: { type: DataTypes.TEXT('medium'), allowNull: false },
      htmlBody: { type: DataTypes.TEXT('medium'), allowNull: false },
      recordType: { type: DataTypes.STRING(32), allowNull: true },
      recordId: { type: DataTypes.STRING(64), allowNull: true },
      dedupeKey: { type: DataTypes.STRING(191), allowNull: true },
      status: { type: DataTypes.STRING(16), allowNull: false },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      nextAttemptAt: { type: DataTypes.DATE(3), allowNull: false },
      lockedUntil: { type: DataTypes.DATE(3), allowNull: true, defaultValue: null },
      lastError: { type: DataTypes.TEXT, allowNull: true, defaultValue: null },
      sentAt: { type: DataTypes.DATE(3), allowNull: true, defaultValue: null },
      digestId: { type: DataTypes.INTEGER, allowNull: true, defaultValue: null },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'outbox_messages', modelName: 'OutboxMessage' },
  );
}
