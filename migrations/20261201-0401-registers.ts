// Registers: personnel certifications, equipment (instruments, probes, reference
// standards with their notches), and which equipment and people a technique uses.
// The technique links point at the technique register's techniques (not at one
// revision: the equipment and people travel with the technique).
import { DataTypes } from 'sequelize';
import type { Migration } from '../server/db/migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false },
  updated_at: { type: DataTypes.DATE(3), allowNull: false },
};

export const up: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.createTable('certifications', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' } },
    method: { type: DataTypes.STRING(20), allowNull: false },
    level: { type: DataTypes.TINYINT, allowNull: false },
    scheme: { type: DataTypes.STRING(40), allowNull: false },
    certificate_number: { type: DataTypes.STRING(60), allowNull: false },
    issued_on: { type: DataTypes.DATEONLY, allowNull: false },
    expires_on: { type: DataTypes.DATEONLY, allowNull: false },
    near_vision_exam_on: { type: DataTypes.DATEONLY, allowNull: true },
    colour_vision_checked_on: { type: DataTypes.DATEONLY, allowNull: true },
    sectors: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
    notes: { type: DataTypes.TEXT, allowNull: true },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await queryInterface.addIndex('certifications', ['user_id']);
  await queryInterface.addIndex('certifications', ['expires_on']);
  await queryInterface.addIndex('certifications', ['method', 'certificate_number'], { unique: true });

  await queryInterface.createTable('equipment', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    kind: { type: DataTypes.STRING(24), allowNull: false },
    description: { type: DataTypes.STRING(200), allowNull: false },
    model: { type: DataTypes.STRING(100), allowNull: true },
    serial_number: { type: DataTypes.STRING(100), allowNull: false },
    calibrated_on: { type: DataTypes.DATEONLY, allowNull: true },
    calibration_due_on: { type: DataTypes.DATEONLY, allowNull: true },
    status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'in_service' },
    // Reference standards only: the block's conductivity and material.
    conductivity_iacs: { type: DataTypes.DECIMAL(6, 2), allowNull: true },
    material: { type: DataTypes.STRING(100), allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await queryInterface.addIndex('equipment', ['kind', 'serial_number'], { unique: true });
  await queryInterface.addIndex('equipment', ['calibration_due_on']);

  await queryInterface.createTable('reference_notches', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    equipment_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'equipment', key: 'id' }, onDelete: 'CASCADE' },
    position: { type: DataTypes.SMALLINT, allowNull: false },
    label: { type: DataTypes.STRING(60), allowNull: true },
    orientation: { type: DataTypes.STRING(20), allowNull: false },
    angle_deg: { type: DataTypes.DECIMAL(6, 2), allowNull: true },
    depth_mm: { type: DataTypes.DECIMAL(8, 3), allowNull: false },
    length_mm: { type: DataTypes.DECIMAL(8, 3), allowNull: false },
    edge_distance_mm: { type: DataTypes.DECIMAL(8, 3), allowNull: true },
  });
  await queryInterface.addIndex('reference_notches', ['equipment_id', 'position'], { unique: true });

  await queryInterface.createTable('technique_equipment', {
    technique_id: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true, references: { model: 'techniques', key: 'id' } },
    equipment_id: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true, references: { model: 'equipment', key: 'id' } },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await queryInterface.addIndex('technique_equipment', ['equipment_id']);

  await queryInterface.createTable('technique_performers', {
    technique_id: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true, references: { model: 'techniques', key: 'id' } },
    user_id: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true, references: { model: 'users', key: 'id' } },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await queryInterface.addIndex('technique_performers', ['user_id']);
};

export const down: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.dropTable('technique_performers');
  await queryInterface.dropTable('technique_equipment');
  await queryInterface.dropTable('reference_notches');
  await queryInterface.dropTable('equipment');
  await queryInterface.dropTable('certifications');
};
