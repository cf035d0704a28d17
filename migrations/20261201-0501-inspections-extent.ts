// Inspections performed with each technique revision, and what a finding
// against a technique does with them: the extent-of-condition runs over the
// other techniques, the findings raised from such a run, and the containment
// decision taken for each past inspection the finding puts in doubt.
import { DataTypes } from 'sequelize';
import type { Migration } from '../server/db/migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false },
  updated_at: { type: DataTypes.DATE(3), allowNull: false },
};

const ref = (model: string, allowNull: boolean) => ({ type: DataTypes.INTEGER, allowNull, references: { model, key: 'id' } });

export const up: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.createTable('inspections', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    // The revision the work was done to; technique_id is kept beside it for the register's filters.
    technique_revision_id: ref('technique_revisions', false),
    technique_id: ref('techniques', false),
    performed_on: { type: DataTypes.DATEONLY, allowNull: false },
    part_number: { type: DataTypes.STRING(80), allowNull: false },
    serial_number: { type: DataTypes.STRING(80), allowNull: false },
    work_order: { type: DataTypes.STRING(60), allowNull: false },
    customer: { type: DataTypes.STRING(120), allowNull: false },
    inspector_id: ref('users', false),
    result: { type: DataTypes.STRING(24), allowNull: false },
    instrument_id: ref('equipment', true),
    probe_id: ref('equipment', true),
    reference_standard_id: ref('equipment', true),
    notes: { type: DataTypes.TEXT, allowNull: true },
    created_by_id: ref('users', false),
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await queryInterface.addIndex('inspections', ['technique_revision_id', 'performed_on']);
  await queryInterface.addIndex('inspections', ['technique_id', 'performed_on']);
  await queryInterface.addIndex('inspections', ['instrument_id', 'performed_on']);
  await queryInterface.addIndex('inspections', ['probe_id', 'performed_on']);
  await queryInterface.addIndex('inspections', ['reference_standard_id', 'performed_on']);
  await queryInterface.addIndex('inspections', ['performed_on']);

  // A finding raised from an extent-of-condition run points at the finding it extends.
  await queryInterface.addColumn('findings', 'extent_of_id', ref('findings', true));
  await queryInterface.addColumn('findings', 'proposed_class', { type: DataTypes.STRING(16), allowNull: true });
  // The date the impact worksheet starts from; null: from each affected revision's approval.
  await queryInterface.addColumn('findings', 'impact_since', { type: DataTypes.DATEONLY, allowNull: true });
  await queryInterface.addIndex('findings', ['extent_of_id']);

  await queryInterface.createTable('extent_runs', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    finding_id: ref('findings', false),
    rule: { type: DataTypes.STRING(40), allowNull: false },
    flaw_orientation: { type: DataTypes.STRING(20), allowNull: true },
    coil_type: { type: DataTypes.STRING(20), allowNull: true },
    engine_version: { type: DataTypes.STRING(20), allowNull: false },
    policy_version: { type: DataTypes.INTEGER, allowNull: false },
    // Every approved revision evaluated, with its failing results for the rule (see ExtentRunView).
    techniques: { type: DataTypes.JSON, allowNull: false },
    run_by_id: ref('users', false),
    run_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await queryInterface.addIndex('extent_runs', ['finding_id', 'run_at']);

  await queryInterface.createTable('containment_decisions', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    finding_id: ref('findings', false),
    inspection_id: ref('inspections', false),
    decision: { type: DataTypes.STRING(24), allowNull: false },
    reason: { type: DataTypes.TEXT, allowNull: false },
    decided_by_id: ref('users', false),
    decided_at: { type: DataTypes.DATE(3), allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await queryInterface.addIndex('containment_decisions', ['finding_id', 'inspection_id'], { unique: true });
};

export const down: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.dropTable('containment_decisions');
  await queryInterface.dropTable('extent_runs');
  // MariaDB refuses to drop a column its foreign key still names.
  const references = (await queryInterface.getForeignKeyReferencesForTable('findings')) as Array<{ columnName: string; constraintName: string }>;
  for (const reference of references.filter((candidate) => candidate.columnName === 'extent_of_id')) {
    await queryInterface.removeConstraint('findings', reference.constraintName);
  }
  await queryInterface.removeIndex('findings', ['extent_of_id']);
  await queryInterface.removeColumn('findings', 'impact_since');
  await queryInterface.removeColumn('findings', 'proposed_class');
  await queryInterface.removeColumn('findings', 'extent_of_id');
  await queryInterface.dropTable('inspections');
};
