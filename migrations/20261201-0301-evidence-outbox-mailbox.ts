import { DataTypes } from 'sequelize';
import type { Migration } from '../server/db/migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false },
  updated_at: { type: DataTypes.DATE(3), allowNull: false },
};

export const up: Migration = async ({ context: { queryInterface } }) => {
  // Evidence: append-only metadata of files kept under their SHA-256. A row is
  // never deleted; superseding fills the superseded_* columns. stored_at stays
  // null until the file has been moved from the temporary folder to its
  // content-addressed place (after the row commits); the sweep finishes any move
  // a crash interrupted, using temp_name.
  await queryInterface.createTable('evidence_files', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    record_type: { type: DataTypes.STRING(16), allowNull: false },
    record_id: { type: DataTypes.INTEGER, allowNull: false },
    original_name: { type: DataTypes.STRING(255), allowNull: false },
    media_type: { type: DataTypes.STRING(100), allowNull: false },
    size_bytes: { type: DataTypes.BIGINT, allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    storage_key: { type: DataTypes.STRING(255), allowNull: false },
    temp_name: { type: DataTypes.STRING(80), allowNull: true },
    stored_at: { type: DataTypes.DATE(3), allowNull: true },
    uploaded_by_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' } },
    superseded_at: { type: DataTypes.DATE(3), allowNull: true },
    superseded_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } },
    supersede_reason: { type: DataTypes.TEXT, allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await queryInterface.addIndex('evidence_files', ['record_type', 'record_id', 'superseded_at']);
  await queryInterface.addIndex('evidence_files', ['sha256']);

  // The outbox: a message is written in the transaction of the event that causes
  // it and sent after commit by a worker. dedupe_key makes a reminder unique per
  // record, kind and day (NULL for event messages, which the transaction makes unique).
  // status: pending → sent; held (waiting for the recipient's daily digest) → digested.
  await queryInterface.createTable('outbox_messages', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    kind: { type: DataTypes.STRING(48), allowNull: false },
    to_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } },
    to_address: { type: DataTypes.STRING(254), allowNull: false },
    subject: { type: DataTypes.STRING(255), allowNull: false },
    text_body: { type: DataTypes.TEXT('medium'), allowNull: false },
    html_body: { type: DataTypes.TEXT('medium'), allowNull: false },
    record_type: { type: DataTypes.STRING(32), allowNull: true },
    record_id: { type: DataTypes.STRING(64), allowNull: true },
    dedupe_key: { type: DataTypes.STRING(191), allowNull: true, unique: true },
    status: { type: DataTypes.STRING(16), allowNull: false },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    next_attempt_at: { type: DataTypes.DATE(3), allowNull: false },
    locked_until: { type: DataTypes.DATE(3), allowNull: true },
    last_error: { type: DataTypes.TEXT, allowNull: true },
    sent_at: { type: DataTypes.DATE(3), allowNull: true },
    digest_id: { type: DataTypes.INTEGER, allowNull: true },
    ...timestamps,
  });
  await queryInterface.addIndex('outbox_messages', ['status', 'next_attempt_at']);
  await queryInterface.addIndex('outbox_messages', ['to_user_id', 'status']);

  // What the local SMTP fake caught: a table, so it survives restarts and two app servers see the same mailbox.
  await queryInterface.createTable('caught_mails', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    message_id: { type: DataTypes.STRING(255), allowNull: true },
    envelope_from: { type: DataTypes.STRING(254), allowNull: true },
    envelope_to: { type: DataTypes.JSON, allowNull: false },
    from_header: { type: DataTypes.STRING(500), allowNull: true },
    to_header: { type: DataTypes.TEXT, allowNull: true },
    subject: { type: DataTypes.STRING(500), allowNull: true },
    text_body: { type: DataTypes.TEXT('medium'), allowNull: true },
    html_body: { type: DataTypes.TEXT('medium'), allowNull: true },
    size_bytes: { type: DataTypes.INTEGER, allowNull: false },
    received_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await queryInterface.addIndex('caught_mails', ['received_at']);
  await queryInterface.addIndex('caught_mails', ['message_id']);

  // Scheduled jobs: one row per job; an app server claims a due row with
  // SELECT … FOR UPDATE SKIP LOCKED, runs it inside that transaction and moves next_run_at on.
  await queryInterface.createTable('scheduled_jobs', {
    name: { type: DataTypes.STRING(64), primaryKey: true },
    next_run_at: { type: DataTypes.DATE(3), allowNull: false },
    last_run_at: { type: DataTypes.DATE(3), allowNull: true },
    last_error: { type: DataTypes.TEXT, allowNull: true },
    run_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
  });
};

export const down: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.dropTable('scheduled_jobs');
  await queryInterface.dropTable('caught_mails');
  await queryInterface.dropTable('outbox_messages');
  await queryInterface.dropTable('evidence_files');
};
