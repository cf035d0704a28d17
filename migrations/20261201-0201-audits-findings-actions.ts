// Workflow records: audits with their checklist runs, findings, corrective
// actions, electronic signatures, and the per-year counters that number
// findings (F-2026-0007) and actions (CA-2026-0003) without gaps.
// Every workflow record keeps its flat machine state in `state` (queryable),
// the persisted machine snapshot, the machine version and an optimistic-lock version.
import { DataTypes } from 'sequelize';
import type { Migration } from '../server/db/migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false },
  updated_at: { type: DataTypes.DATE(3), allowNull: false },
};

const machineColumns = {
  state: { type: DataTypes.STRING(32), allowNull: false },
  snapshot: { type: DataTypes.JSON, allowNull: false },
  machine_version: { type: DataTypes.INTEGER, allowNull: false },
  version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
};

const userRef = (allowNull: boolean) => ({ type: DataTypes.INTEGER, allowNull, references: { model: 'users', key: 'id' } });

export const up: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.createTable('record_numbers', {
    prefix: { type: DataTypes.STRING(8), primaryKey: true },
    year: { type: DataTypes.INTEGER, primaryKey: true },
    last: { type: DataTypes.INTEGER, allowNull: false },
  });

  await queryInterface.createTable('audits', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    title: { type: DataTypes.STRING(200), allowNull: false },
    criteria: { type: DataTypes.TEXT, allowNull: false },
    area_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'areas', key: 'id' } },
    lead_auditor_id: userRef(false),
    planned_start: { type: DataTypes.DATEONLY, allowNull: false },
    planned_end: { type: DataTypes.DATEONLY, allowNull: false },
    // The techniques in scope: [{ techniqueId, code, title, revision, definition }]. techniqueId refers to the
    // technique register once it exists; until then the definition travels with the audit.
    scope: { type: DataTypes.JSON, allowNull: false },
    cancel_reason: { type: DataTypes.TEXT, allowNull: true },
    issued_at: { type: DataTypes.DATE(3), allowNull: true },
    closed_at: { type: DataTypes.DATE(3), allowNull: true },
    created_by_id: userRef(false),
    ...machineColumns,
    ...timestamps,
  });
  await queryInterface.addIndex('audits', ['state']);
  await queryInterface.addIndex('audits', ['lead_auditor_id']);

  await queryInterface.createTable('checklist_runs', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    audit_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'audits', key: 'id' } },
    technique_id: { type: DataTypes.INTEGER, allowNull: true },
    technique_code: { type: DataTypes.STRING(64), allowNull: false },
    technique_revision: { type: DataTypes.STRING(32), allowNull: false },
    // The technique exactly as evaluated, so the run can be reproduced after the technique changes.
    technique: { type: DataTypes.JSON, allowNull: false },
    output: { type: DataTypes.JSON, allowNull: false },
    verdict: { type: DataTypes.STRING(32), allowNull: false },
    // The auditor's own notes, keyed by the result's index in output.results.
    notes: { type: DataTypes.JSON, allowNull: false },
    run_by_id: userRef(false),
    run_at: { type: DataTypes.DATE(3), allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await queryInterface.addIndex('checklist_runs', ['audit_id', 'technique_code']);

  await queryInterface.createTable('findings', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    number: { type: DataTypes.STRING(16), allowNull: false, unique: true },
    audit_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'audits', key: 'id' } },
    technique_id: { type: DataTypes.INTEGER, allowNull: true },
    technique_code: { type: DataTypes.STRING(64), allowNull: true },
    checklist_run_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'checklist_runs', key: 'id' } },
    result_index: { type: DataTypes.INTEGER, allowNull: true },
    title: { type: DataTypes.STRING(200), allowNull: false },
    rule: { type: DataTypes.STRING(200), allowNull: false },
    requirement: { type: DataTypes.TEXT, allowNull: false },
    objective_evidence: { type: DataTypes.TEXT, allowNull: false },
    result_values: { type: DataTypes.JSON, allowNull: true },
    class: { type: DataTypes.STRING(16), allowNull: true },
    classification_note: { type: DataTypes.TEXT, allowNull: true },
    containment: { type: DataTypes.TEXT, allowNull: true },
    containment_due_date: { type: DataTypes.DATEONLY, allowNull: true },
    due_date: { type: DataTypes.DATEONLY, allowNull: true },
    effectiveness_note: { type: DataTypes.TEXT, allowNull: true },
    not_effective_reason: { type: DataTypes.TEXT, allowNull: true },
    closure_note: { type: DataTypes.TEXT, allowNull: true },
    withdraw_reason: { type: DataTypes.TEXT, allowNull: true },
    closed_at: { type: DataTypes.DATE(3), allowNull: true },
    author_id: userRef(false),
    area_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'areas', key: 'id' } },
    ...machineColumns,
    ...timestamps,
  });
  await queryInterface.addIndex('findings', ['state']);
  await queryInterface.addIndex('findings', ['audit_id']);
  await queryInterface.addIndex('findings', ['due_date']);

  await queryInterface.createTable('corrective_actions', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    number: { type: DataTypes.STRING(16), allowNull: false, unique: true },
    // One corrective action per finding: a failed effectiveness check reopens it rather than adding another.
    finding_id: { type: DataTypes.INTEGER, allowNull: false, unique: true, references: { model: 'findings', key: 'id' } },
    owner_id: userRef(false),
    due_date: { type: DataTypes.DATEONLY, allowNull: false },
    pending_extension: { type: DataTypes.JSON, allowNull: true },
    method: { type: DataTypes.STRING(32), allowNull: true },
    root_cause: { type: DataTypes.TEXT, allowNull: true },
    plan: { type: DataTypes.JSON, allowNull: false },
    submission_summary: { type: DataTypes.TEXT, allowNull: true },
    return_reason: { type: DataTypes.TEXT, allowNull: true },
    reopen_reason: { type: DataTypes.TEXT, allowNull: true },
    verified_at: { type: DataTypes.DATE(3), allowNull: true },
    created_by_id: userRef(false),
    ...machineColumns,
    ...timestamps,
  });
  await queryInterface.addIndex('corrective_actions', ['state']);
  await queryInterface.addIndex('corrective_actions', ['owner_id']);
  await queryInterface.addIndex('corrective_actions', ['due_date']);

  await queryInterface.createTable('signatures', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    record_type: { type: DataTypes.STRING(32), allowNull: false },
    record_id: { type: DataTypes.INTEGER, allowNull: false },
    event: { type: DataTypes.STRING(64), allowNull: false },
    signer_id: userRef(false),
    printed_name: { type: DataTypes.STRING(120), allowNull: false },
    role: { type: DataTypes.STRING(32), allowNull: false },
    meaning: { type: DataTypes.STRING(120), allowNull: false },
    signed_at: { type: DataTypes.DATE(3), allowNull: false },
    content_hash: { type: DataTypes.CHAR(64), allowNull: false },
  });
  await queryInterface.addIndex('signatures', ['record_type', 'record_id']);
};

export const down: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.dropTable('signatures');
  await queryInterface.dropTable('corrective_actions');
  await queryInterface.dropTable('findings');
  await queryInterface.dropTable('checklist_runs');
  await queryInterface.dropTable('audits');
  await queryInterface.dropTable('record_numbers');
};
