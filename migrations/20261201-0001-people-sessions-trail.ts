import { DataTypes } from 'sequelize';
import type { Migration } from '../server/db/migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false },
  updated_at: { type: DataTypes.DATE(3), allowNull: false },
};

export const up: Migration = async ({ context: { queryInterface, sequelize } }) => {
  await queryInterface.createTable('areas', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    code: { type: DataTypes.STRING(16), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false, unique: true },
    lead_user_id: { type: DataTypes.INTEGER, allowNull: true },
    ...timestamps,
  });

  await queryInterface.createTable('users', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    display_name: { type: DataTypes.STRING(120), allowNull: false },
    password_hash: { type: DataTypes.STRING(255), allowNull: false },
    area_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'areas', key: 'id' } },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    failed_sign_ins: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    locked_at: { type: DataTypes.DATE(3), allowNull: true },
    mail_digest: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await queryInterface.addConstraint('areas', {
    type: 'foreign key',
    fields: ['lead_user_id'],
    references: { table: 'users', field: 'id' },
    name: 'areas_lead_user_fk',
    onDelete: 'SET NULL',
    onUpdate: 'CASCADE',
  });

  await queryInterface.createTable('role_assignments', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' } },
    role: { type: DataTypes.STRING(32), allowNull: false },
    ...timestamps,
  });
  await queryInterface.addIndex('role_assignments', ['user_id', 'role'], { unique: true });

  // connect-session-sequelize's table, created here rather than by sync().
  await queryInterface.createTable('sessions', {
    sid: { type: DataTypes.STRING(36), primaryKey: true },
    expires: { type: DataTypes.DATE, allowNull: true },
    data: { type: DataTypes.TEXT('medium'), allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });
  await queryInterface.addIndex('sessions', ['expires']);

  // The trail: append-only, hash-chained. trail_head holds the chain's last
  // sequence number and hash; writers lock it so sequence numbers never gap.
  await queryInterface.createTable('trail_entries', {
    seq: { type: DataTypes.BIGINT, primaryKey: true },
    at: { type: DataTypes.DATE(3), allowNull: false },
    user_id: { type: DataTypes.INTEGER, allowNull: true },
    record_type: { type: DataTypes.STRING(32), allowNull: false },
    record_id: { type: DataTypes.STRING(64), allowNull: false },
    event: { type: DataTypes.STRING(64), allowNull: false },
    changes: { type: DataTypes.JSON, allowNull: true },
    prev_hash: { type: DataTypes.CHAR(64), allowNull: false },
    hash: { type: DataTypes.CHAR(64), allowNull: false },
  });
  await queryInterface.addIndex('trail_entries', ['record_type', 'record_id', 'seq']);
  await queryInterface.createTable('trail_head', {
    id: { type: DataTypes.TINYINT, primaryKey: true },
    seq: { type: DataTypes.BIGINT, allowNull: false },
    hash: { type: DataTypes.CHAR(64), allowNull: false },
  });
  await sequelize.query(`INSERT INTO trail_head (id, seq, hash) VALUES (1, 0, REPEAT('0', 64))`);
  // The application may only append: updates and deletes are refused in the database itself.
  await sequelize.query(`CREATE TRIGGER trail_entries_no_update BEFORE UPDATE ON trail_entries FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'trail entries are append-only'`);
  await sequelize.query(`CREATE TRIGGER trail_entries_no_delete BEFORE DELETE ON trail_entries FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'trail entries are append-only'`);
};

export const down: Migration = async ({ context: { queryInterface, sequelize } }) => {
  await sequelize.query('DROP TRIGGER IF EXISTS trail_entries_no_update');
  await sequelize.query('DROP TRIGGER IF EXISTS trail_entries_no_delete');
  await queryInterface.dropTable('trail_head');
  await queryInterface.dropTable('trail_entries');
  await queryInterface.dropTable('sessions');
  await queryInterface.dropTable('role_assignments');
  await queryInterface.removeConstraint('areas', 'areas_lead_user_fk');
  await queryInterface.dropTable('users');
  await queryInterface.dropTable('areas');
};
