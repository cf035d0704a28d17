// The technique register: materials library, techniques with their revisions,
// and the organisation's policy settings (the stored values; defaults live in
// shared/domain/policy.ts so a new setting needs no migration).
import { DataTypes } from 'sequelize';
import type { Migration } from '../server/db/migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false },
  updated_at: { type: DataTypes.DATE(3), allowNull: false },
};

export const up: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.createTable('materials', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    // The stable id of a library entry (shared/domain/materials.ts); null for materials added here.
    library_key: { type: DataTypes.STRING(60), allowNull: true, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false, unique: true },
    conductivity_iacs: { type: DataTypes.DOUBLE, allowNull: false },
    relative_permeability: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1 },
    source: { type: DataTypes.STRING(1000), allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });

  await queryInterface.createTable('techniques', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    code: { type: DataTypes.STRING(40), allowNull: false, unique: true },
    title: { type: DataTypes.STRING(200), allowNull: false },
    area_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'areas', key: 'id' } },
    created_by_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' } },
    ...timestamps,
  });

  await queryInterface.createTable('technique_revisions', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    technique_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'techniques', key: 'id' } },
    // Sequence number within the technique (1 = A, 2 = B, …), for ordering and "latest".
    seq: { type: DataTypes.INTEGER, allowNull: false },
    revision: { type: DataTypes.STRING(20), allowNull: false },
    state: { type: DataTypes.STRING(16), allowNull: false },
    // The technique in the checklist engine's shape (shared/schemas/technique.ts).
    content: { type: DataTypes.JSON, allowNull: false },
    // The checklist verdict under the organisation's policy, kept current on every edit and policy change.
    verdict: { type: DataTypes.STRING(20), allowNull: false },
    failed_rules: { type: DataTypes.JSON, allowNull: false },
    created_by_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' } },
    updated_by_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' } },
    approved_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } },
    approved_at: { type: DataTypes.DATE(3), allowNull: true },
    superseded_at: { type: DataTypes.DATE(3), allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await queryInterface.addIndex('technique_revisions', ['technique_id', 'revision'], { unique: true });
  await queryInterface.addIndex('technique_revisions', ['technique_id', 'seq'], { unique: true });
  await queryInterface.addIndex('technique_revisions', ['state']);

  await queryInterface.createTable('policy_settings', {
    key: { type: DataTypes.STRING(60), primaryKey: true },
    value: { type: DataTypes.DOUBLE, allowNull: false },
    updated_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } },
    ...timestamps,
  });
  // One row holding the policy's version, for optimistic locking of an edit of several settings at once.
  await queryInterface.createTable('policy_heads', {
    id: { type: DataTypes.TINYINT, primaryKey: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    updated_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } },
    ...timestamps,
  });
  const now = new Date();
  await queryInterface.bulkInsert('policy_heads', [{ id: 1, version: 0, updated_by_id: null, created_at: now, updated_at: now }]);
};

export const down: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.dropTable('policy_heads');
  await queryInterface.dropTable('policy_settings');
  await queryInterface.dropTable('technique_revisions');
  await queryInterface.dropTable('techniques');
  await queryInterface.dropTable('materials');
};
