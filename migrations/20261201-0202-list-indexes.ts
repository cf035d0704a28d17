import type { Migration } from '../server/db/migrator';

// The record lists filter by state and sort by number or due date: composite
// indexes let MariaDB read one page in order instead of sorting every match.
export const up: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.addIndex('findings', ['state', 'number'], { name: 'findings_state_number' });
  await queryInterface.addIndex('findings', ['state', 'due_date'], { name: 'findings_state_due_date' });
  await queryInterface.addIndex('corrective_actions', ['state', 'number'], { name: 'corrective_actions_state_number' });
};

export const down: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.removeIndex('findings', 'findings_state_number');
  await queryInterface.removeIndex('findings', 'findings_state_due_date');
  await queryInterface.removeIndex('corrective_actions', 'corrective_actions_state_number');
};
