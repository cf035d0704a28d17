import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { User } from './user';

/** One person's certificate in one NDT method (ISO 9712, EN 4179 or a written practice). */
export class Certification extends Model<InferAttributes<Certification>, InferCreationAttributes<Certification>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare method: string;
  declare level: number;
  declare scheme: string;
  declare certificateNumber: string;
  /** Dates by the day: DATEONLY columns come back as "YYYY-MM-DD". */
  declare issuedOn: string;
  declare expiresOn: string;
  declare nearVisionExamOn: string | null;
  declare colourVisionCheckedOn: string | null;
  /** Comma-separated industrial sectors the certificate covers. */
  declare sectors: CreationOptional<string>;
  declare notes: string | null;
  declare active: CreationOptional<boolean>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare person?: NonAttribute<User>;
}

export function initCertification(sequelize: Sequelize) {
  Certification.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      userId: { type: DataTypes.INTEGER, allowNull: false },
      method: { type: DataTypes.STRING(20), allowNull: false },
      level: { type: DataTypes.TINYINT, allowNull: false },
      scheme: { type: DataTypes.STRING(40), allowNull: false },
      certificateNumber: { type: DataTypes.STRING(60), allowNull: false },
      issuedOn: { type: DataTypes.DATEONLY, allowNull: false },
      expiresOn: { type: DataTypes.DATEONLY, allowNull: false },
      nearVisionExamOn: { type: DataTypes.DATEONLY, allowNull: true },
      colourVisionCheckedOn: { type: DataTypes.DATEONLY, allowNull: true },
      sectors: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
      notes: { type: DataTypes.TEXT, allowNull: true },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'certifications', modelName: 'Certification', version: true },
  );
}
