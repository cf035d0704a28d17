import { DataTypes } from 'sequelize';
import type { Migration } from '../server/db/migrator';

// The organisation's name as its reports print it (one row; absent means the
// ORG_NAME setting), and the audit's findings as they stood when its report was
// issued, so a reprinted report shows the states at issue, not today's. The
// materials library names its nickel alloy generically (no trademark).
export const up: Migration = async ({ context: { queryInterface, sequelize } }) => {
  await queryInterface.createTable('organisation_profile', {
    id: { type: DataTypes.TINYINT, primaryKey: true },
    name: { type: DataTypes.STRING(200), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await queryInterface.addColumn('audits', 'issued_findings', { type: DataTypes.JSON, allowNull: true });
  await sequelize.query(
    "UPDATE materials SET library_key = 'alloy-600', name = 'Alloy 600 (UNS N06600)' WHERE library_key = 'inconel-600'",
  );
};

export const down: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.removeColumn('audits', 'issued_findings');
  await queryInterface.dropTable('organisation_profile');
};
