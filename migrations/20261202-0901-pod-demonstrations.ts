// Capability demonstrations: a specimen set with known flaws, the inspections of it and the POD
// analysis, per technique revision. An accepted demonstration is immutable (a trigger refuses any
// change to its data or analysis); a newer accepted one supersedes it.
import { DataTypes } from 'sequelize';
import type { Migration } from '../server/db/migrator';

const ref = (model: string, allowNull: boolean) => ({ type: DataTypes.INTEGER, allowNull, references: { model, key: 'id' } });

export const up: Migration = async ({ context: { queryInterface, sequelize } }) => {
  await queryInterface.createTable('pod_demonstrations', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    technique_revision_id: ref('technique_revisions', false),
    title: { type: DataTypes.STRING(160), allowNull: false },
    model: { type: DataTypes.STRING(20), allowNull: false },
    size_dimension: { type: DataTypes.STRING(10), allowNull: false },
    // Specimens, inspections, thresholds and noise, as validated by PodDemonstrationFieldsSchema.
    data: { type: DataTypes.JSON, allowNull: false },
    analysis: { type: DataTypes.JSON, allowNull: true },
    engine_version: { type: DataTypes.INTEGER, allowNull: true },
    analysed_at: { type: DataTypes.DATE(3), allowNull: true },
    state: { type: DataTypes.STRING(16), allowNull: false },
    accepted_by_id: ref('users', true),
    accepted_at: { type: DataTypes.DATE(3), allowNull: true },
    signature_id: ref('signatures', true),
    superseded_by_id: ref('pod_demonstrations', true),
    created_by_id: ref('users', false),
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await queryInterface.addIndex('pod_demonstrations', ['technique_revision_id', 'state']);
  await sequelize.query(`CREATE TRIGGER pod_demonstrations_accepted_immutable BEFORE UPDATE ON pod_demonstrations FOR EACH ROW
    IF OLD.state <> 'draft' AND (NOT (NEW.data <=> OLD.data) OR NOT (NEW.analysis <=> OLD.analysis) OR NOT (NEW.engine_version <=> OLD.engine_version)
        OR NOT (NEW.signature_id <=> OLD.signature_id) OR NEW.state = 'draft') THEN
      SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'an accepted demonstration cannot be changed';
    END IF`);
  await sequelize.query(`CREATE TRIGGER pod_demonstrations_no_delete_accepted BEFORE DELETE ON pod_demonstrations FOR EACH ROW
    IF OLD.state <> 'draft' THEN
      SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'an accepted demonstration cannot be deleted';
    END IF`);
};

export const down: Migration = async ({ context: { queryInterface, sequelize } }) => {
  await sequelize.query('DROP TRIGGER IF EXISTS pod_demonstrations_accepted_immutable');
  await sequelize.query('DROP TRIGGER IF EXISTS pod_demonstrations_no_delete_accepted');
  await queryInterface.dropTable('pod_demonstrations');
};
