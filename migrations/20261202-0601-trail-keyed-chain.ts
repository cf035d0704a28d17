import { randomBytes } from 'node:crypto';
import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../server/db/migrator';

// The trail becomes an HMAC chain. Entries written before this migration keep
// their plain SHA-256 hashes and still verify: trail_settings records the first
// sequence number hashed with the key. It also gives the chain an id, which the
// anchors outside the database carry. The application account may only read it.
export const up: Migration = async ({ context: { queryInterface, sequelize } }) => {
  await queryInterface.createTable('trail_settings', {
    id: { type: DataTypes.TINYINT, primaryKey: true },
    chain_id: { type: DataTypes.CHAR(32), allowNull: false },
    keyed_from_seq: { type: DataTypes.BIGINT, allowNull: false },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  const [head] = await sequelize.query<{ seq: number | string }>('SELECT seq FROM trail_head WHERE id = 1', { type: QueryTypes.SELECT });
  await sequelize.query('INSERT INTO trail_settings (id, chain_id, keyed_from_seq, created_at) VALUES (1, ?, ?, UTC_TIMESTAMP(3))', {
    replacements: [randomBytes(16).toString('hex'), Number(head?.seq ?? 0) + 1],
  });
  // Re-created by the owner account, so that they no longer run as (and depend on
  // the privileges of) the application account that created them before.
  for (const [name, event] of [
    ['trail_entries_no_update', 'UPDATE'],
    ['trail_entries_no_delete', 'DELETE'],
  ]) {
    await sequelize.query(`DROP TRIGGER IF EXISTS ${name}`);
    await sequelize.query(`CREATE TRIGGER ${name} BEFORE ${event} ON trail_entries FOR EACH ROW
      SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'trail entries are append-only'`);
  }
};

export const down: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.dropTable('trail_settings');
};
