/** Foundation tables: organisations, people, sessions, plans and their revisions, the audit trail. */
import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

const now = { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW };
const ROLES = ['admin', 'reviewer', 'crew_lead', 'apprentice'];
const STATUSES = ['draft', 'submitted', 'returned', 'approved'];

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('organizations', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(200), allowNull: false },
    slug: { type: DataTypes.STRING(80), allowNull: false, unique: true },
    created_at: now,
    updated_at: now,
  });
  await qi.createTable('users', {
    id: { type: DataTypes.STRING(32), primaryKey: true },
    organization_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'organizations', key: 'id' } },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(200), allowNull: false },
    role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
    password_hash: { type: DataTypes.STRING(255), allowNull: true },
    disabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_at: now,
    updated_at: now,
  });
  await qi.addIndex('users', ['organization_id', 'role']);
  await qi.createTable('sessions', {
    id: { type: DataTypes.STRING(255), primaryKey: true },
    user_id: { type: DataTypes.STRING(32), allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    expires_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('sessions', ['user_id']);
  await qi.createTable('plans', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    organization_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'organizations', key: 'id' } },
    title: { type: DataTypes.STRING(200), allowNull: false },
    structure: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
    status: { type: DataTypes.ENUM(...STATUSES), allowNull: false, defaultValue: 'draft' },
    author_id: { type: DataTypes.STRING(32), allowNull: false, references: { model: 'users', key: 'id' } },
    current_revision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
    lock_version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    blockers: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    warnings: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await qi.addIndex('plans', ['organization_id', 'status', 'updated_at']);
  await qi.addIndex('plans', ['organization_id', 'updated_at']);
  await qi.createTable('plan_revisions', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    plan_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'plans', key: 'id' }, onDelete: 'CASCADE' },
    number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    document: { type: DataTypes.TEXT('long'), allowNull: false },
    report: { type: DataTypes.TEXT('long'), allowNull: true },
    created_by: { type: DataTypes.STRING(32), allowNull: false, references: { model: 'users', key: 'id' } },
    created_at: now,
  });
  await qi.addIndex('plan_revisions', ['plan_id', 'number'], { unique: true });
  await qi.createTable('audit_events', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    organization_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'organizations', key: 'id' } },
    actor_id: { type: DataTypes.STRING(32), allowNull: true },
    action: { type: DataTypes.STRING(64), allowNull: false },
    subject_type: { type: DataTypes.STRING(32), allowNull: false },
    subject_id: { type: DataTypes.STRING(64), allowNull: false },
    details: { type: DataTypes.TEXT, allowNull: true },
    at: now,
  });
  await qi.addIndex('audit_events', ['organization_id', 'subject_type', 'subject_id', 'at']);
  await qi.createTable('login_attempts', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false },
    at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('login_attempts', ['email', 'at']);
  await qi.createTable('password_tokens', {
    token_hash: { type: DataTypes.STRING(64), primaryKey: true },
    user_id: { type: DataTypes.STRING(32), allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    purpose: { type: DataTypes.ENUM('invite', 'reset'), allowNull: false },
    expires_at: { type: DataTypes.DATE(3), allowNull: false },
    used_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: now,
  });
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  for (const table of ['password_tokens', 'login_attempts', 'audit_events', 'plan_revisions', 'plans', 'sessions', 'users', 'organizations']) {
    await qi.dropTable(table);
  }
};
