import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type TrailChanges = Record<string, unknown> | null;

export class TrailEntry extends Model<InferAttributes<TrailEntry>, InferCreationAttributes<TrailEntry>> {
  declare seq: number;
  declare at: Date;
  declare userId: number | null;
  declare recordType: string;
  declare recordId: string;
  declare event: string;
  declare changes: TrailChanges;
  declare prevHash: string;
  declare hash: string;
}

export function initTrailEntry(sequelize: Sequelize) {
  TrailEntry.init(
    {
      seq: { type: DataTypes.BIGINT, primaryKey: true },
      at: { type: DataTypes.DATE(3), allowNull: false },
      userId: { type: DataTypes.INTEGER, allowNull: true },
      recordType: { type: DataTypes.STRING(32), allowNull: false },
      recordId: { type: DataTypes.STRING(64), allowNull: false },
      event: { type: DataTypes.STRING(64), allowNull: false },
      changes: { type: DataTypes.JSON, allowNull: true },
      prevHash: { type: DataTypes.CHAR(64), allowNull: false },
      hash: { type: DataTypes.CHAR(64), allowNull: false },
    },
    { sequelize, tableName: 'trail_entries', modelName: 'TrailEntry', timestamps: false },
  );
}
