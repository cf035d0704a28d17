// A checklist run keeps the version of the engine that made it, as an extent run
// already does, so that a run made before a change of the rules says so. Every run
// stored before this column existed was made with engine 1.0.
import { DataTypes } from 'sequelize';
import type { Migration } from '../server/db/migrator';

export const up: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.addColumn('checklist_runs', 'engine_version', { type: DataTypes.STRING(20), allowNull: false, defaultValue: '1.0' });
};

export const down: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.removeColumn('checklist_runs', 'engine_version');
};
