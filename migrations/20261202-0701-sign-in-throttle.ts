// Sign-in throttling shared by every app server: a temporary, growing lockout
// per account (columns on users) and per client address (its own table), and
// the flag that makes a person choose a new password after an administrator
// set one. Permanent locks are gone: any lock left from before is lifted.
import { DataTypes } from 'sequelize';
import type { Migration } from '../server/db/migrator';

export const up: Migration = async ({ context: { queryInterface, sequelize } }) => {
  await queryInterface.addColumn('users', 'locked_until', { type: DataTypes.DATE(3), allowNull: true });
  await queryInterface.addColumn('users', 'lockouts', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 });
  await queryInterface.addColumn('users', 'password_change_required', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
  await sequelize.query('UPDATE users SET locked_at = NULL, failed_sign_ins = 0 WHERE locked_at IS NOT NULL');

  await queryInterface.createTable('sign_in_address_failures', {
    address: { type: DataTypes.STRING(64), primaryKey: true },
    failures: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    lockouts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    locked_until: { type: DataTypes.DATE(3), allowNull: true },
    last_failed_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await queryInterface.addIndex('sign_in_address_failures', ['last_failed_at']);
};

export const down: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.dropTable('sign_in_address_failures');
  await queryInterface.removeColumn('users', 'password_change_required');
  await queryInterface.removeColumn('users', 'lockouts');
  await queryInterface.removeColumn('users', 'locked_until');
};
