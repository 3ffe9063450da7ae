/** Review and approval, comments pinned to elements, and mail (outbox and the local catcher's inbox). */
import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

const now = { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW };

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('plan_decisions', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    plan_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'plans', key: 'id' }, onDelete: 'CASCADE' },
    revision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    decision: { type: DataTypes.ENUM('approve', 'return'), allowNull: false },
    reviewer_id: { type: DataTypes.STRING(32), allowNull: false, references: { model: 'users', key: 'id' } },
    comment: { type: DataTypes.TEXT, allowNull: true },
    teaching_note: { type: DataTypes.TEXT, allowNull: true },
    document_hash: { type: DataTypes.STRING(64), allowNull: true },
    report_hash: { type: DataTypes.STRING(64), allowNull: true },
    decided_at: now,
  });
  // One decision per submitted revision: the second of two racing reviewers hits this key.
  await qi.addIndex('plan_decisions', ['plan_id', 'revision'], { unique: true });

  await qi.createTable('plan_comments', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    plan_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'plans', key: 'id' }, onDelete: 'CASCADE' },
    revision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    element_id: { type: DataTypes.STRING(64), allowNull: true },
    author_id: { type: DataTypes.STRING(32), allowNull: false, references: { model: 'users', key: 'id' } },
    body: { type: DataTypes.TEXT, allowNull: false },
    resolved_at: { type: DataTypes.DATE(3), allowNull: true },
    resolved_by: { type: DataTypes.STRING(32), allowNull: true },
    created_at: now,
  });
  await qi.addIndex('plan_comments', ['plan_id', 'resolved_at']);

  await qi.addColumn('plans', 'submitted_at', { type: DataTypes.DATE(3), allowNull: true });
  await qi.addColumn('plans', 'approved_revision', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true });

  await qi.createTable('mail_outbox', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    organization_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    to_address: { type: DataTypes.STRING(254), allowNull: false },
    subject: { type: DataTypes.STRING(300), allowNull: false },
    text_body: { type: DataTypes.TEXT, allowNull: false },
    html_body: { type: DataTypes.TEXT, allowNull: false },
    kind: { type: DataTypes.STRING(40), allowNull: false },
    status: { type: DataTypes.ENUM('pending', 'sent', 'failed'), allowNull: false, defaultValue: 'pending' },
    attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    next_attempt_at: now,
    claim_token: { type: DataTypes.STRING(32), allowNull: true },
    claimed_until: { type: DataTypes.DATE(3), allowNull: true },
    last_error: { type: DataTypes.TEXT, allowNull: true },
    sent_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: now,
  });
  await qi.addIndex('mail_outbox', ['status', 'next_attempt_at']);

  await qi.createTable('caught_mail', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    mail_from: { type: DataTypes.STRING(254), allowNull: false },
    recipients: { type: DataTypes.TEXT, allowNull: false },
    subject: { type: DataTypes.STRING(300), allowNull: false },
    text_body: { type: DataTypes.TEXT('long'), allowNull: false },
    html_body: { type: DataTypes.TEXT('long'), allowNull: true },
    raw: { type: DataTypes.TEXT('long'), allowNull: false },
    received_at: now,
  });
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.dropTable('caught_mail');
  await qi.dropTable('mail_outbox');
  await qi.removeColumn('plans', 'approved_revision');
  await qi.removeColumn('plans', 'submitted_at');
  await qi.dropTable('plan_comments');
  await qi.dropTable('plan_decisions');
};
