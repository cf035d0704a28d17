import { DataTypes, Model, type Sequelize } from 'sequelize';

/** The table connect-session-sequelize stores sessions in (created by a migration). */
export class Session extends Model {
  declare sid: string;
  declare expires: Date | null;
  declare data: string | null;
}

export function initSession(sequelize: Sequelize) {
  Session.init(
    {
      sid: { type: DataTypes.STRING(36), primaryKey: true },
      expires: DataTypes.DATE,
      data: DataTypes.TEXT('medium'),
    },
    { sequelize, tableName: 'sessions', modelName: 'Session', underscored: false },
  );
}
